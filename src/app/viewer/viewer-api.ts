import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { firstValueFrom, Observable } from 'rxjs';
import { backgroundContext } from '../checks/reload-while';
import { type MemberLabelRow, type MemberLabels, revisionUrl } from '../models/models-api';
import type { SavedViewpointRequest, SavedViewpointView } from './viewer-page-data';

export function viewpointsUrl(projectId: string): string {
  return `/api/projects/${encodeURIComponent(projectId)}/viewpoints`;
}

/** The 3D view's own calls: every member's labels, and saved views. */
@Injectable({ providedIn: 'root' })
export class ViewerApi {
  private readonly http = inject(HttpClient);

  /** Every member's labels (tag, section, storey for tooltips and filters) in one answer. */
  memberLabels(projectId: string, revisionId: string): Promise<MemberLabelRow[]> {
    return firstValueFrom(
      this.http.get<MemberLabels>(`${revisionUrl(projectId, revisionId)}/members/labels`, { context: backgroundContext() }),
    ).then((labels) => labels.members);
  }

  saveViewpoint(projectId: string, request: SavedViewpointRequest): Observable<{ viewpoint: SavedViewpointView }> {
    return this.http.post<{ viewpoint: SavedViewpointView }>(viewpointsUrl(projectId), request);
  }
}
