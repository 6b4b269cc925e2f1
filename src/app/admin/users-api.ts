import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';
import { InvitationRequest } from './admin-user';

/** Site-admin writes to `/api/users`; the page reads the list with httpResource. */
@Injectable({ providedIn: 'root' })
export class UsersApi {
  private readonly http = inject(HttpClient);

  invite(request: InvitationRequest): Observable<unknown> {
    return this.http.post('/api/users/invitations', request);
  }

  /** Deactivating also ends the user's open sessions. */
  setActive(userId: string, active: boolean): Observable<unknown> {
    return this.http.post(`${userUrl(userId)}/${active ? 'reactivate' : 'deactivate'}`, null);
  }

  sendPasswordReset(userId: string): Observable<unknown> {
    return this.http.post(`${userUrl(userId)}/password-reset`, null);
  }
}

function userUrl(userId: string): string {
  return `/api/users/${encodeURIComponent(userId)}`;
}
