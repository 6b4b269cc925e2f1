/**
 * Live state of ingests: every progress report goes to the watchers (SSE) at once and to the revision row at most
 * every WRITE_INTERVAL_MS (and at each new phase), one write at a time, so polling clients see it without the reports
 * flooding the shared database connection.
 */
import { EventEmitter } from 'node:events';
import { type DataSource, In } from 'typeorm';
import type { JobProgress } from '../jobs/job-progress';
import { type IngestPhase, isIngestPhase } from './ingest-phases';
import { ModelRevision } from './model-revision.entity';
import type { RevisionStatus } from './revision-view';

const WRITE_INTERVAL_MS = 400;

/** What a watcher of one revision receives. */
export interface RevisionEvent {
  status: RevisionStatus;
  phase: string | null;
  fraction: number | null;
  error: string | null;
}

export function isFinal(status: RevisionStatus): boolean {
  return status === 'ready' || status === 'failed';
}

export class RevisionEvents {
  private readonly emitter = new EventEmitter().setMaxListeners(0);

  /** Calls `listener` for each event of the revision until the returned function is called. */
  watch(revisionId: string, listener: (event: RevisionEvent) => void): () => void {
    this.emitter.on(revisionId, listener);
    return () => this.emitter.off(revisionId, listener);
  }

  publish(revisionId: string, event: RevisionEvent): void {
    this.emitter.emit(revisionId, event);
  }
}

export class ProgressRecorder {
  /** The phase of the latest report; says where an ingest failed. */
  phase: IngestPhase | null = null;
  private fraction = 0;
  private lastWriteAt = 0;
  private writing: Promise<void> | undefined;
  private pending = false;

  constructor(
    private readonly dataSource: DataSource,
    private readonly revisionId: string,
    private readonly events: RevisionEvents,
  ) {}

  report(progress: JobProgress): void {
    const phase = isIngestPhase(progress.message) ? progress.message : this.phase;
    const newPhase = phase !== this.phase;
    this.phase = phase;
    // The reader's geometry count can restart partway; a bar never moves back.
    this.fraction = Math.max(this.fraction, progress.fraction);
    this.events.publish(this.revisionId, { status: 'ingesting', phase, fraction: this.fraction, error: null });
    if (newPhase || Date.now() - this.lastWriteAt >= WRITE_INTERVAL_MS) this.write();
  }

  /** Waits for the last progress write, so no late write lands after the final status. */
  async flush(): Promise<void> {
    while (this.writing) await this.writing;
  }

  private write(): void {
    if (this.writing) {
      this.pending = true;
      return;
    }
    this.lastWriteAt = Date.now();
    this.writing = this.dataSource
      .getRepository(ModelRevision)
      // Only while still running: a final status is never overwritten by progress.
      .update({ id: this.revisionId, status: In(['queued', 'ingesting']) }, { status: 'ingesting', progressPhase: this.phase, progressFraction: this.fraction })
      // A lost progress write (the worker holding the write lock too long) only delays the bar.
      .then(
        () => undefined,
        () => undefined,
      )
      .finally(() => {
        this.writing = undefined;
        if (this.pending) {
          this.pending = false;
          this.write();
        }
      });
  }
}
