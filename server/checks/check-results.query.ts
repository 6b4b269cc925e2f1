/**
 * Check results for other features (findings, reports) and the results routes: a run, its members' outcomes and a
 * member's calculation sheet. Plain data out, never entities.
 */
import type { DataSource } from 'typeorm';
import { ConflictError, NotFoundError } from '../http/errors';
import type { AppContext } from '../http/app-context';
import type { MemberRecord } from '../ifc/model-read-result';
import { revisionMembers } from '../results/ready-revision';
import { CheckMemberDetail } from './check-member-detail.entity';
import { CheckMemberResult } from './check-member-result.entity';
import { CheckRun } from './check-run.entity';
import { toRunView } from './check-run-view';
import type { CheckRunView, MemberSheet, RunMemberRow } from './checks-api-types';
import { engineVersion } from './engine-version';
import { memberCheckOf } from './member-result-row';
import { buildMemberSheet } from './member-sheet';

export type RunMemberResult = Pick<
  RunMemberRow,
  'globalId' | 'tag' | 'name' | 'storey' | 'profileName' | 'status' | 'utilisation' | 'VEd_kN' | 'VRd_kN' | 'governingCombination' | 'flags'
>;

/** The run of that project, whatever its status, or null. */
export async function findRun(dataSource: DataSource, projectId: string, runId: string): Promise<CheckRunView | null> {
  const run = await dataSource.getRepository(CheckRun).findOneBy({ id: runId, projectId });
  return run ? toRunView(run, undefined) : null;
}

/** A finished run of the project: 404 when there is none, 409 `run_not_finished` while it is queued or running or failed. */
export async function finishedRun(dataSource: DataSource, projectId: string, runId: string): Promise<CheckRun> {
  const run = await dataSource.getRepository(CheckRun).findOneBy({ id: runId, projectId });
  if (!run) throw new NotFoundError('Check run not found.', { code: 'run_not_found' });
  if (run.status !== 'done') {
    const why = run.status === 'failed' ? `failed: ${run.error ?? 'no reason was recorded'}` : 'has not finished yet';
    throw new ConflictError(`This check run ${why}`, { code: 'run_not_finished', details: { status: run.status } });
  }
  return run;
}

/** Every member's outcome in a run, in model order (empty unless the run is done). */
export async function listRunMemberResults(dataSource: DataSource, runId: string): Promise<RunMemberResult[]> {
  return dataSource.getRepository(CheckMemberResult).find({
    where: { runId },
    select: {
      globalId: true,
      tag: true,
      name: true,
      storey: true,
      profileName: true,
      status: true,
      utilisation: true,
      VEd_kN: true,
      VRd_kN: true,
      governingCombination: true,
      governingAxis: true,
      governingCheck: true,
      flags: true,
    },
    order: { ordinal: 'ASC' },
  });
}

/** The calculation sheet of a member in a finished run of the project. */
export async function memberSheet(ctx: Pick<AppContext, 'dataSource'>, projectId: string, runId: string, globalId: string): Promise<MemberSheet> {
  const { dataSource } = ctx;
  const run = await finishedRun(dataSource, projectId, runId);
  const row = await dataSource.getRepository(CheckMemberResult).findOne({ where: { runId, globalId }, select: { ordinal: true }, order: { ordinal: 'ASC' } });
  if (!row) throw new NotFoundError(`This check run has no member with GlobalId ${globalId}.`, { code: 'member_not_found' });
  const detail = await dataSource.getRepository(CheckMemberDetail).findOneByOrFail({ runId, ordinal: row.ordinal });
  const member = await memberRecord(dataSource, run.modelRevisionId, globalId);
  return buildMemberSheet({
    member,
    check: memberCheckOf(detail, run.combinations),
    standard: run.standard,
    parameters: run.parameters,
    runEngineVersion: run.engineVersion,
    currentEngineVersion: engineVersion(),
  });
}

/** From the revision's cached members: a sheet is usually followed by others of the same run. */
async function memberRecord(dataSource: DataSource, revisionId: string, globalId: string): Promise<MemberRecord> {
  const member = (await revisionMembers(dataSource, revisionId)).find((candidate) => candidate.globalId === globalId);
  if (!member) throw new NotFoundError('The member is no longer in the model revision this run checked.', { code: 'member_not_found' });
  return member;
}
