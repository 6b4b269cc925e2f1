import type { MessagePort } from 'node:worker_threads';
import { DomainError } from '../http/errors';
import type { JobPortMessage, JobProgress, SerializedDomainError } from './job-progress';

export type ReportProgress = (progress: JobProgress) => void;

/** What the runner hands each worker task. */
export interface JobTask<I> {
  input: I;
  progressPort: MessagePort;
}

export type JobOutcome<O> = { kind: 'result'; value: O } | SerializedDomainError;

/**
 * Wraps the work of a worker file: `export default defineJob(async (input, report) => …)`.
 * Domain errors (a bad file, say) travel back intact so the route can answer 400 rather than 500.
 */
export function defineJob<I, O>(work: (input: I, report: ReportProgress) => Promise<O> | O) {
  return async ({ input, progressPort }: JobTask<I>): Promise<JobOutcome<O>> => {
    const post = (message: JobPortMessage) => progressPort.postMessage(message);
    try {
      return { kind: 'result', value: await work(input, (progress) => post({ kind: 'progress', progress })) };
    } catch (error) {
      if (!(error instanceof DomainError)) throw error;
      return { kind: 'domain-error', className: error.name, message: error.message, code: error.code, details: error.details };
    } finally {
      post({ kind: 'end' });
      progressPort.close();
    }
  };
}
