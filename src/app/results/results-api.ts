import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';
import type { ColumnMapping, MemberKeyKind } from '../../../server/results/column-mapping';
import type { MatchingSummary } from '../../../server/results/matching-summary';
import type { MatchMethod } from '../../../server/results/member-matching';
import type {
  MappingTemplateView,
  MatchingFilter,
  MatchingItem,
  MatchingPage,
  MemberCandidate,
  ResultSetView,
  ResultsUploadView,
} from '../../../server/results/results-api-types';
import type { RevisionView } from '../models/models-api';

// The API's own types (plain, entity-free server modules), so client and server cannot drift apart.
export type { ColumnMapping, MatchingFilter, MatchingItem, MatchingPage, MatchingSummary, MatchMethod, MemberCandidate, MemberKeyKind };
/** `POST …/results/uploads`: a stored file waiting for its mapping, with the head of the chosen sheet. */
export type ResultsUpload = ResultsUploadView;
export type ResultSet = ResultSetView;
export type MappingTemplate = MappingTemplateView;

/** What the import form and the check dialog read of a model revision (`GET …/models`). */
export type RevisionChoice = Pick<RevisionView, 'id' | 'number' | 'fileName' | 'status' | 'uploadedAt'>;

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
