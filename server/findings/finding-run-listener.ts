/** Findings follow finished check runs: the checks feature raises `check-run.finished`, this applies the run. */
import type { DataSource } from 'typeorm';
import { findRun, listRunMemberResults } from '../checks/check-results.query';
import type { Standard } from '../engine/check';
import type { AppContext } from '../http/app-context';
import type { NoticeSink } from '../notifications/finding-notifier';
import { type SyncOutcome, syncFindingsFromRun } from './finding-sync';

/** The standard as a finding's description names it: a later run by another standard must say so. */
const STANDARD_NAMES: Readonly<Record<Standard, string>> = {
  'aisc360-22-lrfd': 'AISC 360-22 LRFD',
  'aisc360-22-asd': 'AISC 360-22 ASD',
  'en1993-1-1': 'EN 1993-1-1',
};

/** Applies a finished run of the project to its findings; null when the run is not there or not done. */
export async function syncFindingsForRun(dataSource: DataSource, projectId: string, runId: string): Promise<SyncOutcome | null> {
  const run = await findRun(dataSource, projectId, runId);
  if (!run || run.status !== 'done') return null;
  const results = await listRunMemberResults(dataSource, runId);
  return syncFindingsFromRun(dataSource, projectId, { runId, revisionNumber: run.modelRevision.number, standardLabel: STANDARD_NAMES[run.standard] }, results);
}

/**
 * Registers the listener once per app. It runs after the run is stored; a failure is logged and leaves the
 * findings as they were (the sync is one transaction), and a later run catches up.
 */
export function listenForFinishedRuns(ctx: Pick<AppContext, 'dataSource' | 'events' | 'logger'>, notifier: NoticeSink): void {
  ctx.events.on('check-run.finished', ({ projectId, runId }) => {
    syncFindingsForRun(ctx.dataSource, projectId, runId)
      .then((outcome) => {
        if (!outcome) return;
        ctx.logger.info({ runId, created: outcome.created, updated: outcome.updated }, 'findings follow the check run');
        return notifier.deliver(outcome.statusChanges.map((change) => ({ kind: 'status-changed', projectId, actorId: null, ...change })));
      })
      .catch((error: unknown) => ctx.logger.error({ err: error, runId }, 'findings could not follow the check run'));
  });
}
