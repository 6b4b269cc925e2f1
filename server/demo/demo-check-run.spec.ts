import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import pino from 'pino';
import { type TestDataSource, openTestDataSource } from '../../test/fixtures/test-data-source';
import { CheckRun } from '../checks/check-run.entity';
import { listRunMemberResults } from '../checks/check-results.query';
import { createJobRunner } from '../jobs/job-runner';
import { latestReadyRevision } from '../models/model-queries';
import { Project } from '../projects/project.entity';
import { ResultMappingTemplate } from '../results/result-mapping-template.entity';
import { ResultSet } from '../results/result-set.entity';
import { LocalFileStorage } from '../storage/local-file-storage';
import type { DemoDeps } from './demo-context';
import { DEMO_STEPS, seedDemo } from './seed';

describe('demo shear results and check run steps', () => {
  let db: TestDataSource;
  let root: string;
  let deps: DemoDeps;
  beforeAll(async () => {
    db = await openTestDataSource();
    root = await mkdtemp(path.join(os.tmpdir(), 'taulens-demo-checks-'));
    deps = { dataSource: db.dataSource, storage: new LocalFileStorage(root), jobs: createJobRunner({ maxThreads: 1 }), logger: pino({ level: 'silent' }) };
  });
  afterAll(async () => {
    await deps.jobs.close();
    await db.close();
    await rm(root, { recursive: true, force: true });
  });

  it('import the forces for the latest revision and leave one finished run with a handful of failures and warnings, once', async () => {
    const steps = DEMO_STEPS.slice(0, DEMO_STEPS.findIndex((step) => step.name === 'demo check run') + 1);
    await seedDemo(deps, steps);
    await seedDemo(deps, steps);
    const depot = await db.dataSource.getRepository(Project).findOneByOrFail({ code: 'BRD-17' });
    const revision = await latestReadyRevision(db.dataSource, depot.id);

    const sets = await db.dataSource.getRepository(ResultSet).findBy({ projectId: depot.id });
    expect(sets).toHaveLength(1);
    expect(sets[0]).toMatchObject({ modelRevisionId: revision!.id, combinations: ['ULS-1', 'ULS-2', 'ULS-3'], memberKeyCount: 402 });
    expect(sets[0].matching).toMatchObject({ matched: 400, unmatchedResults: 2, membersWithoutResults: 0, warning: null });
    expect(await db.dataSource.getRepository(ResultMappingTemplate).countBy({ projectId: depot.id })).toBe(1);

    const runs = await db.dataSource.getRepository(CheckRun).findBy({ projectId: depot.id });
    expect(runs).toHaveLength(1);
    expect(runs[0]).toMatchObject({ status: 'done', standard: 'en1993-1-1', modelRevisionId: revision!.id, createdByName: 'Esme Varga' });
    expect(runs[0].summary).toMatchObject({ members: 400, fail: 5, warnings: 7, notApplicable: 2, notChecked: 0, unmatchedResults: 2 });
    const results = await listRunMemberResults(db.dataSource, runs[0].id);
    expect(new Set(results.filter((r) => r.status === 'fail').map((r) => r.profileName))).toEqual(new Set(['PG600x250']));
    // HE 240 A beams are drawn as an outline without root fillets: measured as drawn, two of them reach the warning band.
    expect(new Set(results.filter((r) => r.status === 'warning').map((r) => r.profileName))).toEqual(new Set(['PG600x250', 'IPE 270', 'HE 240 A']));
  });
});
