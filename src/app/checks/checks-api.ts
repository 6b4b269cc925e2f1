import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';
import type { CheckParameters, CheckParametersInput } from '../../../server/checks/check-parameters';
import type { RunFlag } from '../../../server/checks/check-run-compute';
import type {
  CheckRunStatus,
  CheckRunView,
  MemberSheet,
  RunMemberRow,
  RunMembersPage,
} from '../../../server/checks/checks-api-types';
import type { RunSummaryView } from '../../../server/checks/run-summary';
import type { TraceStep } from '../../../server/engine/trace';
import type { StandardId } from '../projects/project';
import type { MemberCheckStatus } from '../viewer/viewer-member';

// The API's own types (plain, entity-free server modules), so client and server cannot drift apart.
export type { CheckParameters, CheckParametersInput, MemberCheckStatus, MemberSheet, RunFlag, RunMemberRow, RunMembersPage, TraceStep };
export type RunSummary = RunSummaryView;
export type RunStatus = CheckRunStatus;
export type CheckRun = CheckRunView;

export interface StartCheckRequest {
  modelRevisionId: string;
  resultSetId: string;
  standard: StandardId;
  parameters: CheckParametersInput;
  confirmPoorMatch?: boolean;
}

/** Writes to `/api/projects/:projectId/checks`; pages read with httpResource. */
@Injectable({ providedIn: 'root' })
export class ChecksApi {
  private readonly http = inject(HttpClient);

  start(projectId: string, request: StartCheckRequest): Observable<{ run: CheckRun }> {
    return this.http.post<{ run: CheckRun }>(checksUrl(projectId), request);
  }
}

export function checksUrl(projectId: string): string {
  return `/api/projects/${encodeURIComponent(projectId)}/checks`;
}

export function runUrl(projectId: string, runId: string): string {
  return `${checksUrl(projectId)}/${encodeURIComponent(runId)}`;
}

export function sheetUrl(projectId: string, runId: string, globalId: string): string {
  return `${runUrl(projectId, runId)}/members/${encodeURIComponent(globalId)}/sheet`;
}

export const STATUS_NAMES: Readonly<Record<MemberCheckStatus, string>> = {
  pass: 'Pass',
  warning: 'Near the limit',
  fail: 'Fail',
  'not-checked': 'Not checked',
  'not-applicable': 'Not applicable',
};

export const RUN_STATUS_NAMES: Readonly<Record<RunStatus, string>> = {
  queued: 'Waiting',
  running: 'Running',
  done: 'Finished',
  failed: 'Failed',
};

/** Whether the server is still working on a run (the pages poll until it is not). */
export function isActive(run: CheckRun): boolean {
  return run.status === 'queued' || run.status === 'running';
}
