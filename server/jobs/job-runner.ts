import { once } from 'node:events';
import os from 'node:os';
import path from 'node:path';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import * as errors from '../http/errors';
import type { JobPortMessage, JobProgress, SerializedDomainError } from './job-progress';
import type { JobOutcome, JobTask } from './job-worker';

export interface JobRunOptions {
  onProgress?: (progress: JobProgress) => void;
  signal?: AbortSignal;
}

/**
 * Runs CPU-heavy work (IFC ingest, check runs) in worker threads. A worker file default-exports
 * `defineJob(...)`; find its path with `workerFile(__filename, './x.job')`. Other back ends
 * (a Redis-backed queue) can implement the same interface.
 */
export interface JobRunner {
  run<I, O>(workerPath: string, input: I, options?: JobRunOptions): Promise<O>;
  close(): Promise<void>;
}

// Running from TypeScript sources (ts-node, ts-jest) the workers need ts-node too.
const RUNNING_FROM_SOURCE = path.extname(__filename) === '.ts';

/**
 * The path of a worker file next to the caller, with the caller's own extension, so the same
 * line works from sources (.ts) and from the build (.js).
 */
export function workerFile(callerFilename: string, relativePath: string): string {
  return path.resolve(path.dirname(callerFilename), relativePath + path.extname(callerFilename));
}

export function createJobRunner(options: { maxThreads?: number } = {}): JobRunner {
  // Made with the first job, so a server that runs none starts no threads. (Piscina's minThreads: 0
  // would do the same, but then tasks never start under jest.)
  let pool: Piscina | undefined;
  const poolForJobs = () =>
    (pool ??= new Piscina({
      minThreads: 1,
      maxThreads: options.maxThreads ?? Math.max(1, os.availableParallelism() - 1),
      idleTimeout: 30_000,
      ...(RUNNING_FROM_SOURCE
        ? {
            execArgv: ['--require', require.resolve('ts-node/register/transpile-only')],
            // A worker gets its inputs from the task, never from the environment.
            env: { TS_NODE_PROJECT: path.resolve(__dirname, '../../tsconfig.server.json') },
          }
        : {}),
    }));

  return {
    async run<I, O>(workerPath: string, input: I, runOptions: JobRunOptions = {}): Promise<O> {
      const { port1, port2 } = new MessageChannel();
      const ended = once(port1, 'close');
      port1.on('message', (message: JobPortMessage) => {
        if (message.kind === 'progress') runOptions.onProgress?.(message.progress);
        else port1.close();
      });
      try {
        const task: JobTask<I> = { input, progressPort: port2 };
        const outcome = (await poolForJobs().run(task, { filename: workerPath, transferList: [port2], signal: runOptions.signal })) as JobOutcome<O>;
        if (outcome?.kind !== 'result' && outcome?.kind !== 'domain-error') {
          throw new Error(`worker ${workerPath} must default-export defineJob(...)`);
        }
        await ended;
        if (outcome.kind === 'domain-error') throw reviveDomainError(outcome);
        return outcome.value;
      } finally {
        port1.close();
      }
    },
    close: async () => {
      await pool?.close();
    },
  };
}

type DomainErrorClass = new (message: string, options?: errors.DomainErrorOptions) => errors.DomainError;

function reviveDomainError(serialized: SerializedDomainError): errors.DomainError {
  const candidate = (errors as Record<string, unknown>)[serialized.className];
  const ErrorClass = (typeof candidate === 'function' ? candidate : errors.ValidationError) as DomainErrorClass;
  return new ErrorClass(serialized.message, { code: serialized.code, details: serialized.details });
}
