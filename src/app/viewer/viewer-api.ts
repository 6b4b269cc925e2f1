import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { firstValueFrom, Observable } from 'rxjs';
import { backgroundContext } from '../checks/reload-while';
import { type MemberPage, type MemberRow, revisionUrl } from '../models/models-api';
import { remainingPages, type SavedViewpointRequest, type SavedViewpointView } from './viewer-page-data';

/** The largest page the members list serves (server/models/member-list-query.ts). */
const MEMBER_PAGE_SIZE = 500;
/** Pages asked for at once: enough to hide the round trips, few enough to leave the server to others. */
const PARALLEL_PAGES = 3;

export function viewpointsUrl(projectId: string): string {
  return `/api/projects/${encodeURIComponent(projectId)}/viewpoints`;
}

/** The 3D view's own calls: every member row of a revision, and saved views. */
@Injectable({ providedIn: 'root' })
export class ViewerApi {
  private readonly http = inject(HttpClient);

  /** All member rows of a revision (tag, section, storey for tooltips and filters), page by page. */
  async allMemberRows(projectId: string, revisionId: string, signal: AbortSignal): Promise<MemberRow[]> {
    const first = await this.memberPage(projectId, revisionId, 0);
    const rows = [...first.members];
    const pages = remainingPages(first.total, MEMBER_PAGE_SIZE);
    for (let start = 0; start < pages.length && !signal.aborted; start += PARALLEL_PAGES) {
      const batch = await Promise.all(pages.slice(start, start + PARALLEL_PAGES).map((page) => this.memberPage(projectId, revisionId, page)));
      for (const page of batch) rows.push(...page.members);
    }
    return rows;
  }

  saveViewpoint(projectId: string, request: SavedViewpointRequest): Observable<{ viewpoint: SavedViewpointView }> {
    return this.http.post<{ viewpoint: SavedViewpointView }>(viewpointsUrl(projectId), request);
  }

  private memberPage(projectId: string, revisionId: string, page: number): Promise<MemberPage> {
    return firstValueFrom(
      this.http.get<MemberPage>(`${revisionUrl(projectId, revisionId)}/members`, {
        params: { page, pageSize: MEMBER_PAGE_SIZE },
        context: backgroundContext(),
      }),
    );
  }
}
