import { createHash } from 'node:crypto';
import { mkdtemp, readFile, readdir, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import pino from 'pino';
import { openTestDataSource, type TestDataSource } from '../../test/fixtures/test-data-source';
import { createTeam, type TestTeam } from '../../test/fixtures/test-accounts';
import { buildingSmartSample } from '../../test/fixtures/ifc/buildingsmart-samples';
import { HEADER_PROBE_BYTES, readStepHeader } from '../ifc/step-header';
import { createJobRunner, type JobRunner } from '../jobs/job-runner';
import { LocalFileStorage } from '../storage/local-file-storage';
import { ModelMember } from './model-member.entity';
import { ModelMemberRecord } from './model-member-record.entity';
import { ModelRevision } from './model-revision.entity';
import type { CheckedIfc } from './model-upload';
import { ModelService } from './model.service';

const COLUMN_SAMPLE = buildingSmartSample('column-extruded-solid.ifc');
const COUNT_UP_JOB = path.resolve(__dirname, '../../test/fixtures/jobs/count-up.job.ts');

async function checkedSample(): Promise<CheckedIfc> {
  const bytes = await readFile(COLUMN_SAMPLE);
  return {
    path: COLUMN_SAMPLE,
    fileName: 'column.ifc',
    sizeBytes: bytes.length,
    sha256: createHash('sha256').update(bytes).digest('hex'),
    header: readStepHeader(bytes.subarray(0, HEADER_PROBE_BYTES), bytes.subarray(-4096), bytes.length),
  };
}

describe('ModelService', () => {
  let db: TestDataSource;
  let root: string;
  let jobs: JobRunner;
  let team: TestTeam;
  const logger = pino({ level: 'silent' });

  beforeAll(async () => {
    db = await openTestDataSource();
    root = await mkdtemp(path.join(os.tmpdir(), 'taulens-models-'));
    jobs = createJobRunner({ maxThreads: 1 });
    team = await createTeam(db.dataSource);
  });
  afterAll(async () => {
    await jobs.close();
    await db.close();
    await rm(root, { recursive: true, force: true });
  });
  afterEach(() => db.dataSource.getRepository(ModelRevision).delete({ projectId: team.project.id }));

  function service(runner: JobRunner = jobs): { models: ModelService; storage: LocalFileStorage; workDir: string } {
    const storage = new LocalFileStorage(path.join(root, 'files'));
    const workDir = path.join(root, 'work');
    return { models: new ModelService({ dataSource: db.dataSource, storage, jobs: runner, logger, workDir }), storage, workDir };
  }

  it('marks the revision failed when its worker crashes, and keeps no members, files or work files', async () => {
    // The real runner and a real worker thread, whose job throws an error that is not a domain error.
    const crashing: JobRunner = { run: (_file, _input, options) => jobs.run(COUNT_UP_JOB, { n: 1, fail: 'crash' }, options), close: async () => undefined };
    const { models, storage, workDir } = service(crashing);
    const { revision, ingested } = await models.accept(team.project.id, team.coordinator.id, await checkedSample(), 'crash test', false);
    expect(revision.status).toBe('queued');
    const final = (await ingested)!;
    expect(final).toMatchObject({ status: 'failed', counts: null, progress: null });
    expect(final.error).toMatch(/^The model reader stopped unexpectedly while starting to read the file\. .*export it again/);
    expect(final.error).not.toContain('worker crashed');
    expect(await db.dataSource.getRepository(ModelMember).countBy({ revisionId: revision.id })).toBe(0);
    expect(await storage.size(`projects/${team.project.id}/models/${revision.id}.ifc`)).toBeNull();
    expect(await readdir(workDir).catch(() => [])).toEqual([]);
    // The sample was only read, never moved.
    await expect(readFile(COLUMN_SAMPLE)).resolves.toBeInstanceOf(Buffer);
  });

  it('on start, fails the revisions a stopped server left unfinished and removes their members and files', async () => {
    const { models, storage } = service();
    const { revision, ingested } = await models.accept(team.project.id, team.coordinator.id, await checkedSample(), '', false);
    expect((await ingested)?.status).toBe('ready');
    // As if the server had stopped while storing this revision's members.
    await db.dataSource.getRepository(ModelRevision).update({ id: revision.id }, { status: 'ingesting', progressPhase: 'store', progressFraction: 0.9 });
    expect(await db.dataSource.getRepository(ModelMemberRecord).countBy({ revisionId: revision.id })).toBe(1);

    await service().models.failInterrupted();
    const after = await models.get(team.project.id, revision.id);
    expect(after).toMatchObject({ status: 'failed', progress: null, error: expect.stringMatching(/server stopped before this model was read completely/) });
    expect(await db.dataSource.getRepository(ModelMember).countBy({ revisionId: revision.id })).toBe(0);
    expect(await db.dataSource.getRepository(ModelMemberRecord).countBy({ revisionId: revision.id })).toBe(0);
    expect(await storage.size(`projects/${team.project.id}/models/${revision.id}.glb`)).toBeNull();
  });

  it('numbers revisions per project and lets a failed file be uploaded again', async () => {
    const crashing: JobRunner = { run: (_file, _input, options) => jobs.run(COUNT_UP_JOB, { n: 1, fail: 'crash' }, options), close: async () => undefined };
    const failed = (await (await service(crashing).models.accept(team.project.id, team.coordinator.id, await checkedSample(), '', false)).ingested)!;
    const retried = await service().models.accept(team.project.id, team.coordinator.id, await checkedSample(), 'again', false);
    expect([failed.number, retried.revision.number]).toEqual([1, 2]);
    expect((await retried.ingested)?.status).toBe('ready');
  });
});
