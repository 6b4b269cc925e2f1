/** How far a job has got: `fraction` from 0 to 1, and optionally what it is doing. */
export interface JobProgress {
  fraction: number;
  message?: string;
}

/** Messages on a job's progress port; 'end' is always last, so no progress arrives after the result. */
export type JobPortMessage = { kind: 'progress'; progress: JobProgress } | { kind: 'end' };

/** A domain error thrown in a worker, sent back as data (classes do not cross threads). */
export interface SerializedDomainError {
  kind: 'domain-error';
  className: string;
  message: string;
  code: string;
  details?: unknown;
}
