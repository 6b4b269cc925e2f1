import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pino from 'pino';
import { type TestDataSource, openTestDataSource } from '../../test/fixtures/test-data-source';
import { createJobRunner } from '../jobs/job-runner';
import { Project } from '../projects/project.entity';
import { ProjectMember } from '../projects/project-member.entity';
import { LocalFileStorage } from '../storage/local-file-storage';
import { verifyPassword } from '../users/password';
import { User } from '../users/user.entity';
import { type DemoDeps, demoProject } from './demo-context';
import { DEMO_PASSWORD, DEMO_STEPS, seedDemo } from './seed';

describe('seedDemo', () => {
  let db: TestDataSource;
  let deps: DemoDeps;
  let filesDir: string;
  beforeAll(async () => {
    db = await openTestDataSource();
    filesDir = mkdtempSync(path.join(os.tmpdir(), 'taulens-seed-'));
    deps = { dataSource: db.dataSource, storage: new LocalFileStorage(filesDir), jobs: createJobRunner({ maxThreads: 1 }), logger: pino({ level: 'silent' }) };
  });
  afterAll(async () => {
    await deps.jobs.close();
    await db.close();
    rmSync(filesDir, { recursive: true, force: true });
  });

  it('creates one account per role and two projects once, and nothing more on later runs', async () => {
    const first = await seedDemo(deps);
    expect(first.createdAccounts).toBe(true);
    expect(first.accounts.map((a) => a.email)).toEqual([
      'admin@taulens.test',
      'coordinator@taulens.test',
      'engineer@taulens.test',
      'reviewer@taulens.test',
    ]);
    const second = await seedDemo(deps);
    expect(second.createdAccounts).toBe(false);

    expect(await db.dataSource.getRepository(User).count()).toBe(4);
    expect(await db.dataSource.getRepository(Project).count()).toBe(2);
    expect(await db.dataSource.getRepository(ProjectMember).count()).toBe(5);
    const admin = await db.dataSource.getRepository(User).findOneByOrFail({ email: 'admin@taulens.test' });
    expect(admin.isAdmin).toBe(true);
    await expect(verifyPassword(DEMO_PASSWORD, admin.passwordHash)).resolves.toBe(true);
  });

  it('hands later steps the demo users and projects', async () => {
    const seen: string[] = [];
    await seedDemo(deps, [...DEMO_STEPS, { name: 'probe', run: async (ctx) => void seen.push(demoProject(ctx, 'depot').code) }]);
    expect(seen).toEqual(['BRD-17']);
  });
});
