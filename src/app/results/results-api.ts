import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';
import type { ColumnMapping, MemberKeyKind } from '../../../server/results/column-mapping';
import type { MatchingSummary } from '../../../server/results/matching-summary';
import type { MatchMethod } from '../../../server/results/member-matching';

export type { ColumnMapping, MatchingSummary, MatchMethod, MemberKeyKind };

// Client mirrors of the results API's views (server/results/result-views.ts, result-matching.service.ts,
// mapping-template.service.ts, server/models/revision-view.ts): those files reach entity classes, which the client
// build must not compile.

/** `POST …/results/uploads`: a stored file waiting for its mapping, with the head of the chosen sheet. */
export interface ResultsUpload {
  id: string;
  fileName: string;
  format: 'csv' | 'xlsx';
  sizeBytes: number;
  sha256: string;
  /** Sheet names of a workbook; null for CSV. */
  sheets: string[] | null;
  /** The sheet previewed; null when a workbook has several and the user must pick one. */
  sheet: string | null;
  delimiter: string | null;
  decimalSeparator: '.' | ',';
  headerRow: number | null;
  headers: string[];
  /** The first rows, as text. */
  rows: string[][];
  guessedMapping: Partial<ColumnMapping>;
  /** Required mapping fields the header did not reveal. */
  missingMapping: string[];
}

export interface ResultSet {
  id: string;
  name: string;
  fileName: string;
  format: 'csv' | 'xlsx';
  sheet: string | null;
  sha256: string;
  rowCount: number;
  /** Distinct member keys. */
  memberKeys: number;
  combinations: string[];
  forceUnit: string;
  mapping: ColumnMapping;
  createdBy: { id: string; name: string } | null;
  createdAt: string;
  modelRevisionId: string;
  matching: MatchingSummary;
}

export type MatchingFilter = 'all' | 'matched' | 'ambiguous' | 'unmatched' | 'members-without-results';

export interface MemberCandidate {
  globalId: string;
  tag: string | null;
  name: string | null;
}

export interface MatchingItem {
  /** Null on a row of the members-without-results list. */
  resultKey: string | null;
  globalId: string | null;
  tag: string | null;
  name: string | null;
  method: MatchMethod | null;
  candidates: MemberCandidate[];
}

export interface MatchingPage {
  summary: MatchingSummary;
  total: number;
  items: MatchingItem[];
}

export interface MappingTemplate {
  id: string;
  name: string;
  mapping: ColumnMapping;
  createdAt: string;
}

/** What the import form and the check dialog read of a model revision (`GET …/models`). */
export interface RevisionChoice {
  id: string;
  number: number;
  fileName: string;
  status: 'queued' | 'ingesting' | 'ready' | 'failed';
  uploadedAt: string;
}

/** One refused row of an import (`422 invalid_rows`): the row number a spreadsheet shows, the file's column. */
export interface RowError {
  row: number;
  column: string | null;
  message: string;
}

export interface ResultsImportRequest {
  uploadId: string;
  sheet?: string;
  mapping: ColumnMapping;
  modelRevisionId: string;
  name: string;
  saveTemplateAs?: string;
  /** Matching by end points: largest distance of an analysis end from the IFC member axis. */
  geometry?: { tolerance_mm: number };
}

/** The details of `422 invalid_rows`: the rows listed, and whether the reader stopped before the end of the file. */
export interface RowErrors {
  errors: RowError[];
  stoppedEarly: boolean;
}



/** Writes to `/api/projects/:projectId/results…`; pages read with httpResource. */
@Injectable({ providedIn: 'root' })
export class ResultsApi {
  private readonly http = inject(HttpClient);

  upload(projectId: string, file: File): Observable<{ upload: ResultsUpload }> {
    const body = new FormData();
    body.append('file', file, file.name);
    return this.http.post<{ upload: ResultsUpload }>(`${resultsUrl(projectId)}/uploads`, body);
  }

  preview(projectId: string, uploadId: string, sheet: string): Observable<{ upload: ResultsUpload }> {
    return this.http.get<{ upload: ResultsUpload }>(`${resultsUrl(projectId)}/uploads/${encodeURIComponent(uploadId)}/preview`, {
      params: { sheet },
    });
  }

  importResults(projectId: string, request: ResultsImportRequest): Observable<{ resultSet: ResultSet }> {
    return this.http.post<{ resultSet: ResultSet }>(resultsUrl(projectId), request);
  }

  setMatch(projectId: string, resultSetId: string, resultKey: string, globalId: string | null): Observable<{ item: MatchingItem; summary: MatchingSummary }> {
    return this.http.put<{ item: MatchingItem; summary: MatchingSummary }>(
      `${resultSetUrl(projectId, resultSetId)}/matches/${encodeURIComponent(resultKey)}`,
      { globalId },
    );
  }
}

export function resultsUrl(projectId: string): string {
  return `/api/projects/${encodeURIComponent(projectId)}/results`;
}

export function resultSetUrl(projectId: string, resultSetId: string): string {
  return `${resultsUrl(projectId)}/${encodeURIComponent(resultSetId)}`;
}

export function mappingTemplatesUrl(projectId: string): string {
  return `/api/projects/${encodeURIComponent(projectId)}/result-mappings`;
}

export function revisionsUrl(projectId: string): string {
  return `/api/projects/${encodeURIComponent(projectId)}/models`;
}

/** Row errors of a refused import (none when the failure is not about rows). */
export function rowErrorsOf(details: unknown): RowErrors {
  const found = details as Partial<RowErrors> | null | undefined;
  return { errors: Array.isArray(found?.errors) ? found.errors : [], stoppedEarly: found?.stoppedEarly === true };
}
