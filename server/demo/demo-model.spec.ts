import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import pino from 'pino';
import { type TestDataSource, openTestDataSource } from '../../test/fixtures/test-data-source';
import { createJobRunner } from '../jobs/job-runner';
import { ModelMembersService } from '../models/model-members.service';
import { latestReadyRevision, previousRevision } from '../models/model-queries';
import { ModelRevision } from '../models/model-revision.entity';
import { Project } from '../projects/project.entity';
import { LocalFileStorage } from '../storage/local-file-storage';
import type { DemoDeps } from './demo-context';
import { DEMO_STEPS, seedDemo } from './seed';

describe('demo model step', () => {
  let db: TestDataSource;
  let root: string;
  let deps: DemoDeps;
  beforeAll(async () => {
    db = await openTestDataSource();
    root = await mkdtemp(path.join(os.tmpdir(), 'taulens-demo-files-'));
    deps = { dataSource: db.dataSource, storage: new LocalFileStorage(root), jobs: createJobRunner({ maxThreads: 1 }), logger: pino({ level: 'silent' }) };
  });
  afterAll(async () => {
    await deps.jobs.close();
    await db.close();
    await rm(root, { recursive: true, force: true });
  });

  it('reads revisions C and D into the depot project once, with the changed sections between them', async () => {
    // Up to this step; the later ones (results, checks) are other features'.
    const steps = DEMO_STEPS.slice(0, DEMO_STEPS.findIndex((step) => step.name === 'demo model revisions') + 1);
    expect(steps).toHaveLength(3);
    await seedDemo(deps, steps);
    await seedDemo(deps, steps);
    const depot = await db.dataSource.getRepository(Project).findOneByOrFail({ code: 'BRD-17' });
    expect(await db.dataSource.getRepository(ModelRevision).countBy({ projectId: depot.id })).toBe(2);

    const revD = await latestReadyRevision(db.dataSource, depot.id);
    expect(revD).toMatchObject({ number: 2, fileName: 'brindlecote-frame-rev-D.ifc', status: 'ready', counts: { members: 400 } });
    const revC = await previousRevision(db.dataSource, depot.id, revD!.id);
    expect(revC).toMatchObject({ number: 1, fileName: 'brindlecote-frame-rev-C.ifc' });

    const comparison = await new ModelMembersService(db.dataSource).compare(depot.id, revC!.id, revD!.id);
    expect(comparison.added).toEqual([]);
    expect(comparison.removed).toEqual([]);
    const sections = new Set(comparison.changed.flatMap((c) => c.changes.filter((x) => x.field === 'section').map((x) => `${x.from} → ${x.to}`)));
    expect(sections).toEqual(
      new Set(['IPE 300 → IPE 270', 'PG600x250 (d 600, tw 10, flanges 250×16 mm) → PG600x250 (d 600, tw 8, flanges 250×16 mm)']),
    );
  });
});
