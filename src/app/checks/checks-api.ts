import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';
import type { CheckParameters, CheckParametersInput } from '../../../server/checks/check-parameters';
import type { MemberCheck, RunFlag } from '../../../server/checks/check-run-compute';
import type { RunSummaryView } from '../../../server/checks/run-summary';
import type { ISectionInput } from '../../../server/engine/section';
import type { JunctionStress } from '../../../server/engine/shear-stress';
import type { TraceStep } from '../../../server/engine/trace';
import type { MemberRecord } from '../../../server/ifc/model-read-result';
import type { StandardId } from '../projects/project';
import type { MemberCheckStatus } from '../viewer/viewer-member';

export type { CheckParameters, CheckParametersInput, MemberCheckStatus, RunFlag, TraceStep };
export type RunSummary = RunSummaryView;

// Client mirrors of the checks API's views (server/checks/check-run-view.ts, run-members.query.ts, member-sheet.ts):
// those files reach entity classes, which the client build must not compile.

export type RunStatus = 'queued' | 'running' | 'done' | 'failed';

/** An immutable record of one check run: what went in (hashes, parameters, engine version) and what came out. */
export interface CheckRun {
  id: string;
  status: RunStatus;
  progress: { fraction: number } | null;
  error: string | null;
  standard: StandardId;
  parameters: CheckParameters;
  modelRevision: { id: string; number: number; sha256: string; fileName: string };
  resultSet: { id: string; name: string; sha256: string };
  engineVersion: string;
  createdBy: { id: string; name: string };
  createdAt: string;
  finishedAt: string | null;
  /** The engineer ran it although almost nothing in the results matched the model. */
  poorMatchConfirmed: boolean;
  summary: RunSummary | null;
}

export interface RunMemberRow {
  globalId: string;
  tag: string | null;
  name: string | null;
  storey: string | null;
  profileName: string | null;
  grade: string | null;
  governingCombination: string | null;
  VEd_kN: number | null;
  VRd_kN: number | null;
  utilisation: number | null;
  tauMax_MPa: number | null;
  tauAvgWeb_MPa: number | null;
  status: MemberCheckStatus;
  flags: RunFlag[];
}

export interface RunMembersPage {
  total: number;
  rows: RunMemberRow[];
  facets: { storeys: string[]; profiles: string[] };
}

/** `GET …/checks/:runId/members/:globalId/sheet`: everything a calculation sheet shows. */
export interface MemberSheet {
  member: MemberRecord;
  standard: StandardId;
  parameters: CheckParameters;
  status: MemberCheckStatus;
  reason: string | null;
  check: MemberCheck;
  section: { input: ISectionInput; properties: Record<string, number> } | null;
  grade: string | null;
  fy_MPa: number | null;
  gradeRule: string | null;
  stress: {
    shear_kN: number;
    samples: { y_mm: number; tau_MPa: number }[];
    tauMax_MPa: number;
    at_mm: number;
    junctions: { top: JunctionStress; bottom: JunctionStress };
    webAverageClear_MPa: number;
    webAverageFullDepth_MPa: number;
    /** EN 1993-1-1 (6.19): fy/(√3·γM0); absent for AISC. */
    elasticLimit_MPa?: number;
  } | null;
  governing: {
    combination: string;
    station_mm: number | null;
    VEd_kN: number;
    VRd_kN: number;
    utilisation: number;
    status: MemberCheckStatus;
    flags: RunFlag[];
  } | null;
  trace: TraceStep[];
  combinations: { combination: string; station_mm: number | null; VEd_kN: number; utilisation: number; memberKey: string; row: number }[];
  suggestion: { lighterPassing: { name: string; utilisation: number } | null; requiredWebThickness_mm: number | null } | null;
  engineVersion: { run: string; sheet: string };
  cautions: string[];
}

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
