import 'reflect-metadata';
import path from 'node:path';
import { DataSource, type EntityManager } from 'typeorm';

/**
 * The one TypeORM DataSource. Entities (`<feature>/<name>.entity.ts`) and migrations
 * (`migrations/<timestamp>-<verb-noun>.ts`) are found by globs that match both the TypeScript
 * sources (ts-node, ts-jest) and the compiled .js files, so new features need no edit here.
 */
export function createDataSource(options: { databasePath: string }): DataSource {
  return new DataSource({
    type: 'sqlite',
    database: options.databasePath,
    entities: [path.join(__dirname, '**', '*.entity.{ts,js}')],
    migrations: [path.join(__dirname, 'migrations', '*-*.{ts,js}')],
    migrationsRun: true,
    migrationsTransactionMode: 'each',
    synchronize: false,
    // WAL lets readers carry on while an ingest or check run writes; the timeout rides out short locks.
    enableWAL: true,
    busyTimeout: 5000,
  });
}

const transactionQueues = new WeakMap<DataSource, Promise<unknown>>();

/**
 * Runs `work` in a transaction, one at a time per DataSource. The sqlite driver shares a single
 * connection, so two overlapping `dataSource.transaction()` calls would nest into each other's
 * transaction; queueing keeps each one whole. Keep the work short: plain queries from other
 * requests still run on the same connection meanwhile.
 */
export function runTransaction<T>(dataSource: DataSource, work: (manager: EntityManager) => Promise<T>): Promise<T> {
  const previous = transactionQueues.get(dataSource) ?? Promise.resolve();
  const run = previous.then(() => dataSource.transaction(work));
  transactionQueues.set(
    dataSource,
    run.catch(() => undefined),
  );
  return run;
}
