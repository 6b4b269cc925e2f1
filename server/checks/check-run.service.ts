/**
 * Check runs: a run is accepted (revision ready, matching good enough or confirmed, parameters valid), recorded with
 * its inputs, computed in a worker and stored; then `check-run.finished` tells other features. A run that fails
 * leaves no member rows and a message saying why. Nothing changes a run once it is done or failed.
 */
import { randomUUID } from 'node:crypto';
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import { runTransaction } from '../data-source';
import type { DomainEvents } from '../http/domain-events';
import { DomainError, NotFoundError, UnprocessableError } from '../http/errors';
import type { JobRunner } from '../jobs/job-runner';
import { workerFile } from '../jobs/job-runner';
import { Project } from '../projects/project.entity';
import { insertRows } from '../results/bulk-insert';
import { readyRevision } from '../results/ready-revision';
import type { Matching, ResultMatchingService } from '../results/result-matching.service';
import type { FileStorage } from '../storage/file-storage';
import type { Standard } from '../engine/check';
import type { CheckParameters } from './check-parameters';
import { CheckMemberDetail } from './check-member-detail.entity';
import { CheckMemberResult } from './check-member-result.entity';
import { CheckRun } from './check-run.entity';
import type { CheckRunJobInput, CheckRunJobOutput, CheckRunMember } from './check-run.job';
import { toRunView } from './check-run-view';
import type { CheckRunView } from './checks-api-types';
import { engineVersion } from './engine-version';
import { MEMBER_DETAIL_COLUMNS, MEMBER_RESULT_COLUMNS } from './member-result-row';
import { runParameters } from './run-parameters';

const CHECK_WORKER = workerFile(__filename, './check-run.job');
/** Rows per short transaction, so other requests go on between them. */
const ROWS_PER_TRANSACTION = 800;
/** Progress shares: the worker's computation, then storing the rows. */
const COMPUTED_AT = 0.85;

export interface CheckRunDeps {
  dataSource: DataSource;
  storage: FileStorage;
  jobs: JobRunner;
  events: DomainEvents;
  logger: Logger;
  matching: ResultMatchingService;
}

export interface StartRunRequest {
  modelRevisionId: string;
  resultSetId: string;
  standard: Standard;
  parameters: Record<string, unknown>;
  confirmPoorMatch?: boolean;
}

/** A recorded run and its computation, which never rejects (a failure marks the run failed). */
export interface AcceptedRun {
  run: CheckRunView;
  finished: Promise<CheckRunView>;
}

export class CheckRunService {
  /** Fractions of the runs this process is computing. */
  private readonly progress = new Map<string, number>();

  constructor(private readonly deps: CheckRunDeps) {}

  async start(projectId: string, actor: { id: string; name: string }, request: StartRunRequest): Promise<AcceptedRun> {
    const { dataSource } = this.deps;
    const revision = await readyRevision(dataSource, projectId, request.modelRevisionId);
    const resultSet = await this.deps.matching.findResultSet(projectId, request.resultSetId);
    const project = await dataSource.getRepository(Project).findOneByOrFail({ id: projectId });
    const parameters = runParameters(project.settings, request.standard, request.parameters);
    const matching = await this.deps.matching.matchingOf(projectId, resultSet.id, revision.id);
    if (matching.report.likelyOtherModel && !request.confirmPoorMatch) {
      const details = { summary: matching.summary };
      throw new UnprocessableError(`${matching.summary.warning} Confirm to run the check anyway.`, { code: 'poor_match', details });
    }
    const runs = dataSource.getRepository(CheckRun);
    // insert, not save: save opens its own transaction, which would tangle with a queued one on the shared connection.
    const id = randomUUID();
    await runs.insert({
      id,
      projectId,
      status: 'queued',
      standard: parameters.standard,
      parameters,
      engineVersion: engineVersion(),
      modelRevisionId: revision.id,
      modelRevisionNumber: revision.number,
      modelFileName: revision.fileName,
      modelSha256: revision.sha256,
      resultSetId: resultSet.id,
      resultSetName: resultSet.name,
      resultsSha256: resultSet.sha256,
      combinations: [],
      poorMatchConfirmed: matching.report.likelyOtherModel,
      createdById: actor.id,
      createdByName: actor.name,
    });
    const run = await runs.findOneByOrFail({ id });
    this.progress.set(run.id, 0);
    const finished = this.compute(run, resultSet.governingKey, matching, parameters);
    return { run: toRunView(run, 0), finished };
  }

  async list(projectId: string): Promise<CheckRunView[]> {
    const runs = await this.deps.dataSource.getRepository(CheckRun).find({ where: { projectId }, order: { createdAt: 'DESC' } });
    return runs.map((run) => this.view(run));
  }

  async get(projectId: string, runId: string): Promise<CheckRunView> {
    const run = await this.deps.dataSource.getRepository(CheckRun).findOneBy({ id: runId, projectId });
    if (!run) throw new NotFoundError('Check run not found.', { code: 'run_not_found' });
    return this.view(run);
  }

