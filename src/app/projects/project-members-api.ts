import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';
import { ProjectRole } from '../core/permissions';

/** Adding by e-mail always sends an invitation, whether or not the address has an account; the invitee accepts. */
export interface MemberAddition {
  invitation: { id: string; email: string; expiresAt: string };
}

/** Writes to `/api/projects/:projectId/members`; the page reads the list with httpResource. */
@Injectable({ providedIn: 'root' })
export class ProjectMembersApi {
  private readonly http = inject(HttpClient);

  add(projectId: string, email: string, role: ProjectRole): Observable<MemberAddition> {
    return this.http.post<MemberAddition>(membersUrl(projectId), { email, role });
  }

  changeRole(projectId: string, userId: string, role: ProjectRole): Observable<unknown> {
    return this.http.put(`${membersUrl(projectId)}/${encodeURIComponent(userId)}`, { role });
  }

  remove(projectId: string, userId: string): Observable<unknown> {
    return this.http.delete(`${membersUrl(projectId)}/${encodeURIComponent(userId)}`);
  }
}

export function membersUrl(projectId: string): string {
  return `/api/projects/${encodeURIComponent(projectId)}/members`;
}
