import 'reflect-metadata';
import { mkdir } from 'node:fs/promises';
import { type Server, createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import type { Express } from 'express';
import pino from 'pino';
import type { DataSource } from 'typeorm';
import { createApp } from './app';
import { openSessionStore } from './auth/session';
import { resolveSessionSecret } from './auth/session-secret';
import { type Config, ConfigError, loadConfig } from './config';
import { createDataSource } from './data-source';
import { type DemoSeedResult, seedDemo } from './demo/seed';
import type { AppContext } from './http/app-context';
import { createDomainEvents } from './http/domain-events';
import { createJobRunner } from './jobs/job-runner';
import { createMailer } from './mail/mailer';
import { startFakeSmtpServer } from './outbox/fake-smtp-server';
import { REPORT_CAUTIONS_TEXT } from './reports/report-cautions';
import { sweepStaleUploads } from './results/stale-uploads';
import { LocalFileStorage } from './storage/local-file-storage';

export interface RunningServer {
  url: string;
  port: number;
  dataSource: DataSource;
  app: Express;
  context: AppContext;
  /** Set when SEED_DEMO was on. */
  demo?: DemoSeedResult;
  /** Stops accepting requests, then closes everything start-up opened. */
  close(): Promise<void>;
}

/**
 * config → data dir → DataSource (migrations run) → fake SMTP → app → listen. Seeds the demo
 * when config.seedDemo. Everything opened is closed again by `close()`, also when start-up fails.
 */
export async function startServer(overrides: Partial<Config> = {}): Promise<RunningServer> {
  const base = loadConfig(process.env, overrides);
  await mkdir(base.dataDir, { recursive: true });
  const config = { ...base, sessionSecret: await resolveSessionSecret({ configured: base.sessionSecret, dataDir: base.dataDir }) };
  const logger = pino({ level: config.logLevel });
  const closers: (() => Promise<void> | void)[] = [];
  const closeAll = async () => {
    for (const close of closers.reverse()) await close();
  };

  try {
    await mkdir(path.dirname(config.databasePath), { recursive: true });
    const dataSource = createDataSource({ databasePath: config.databasePath });
    await dataSource.initialize();
    closers.push(() => dataSource.destroy());

    const fakeSmtp = config.fakeSmtp
      ? await startFakeSmtpServer({ dataSource, port: config.fakeSmtpPort, logger })
      : undefined;
    if (fakeSmtp) closers.push(() => fakeSmtp.close());
    const mailer = createMailer(fakeSmtp ? { fakeServerPort: fakeSmtp.port, from: config.smtp.from } : config.smtp);
    closers.push(() => mailer.close());

    const sessions = await openSessionStore(config.dataDir);
    closers.push(() => sessions.close());
    const jobs = createJobRunner();
    closers.push(() => jobs.close());
    const storage = new LocalFileStorage(path.join(config.dataDir, 'files'));

    const context: AppContext = {
      config,
      dataSource,
      logger,
      mailer,
      storage,
      jobs,
      sessionStore: sessions.store,
      events: createDomainEvents(),
    };
    const demo = config.seedDemo ? await seedDemo({ dataSource, storage, jobs, logger }) : undefined;
    closers.push(sweepStaleUploads({ dataSource, storage, logger }, config.resultsUploadKeepHours));
    const app = createApp(context);
    const server = await listen(app, config.port, config.host);
    closers.push(() => closeServer(server));

    const { port } = server.address() as AddressInfo;
    const host = config.host === '0.0.0.0' || config.host === '::' ? 'localhost' : config.host;
    return { url: `http://${host}:${port}`, port, dataSource, app, context, demo, close: closeAll };
  } catch (error) {
    await closeAll();
    throw error;
  }
}

function listen(app: Express, port: number, host: string): Promise<Server> {
  return new Promise((resolve, reject) => {
    const server = createServer(app);
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      resolve(server);
    });
  });
}

function closeServer(server: Server): Promise<void> {
  return new Promise((resolve, reject) => {
    server.close((error) => (error ? reject(error) : resolve()));
    // Browsers keep idle connections open; without this close() would wait for them.
    server.closeIdleConnections();
  });
}

/** `node dist/server/server/main.js`: start, say where, and shut down cleanly on signals. */
async function runFromCommandLine(): Promise<void> {
  let running: RunningServer;
  try {
    running = await startServer();
  } catch (error) {
    process.stderr.write(`${error instanceof ConfigError ? error.message : `Taulens could not start: ${String(error)}`}\n`);
    process.exit(1);
  }
  const { logger, config } = running.context;
  printBanner(running, config.publicUrl);

  let stopping = false;
  const stop = async (reason: string, exitCode: number) => {
    if (stopping) return;
    stopping = true;
    logger.info({ reason }, 'shutting down');
    try {
      await running.close();
    } finally {
      process.exit(exitCode);
    }
  };
  process.on('SIGINT', () => void stop('SIGINT', 0));
  process.on('SIGTERM', () => void stop('SIGTERM', 0));
  process.on('unhandledRejection', (reason) => {
    logger.fatal({ err: reason }, 'unhandled promise rejection');
    void stop('unhandledRejection', 1);
  });
}

function printBanner(running: RunningServer, publicUrl: string): void {
  const lines = [`Taulens is running at ${running.url}` + (publicUrl !== running.url ? ` (public address ${publicUrl})` : '')];
  if (running.demo?.createdAccounts) {
    lines.push('', `Demo accounts created (password for all: ${running.demo.password}):`);
    for (const account of running.demo.accounts) lines.push(`  ${account.role.padEnd(12)} ${account.email}`);
  }
  if (running.context.config.fakeSmtp) lines.push('', 'E-mail goes to the built-in fake SMTP server; read it on the Outbox page.');
  lines.push('', `Caution: ${REPORT_CAUTIONS_TEXT}`, '');
  process.stdout.write(`${lines.join('\n')}\n`);
}

if (require.main === module) void runFromCommandLine();
