import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, Observable } from 'rxjs';
import { Project, ProjectChanges, ProjectDraft } from './project';

/** Writes to `/api/projects`; screens read with httpResource. */
@Injectable({ providedIn: 'root' })
export class ProjectsApi {
  private readonly http = inject(HttpClient);

  create(draft: ProjectDraft): Observable<Project> {
    return this.http.post<{ project: Project }>('/api/projects', draft).pipe(map((body) => body.project));
  }

  update(projectId: string, changes: ProjectChanges): Observable<Project> {
    return this.http
      .patch<{ project: Project }>(`/api/projects/${encodeURIComponent(projectId)}`, changes)
      .pipe(map((body) => body.project));
  }

  setArchived(projectId: string, archived: boolean): Observable<unknown> {
    const verb = archived ? 'archive' : 'unarchive';
    return this.http.post(`/api/projects/${encodeURIComponent(projectId)}/${verb}`, null);
  }
}
