import { HttpClient, HttpEventType } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { filter, map, Observable } from 'rxjs';
import type { SectionDimensions, SectionFamily } from '../../../server/engine/section-family';
import type { MemberFlag, MemberProfile, MemberRecord, MemberStatus, ProfileSource, ProfileStation } from '../../../server/ifc/model-read-result';
import type { MemberFacets, MemberLabelRow, MemberLabels, MemberPage, MemberRow, SkippedReason } from '../../../server/models/member-row';
import type { ChangedField, ChangedMember, FieldChange, RevisionComparison } from '../../../server/models/revision-compare';
import type { RevisionCounts, RevisionStatus, RevisionView } from '../../../server/models/revision-view';

// The API's own types (plain, entity-free server modules), so client and server cannot drift apart.
export type {
  ChangedField,
  ChangedMember,
  FieldChange,
  MemberFacets,
  MemberFlag,
  MemberLabelRow,
  MemberLabels,
  MemberProfile,
  MemberRecord,
  MemberRow,
  MemberPage,
  MemberStatus,
  ProfileSource,
  ProfileStation,
  RevisionCounts,
  RevisionStatus,
  RevisionView,
  SectionDimensions,
  SectionFamily,
  SkippedReason,
};

export interface Comparison extends RevisionComparison {
  from: RevisionView;
  to: RevisionView;
}

export interface CatalogueSection {
  name: string;
  series: string;
  depth_mm: number;
  width_mm: number;
  webThickness_mm: number;
  flangeThickness_mm: number;
  rootRadius_mm: number;
}

/** An upload in flight: how much was sent (null when the browser cannot tell), then the revision it created. */
export type UploadEvent = { kind: 'sending'; fraction: number | null } | { kind: 'accepted'; revision: RevisionView };

export function modelsUrl(projectId: string): string {
  return `/api/projects/${encodeURIComponent(projectId)}/models`;
}

export function revisionUrl(projectId: string, revisionId: string): string {
  return `${modelsUrl(projectId)}/${encodeURIComponent(revisionId)}`;
}

export function catalogueUrl(projectId: string): string {
  return `/api/projects/${encodeURIComponent(projectId)}/catalogue`;
}

/** Uploads to the Models API; pages read with httpResource. */
@Injectable({ providedIn: 'root' })
export class ModelsApi {
  private readonly http = inject(HttpClient);

  /** Sends the file as multipart; the events report the bytes sent, then the queued revision. */
  uploadRevision(projectId: string, file: File, note: string): Observable<UploadEvent> {
    const body = new FormData();
    body.append('note', note);
    body.append('file', file, file.name);
    return this.http.post<{ revision: RevisionView }>(modelsUrl(projectId), body, { reportProgress: true, observe: 'events' }).pipe(
      filter((event) => event.type === HttpEventType.UploadProgress || event.type === HttpEventType.Response),
      map((event): UploadEvent => {
        if (event.type === HttpEventType.UploadProgress) return { kind: 'sending', fraction: event.total ? event.loaded / event.total : null };
        return { kind: 'accepted', revision: (event.body as { revision: RevisionView }).revision };
      }),
    );
  }

  uploadCatalogue(projectId: string, file: File): Observable<{ sections: number }> {
    const body = new FormData();
    body.append('file', file, file.name);
    return this.http.post<{ sections: number }>(catalogueUrl(projectId), body);
  }
}
