/** A check run as the API shows it: the record of its inputs, its state and its outcome. */
import type { Standard } from '../engine/check';
import type { CheckParameters } from './check-parameters';
import type { CheckRun, CheckRunStatus } from './check-run.entity';
import { type RunSummaryView, toSummaryView } from './run-summary';

export interface CheckRunView {
  id: string;
  status: CheckRunStatus;
  /** While queued or running. */
  progress: { fraction: number } | null;
  error: string | null;
  standard: Standard;
  parameters: CheckParameters;
  modelRevision: { id: string; number: number; sha256: string; fileName: string };
  resultSet: { id: string; name: string; sha256: string };
  engineVersion: string;
  createdBy: { id: string; name: string };
  createdAt: string;
  finishedAt: string | null;
  poorMatchConfirmed: boolean;
  summary: RunSummaryView | null;
}

export function toRunView(run: CheckRun, fraction: number | undefined): CheckRunView {
  const active = run.status === 'queued' || run.status === 'running';
  return {
    id: run.id,
    status: run.status,
    progress: active ? { fraction: fraction ?? 0 } : null,
    error: run.error,
    standard: run.standard,
    parameters: run.parameters,
    modelRevision: { id: run.modelRevisionId, number: run.modelRevisionNumber, sha256: run.modelSha256, fileName: run.modelFileName },
    resultSet: { id: run.resultSetId, name: run.resultSetName, sha256: run.resultsSha256 },
    engineVersion: run.engineVersion,
    createdBy: { id: run.createdById, name: run.createdByName },
    createdAt: run.createdAt.toISOString(),
    finishedAt: run.finishedAt?.toISOString() ?? null,
    poorMatchConfirmed: run.poorMatchConfirmed,
    summary: run.summary ? toSummaryView(run.summary) : null,
  };
}
