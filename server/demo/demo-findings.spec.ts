import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import pino from 'pino';
import { type TestDataSource, openTestDataSource } from '../../test/fixtures/test-data-source';
import { FindingComment } from '../findings/finding-comment.entity';
import { Finding } from '../findings/finding.entity';
import { createJobRunner } from '../jobs/job-runner';
import { Project } from '../projects/project.entity';
import { LocalFileStorage } from '../storage/local-file-storage';
import type { DemoDeps } from './demo-context';
import { DEMO_STEPS, seedDemo } from './seed';

describe('demo findings step', () => {
  let db: TestDataSource;
  let root: string;
  let deps: DemoDeps;
  beforeAll(async () => {
    db = await openTestDataSource();
    root = await mkdtemp(path.join(os.tmpdir(), 'taulens-demo-findings-'));
    deps = { dataSource: db.dataSource, storage: new LocalFileStorage(root), jobs: createJobRunner({ maxThreads: 1 }), logger: pino({ level: 'silent' }) };
  });
  afterAll(async () => {
    await deps.jobs.close();
    await db.close();
    await rm(root, { recursive: true, force: true });
  });

  it('makes the findings of the demo run with some review work, once', async () => {
    const steps = DEMO_STEPS.slice(0, DEMO_STEPS.findIndex((step) => step.name === 'demo findings') + 1);
    await seedDemo(deps, steps);
    const depot = await db.dataSource.getRepository(Project).findOneByOrFail({ code: 'BRD-17' });
    const first = await db.dataSource.getRepository(Finding).find({ where: { projectId: depot.id }, order: { number: 'ASC' } });
    await seedDemo(deps, steps);
    const again = await db.dataSource.getRepository(Finding).find({ where: { projectId: depot.id }, order: { number: 'ASC' } });

    expect(again.map((finding) => [finding.id, finding.status])).toEqual(first.map((finding) => [finding.id, finding.status]));
    // The demo run's five failures and seven warnings (see demo-check-run.spec.ts), each a finding.
    expect(first.filter((finding) => finding.kind === 'web-shear-fail')).toHaveLength(5);
    expect(first.filter((finding) => finding.kind === 'web-shear-warning')).toHaveLength(7);
    expect(first.filter((finding) => finding.assigneeId !== null)).toHaveLength(2);
    expect(first.filter((finding) => finding.status === 'in-progress')).toHaveLength(1);
    expect(first.filter((finding) => finding.status === 'accepted').map((finding) => finding.justification)).toEqual([expect.stringContaining('engineer of record')]);
    expect(await db.dataSource.getRepository(FindingComment).count()).toBe(1);
  });
});
