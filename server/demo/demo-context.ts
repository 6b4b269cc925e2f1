/**
 * What the demo seeding steps share: the dependencies, the users and projects the first steps made, and lookups that
 * fail loudly when a step runs before the one it needs. Its own file so the steps need not import seed.ts.
 */
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import type { JobRunner } from '../jobs/job-runner';
import type { Project } from '../projects/project.entity';
import type { FileStorage } from '../storage/file-storage';
import type { User } from '../users/user.entity';

export type DemoUserKey = 'admin' | 'coordinator' | 'engineer' | 'reviewer';
export type DemoProjectKey = 'depot' | 'canteen';

export interface DemoDeps {
  dataSource: DataSource;
  storage: FileStorage;
  jobs: JobRunner;
  logger: Logger;
}

/** What the steps share: the dependencies, and the users and projects the first steps made or found. */
export interface DemoContext extends DemoDeps {
  users: Map<DemoUserKey, User>;
  projects: Map<DemoProjectKey, Project>;
}

/** One idempotent seeding step: it must skip what already exists. */
export interface DemoStep {
  name: string;
  run(ctx: DemoContext): Promise<void>;
}

export function demoUser(ctx: DemoContext, key: DemoUserKey): User {
  const user = ctx.users.get(key);
  if (!user) throw new Error(`demo user "${key}" is missing: the demo users step must run first`);
  return user;
}

export function demoProject(ctx: DemoContext, key: DemoProjectKey): Project {
  const project = ctx.projects.get(key);
  if (!project) throw new Error(`demo project "${key}" is missing: the demo projects step must run first`);
  return project;
}
