import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';
import { BcfImportSummary, Finding, FindingComment, FindingPatch, FindingStatus, NewFinding, NotificationSettings } from './finding';

export function findingsUrl(projectId: string, rest = ''): string {
  return `/api/projects/${encodeURIComponent(projectId)}/findings${rest}`;
}

export function findingUrl(projectId: string, findingId: string, rest = ''): string {
  return findingsUrl(projectId, `/${encodeURIComponent(findingId)}${rest}`);
}

export const NOTIFICATION_SETTINGS_URL = '/api/notifications/preferences';

export type ExportFormat = 'bcf-2.1' | 'bcf-3.0' | 'csv';

/** Where the browser downloads an export from; `filters` as the list sends them, so the file holds what is shown. */
export function exportUrl(projectId: string, format: ExportFormat, filters: Record<string, string>): string {
  const params = new URLSearchParams(filters);
  if (format !== 'csv') params.set('version', format === 'bcf-2.1' ? '2.1' : '3.0');
  const query = params.toString();
  return findingsUrl(projectId, `/${format === 'csv' ? 'export.csv' : 'export.bcfzip'}${query ? `?${query}` : ''}`);
}

/** Writes to the findings API; pages read with httpResource. */
@Injectable({ providedIn: 'root' })
export class FindingsApi {
  private readonly http = inject(HttpClient);

  create(projectId: string, finding: NewFinding): Observable<{ finding: Finding }> {
    return this.http.post<{ finding: Finding }>(findingsUrl(projectId), finding);
  }

  update(projectId: string, findingId: string, patch: FindingPatch): Observable<{ finding: Finding }> {
    return this.http.patch<{ finding: Finding }>(findingUrl(projectId, findingId), patch);
  }

  /** `reasons`: the justification an acceptance needs, the note of what was done that resolving a failure needs. */
  moveTo(projectId: string, findingId: string, to: FindingStatus, reasons: { justification?: string; note?: string } = {}): Observable<{ finding: Finding }> {
    return this.http.post<{ finding: Finding }>(findingUrl(projectId, findingId, '/transitions'), { to, ...reasons });
  }

  comment(projectId: string, findingId: string, text: string): Observable<{ comment: FindingComment }> {
    return this.http.post<{ comment: FindingComment }>(findingUrl(projectId, findingId, '/comments'), { text });
  }

  assignAll(projectId: string, findingIds: string[], assigneeId: string | null): Observable<{ findings: Finding[] }> {
    return this.http.post<{ findings: Finding[] }>(findingsUrl(projectId, '/bulk-assign'), { findingIds, assigneeId });
  }

  importBcf(projectId: string, file: File): Observable<{ import: BcfImportSummary }> {
    const body = new FormData();
    body.append('file', file, file.name);
    return this.http.post<{ import: BcfImportSummary }>(findingsUrl(projectId, '/import'), body);
  }

  saveNotificationSettings(settings: NotificationSettings): Observable<NotificationSettings> {
    return this.http.put<NotificationSettings>(NOTIFICATION_SETTINGS_URL, settings);
  }
}
