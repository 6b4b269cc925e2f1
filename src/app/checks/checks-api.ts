import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';
import type { CheckParameters, CheckParametersInput } from '../../../server/checks/check-parameters';
import type { ISectionInput } from '../../../server/engine/section';
import type { TraceStep } from '../../../server/engine/trace';
import type { MemberRecord } from '../../../server/ifc/model-read-result';
import type { StandardId } from '../projects/project';
import type { MemberCheckStatus } from '../viewer/viewer-member';

export type { CheckParameters, CheckParametersInput, MemberCheckStatus, TraceStep };

export type RunStatus = 'queued' | 'running' | 'done' | 'failed';

export interface RunSummary {
  pass: number;
  warning: number;
  fail: number;
  notChecked: number;
  notApplicable: number;
  maxUtilisation: number | null;
  unmatchedResults: number;
}

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
  flags: string[];
}

export interface RunMembersPage {
  total: number;
  rows: RunMemberRow[];
  facets: { storeys: string[]; profiles: string[] };
}

export interface StressSample {
  y_mm: number;
  tau_MPa: number;
}

/** `GET …/checks/:runId/members/:globalId/sheet`: everything a calculation sheet shows. */
export interface MemberSheet {
  member: MemberRecord;
  standard: StandardId;
  parameters: CheckParameters;
  section: { input: ISectionInput; properties: Record<string, unknown> };
  fy_MPa: number;
  gradeRule: string;
  stress: { samples: StressSample[]; tauMax_MPa: number; at_mm: number; junctions: unknown };
  governing: { combination: string; VEd_kN: number; VRd_kN: number; utilisation: number; status: MemberCheckStatus; flags: string[] } | null;
  trace: TraceStep[];
  combinations: { combination: string; station_mm: number | null; VEd_kN: number; utilisation: number }[];
  suggestion: { lighterPassing: { name: string; utilisation: number } | null; requiredWebThickness_mm: number | null };
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
