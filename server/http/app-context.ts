import type { Request } from 'express';
import type { Store } from 'express-session';
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import type { Config } from '../config';
import type { JobRunner } from '../jobs/job-runner';
import type { Mailer } from '../mail/mailer';
import type { FileStorage } from '../storage/file-storage';
import type { DomainEvents } from './domain-events';

/** The long-lived pieces every router and service is built from; main.ts creates them once. */
export interface AppContext {
  /** With sessionSecret resolved. */
  config: Config & { sessionSecret: string };
  dataSource: DataSource;
  logger: Logger;
  mailer: Mailer;
  storage: FileStorage;
  jobs: JobRunner;
  sessionStore: Store;
  /** Raised by one feature, handled by another (e.g. a finished check run updates findings). */
  events: DomainEvents;
}

/** The context of the app serving this request (set by createApp). */
export function contextOf(req: Request): AppContext {
  return req.app.locals.context as AppContext;
}
