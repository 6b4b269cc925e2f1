/** A check run as the API shows it: the record of its inputs, its state and its outcome. */
import type { CheckRun } from './check-run.entity';
import type { CheckRunView } from './checks-api-types';
import { toSummaryView } from './run-summary';

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