  /** The project's newest finished run, or null. */
  async latest(projectId: string): Promise<CheckRunView | null> {
    const run = await this.deps.dataSource.getRepository(CheckRun).findOne({ where: { projectId, status: 'done' }, order: { createdAt: 'DESC' } });
    return run ? this.view(run) : null;
  }

  /** Runs left queued or running by a server that stopped: they can never finish, so they are marked failed. */
  async failInterruptedRuns(): Promise<void> {
    const runs = this.deps.dataSource.getRepository(CheckRun);
    for (const run of await runs.find({ where: [{ status: 'queued' }, { status: 'running' }] })) {
      if (this.progress.has(run.id)) continue;
      await this.deleteRows(run.id);
      await runs.update({ id: run.id }, { status: 'failed', error: 'The server stopped before this run finished. Start the check again.', finishedAt: new Date() });
    }
  }

  private view(run: CheckRun): CheckRunView {
    return toRunView(run, this.progress.get(run.id));
  }

  private async compute(run: CheckRun, governingKey: string, matching: Matching, parameters: CheckParameters): Promise<CheckRunView> {
    const { dataSource, logger } = this.deps;
    const runs = dataSource.getRepository(CheckRun);
    try {
      await runs.update({ id: run.id }, { status: 'running' });
      const input: CheckRunJobInput = {
        members: matching.members.map(checkRunMember),
        governing: await this.deps.storage.get(governingKey),
        matches: matching.report.matched,
        parameters,
      };
      const output = await this.deps.jobs.run<CheckRunJobInput, CheckRunJobOutput>(CHECK_WORKER, input, {
        onProgress: ({ fraction }) => this.progress.set(run.id, COMPUTED_AT * fraction),
      });
      await this.storeRows(run.id, output);
      const { counts } = matching.report;
      await runs.update(
        { id: run.id },
        {
          status: 'done',
          combinations: output.combinations,
          summary: { ...output.summary, unmatchedResults: counts.unmatched, ambiguousResults: counts.ambiguous },
          finishedAt: new Date(),
        },
      );
    } catch (error) {
      logger.error({ err: error, runId: run.id }, 'check run failed');
      await this.markFailed(run.id, error);
    } finally {
      this.progress.delete(run.id);
    }
    const finished = await runs.findOneBy({ id: run.id }).catch(() => null);
    if (finished?.status === 'done') this.announce(run.projectId, run.id);
    return toRunView(finished ?? { ...run, status: 'failed', error: 'The check could not be recorded.' }, undefined);
  }

  private async storeRows(runId: string, rows: Pick<CheckRunJobOutput, 'results' | 'details'>): Promise<void> {
    const { dataSource } = this.deps;
    const resultTable = dataSource.getMetadata(CheckMemberResult).tableName;
    const detailTable = dataSource.getMetadata(CheckMemberDetail).tableName;
    const count = rows.results.length;
    for (let start = 0; start < count; start += ROWS_PER_TRANSACTION) {
      const end = Math.min(count, start + ROWS_PER_TRANSACTION);
      const withRun = (values: unknown[]) => [runId, ...values];
      await runTransaction(dataSource, async (manager) => {
        await insertRows(manager, resultTable, ['runId', ...MEMBER_RESULT_COLUMNS], rows.results.slice(start, end).map(withRun));
        await insertRows(manager, detailTable, ['runId', ...MEMBER_DETAIL_COLUMNS], rows.details.slice(start, end).map(withRun));
      });
      this.progress.set(runId, COMPUTED_AT + ((1 - COMPUTED_AT) * end) / count);
    }
  }

  private async markFailed(runId: string, error: unknown): Promise<void> {
    const message = error instanceof DomainError ? error.message : 'The check could not be computed. The error has been logged.';
    try {
      await this.deleteRows(runId);
      await this.deps.dataSource.getRepository(CheckRun).update({ id: runId }, { status: 'failed', error: message, finishedAt: new Date() });
    } catch (secondary) {
      this.deps.logger.error({ err: secondary, runId }, 'could not record the failure of a check run');
    }
  }

  private async deleteRows(runId: string): Promise<void> {
    await this.deps.dataSource.getRepository(CheckMemberDetail).delete({ runId });
    await this.deps.dataSource.getRepository(CheckMemberResult).delete({ runId });
  }

  /** A listener's failure is its own: the run stays done. */
  private announce(projectId: string, runId: string): void {
    try {
      this.deps.events.emit('check-run.finished', { projectId, runId });
    } catch (error) {
      this.deps.logger.error({ err: error, runId }, 'a check-run.finished listener failed');
    }
  }
}

function checkRunMember(member: CheckRunMember): CheckRunMember {
  const { globalId, status, reason, profile, material, flags, tag, name, storey } = member;
  return { globalId, status, reason, profile, material, flags, tag, name, storey };
}
