import { EventEmitter } from 'node:events';

/** Events one feature raises and another reacts to, so features stay decoupled (checks → findings). */
export interface DomainEventMap {
  'check-run.finished': [{ projectId: string; runId: string }];
}

export type DomainEvents = EventEmitter<DomainEventMap>;

export function createDomainEvents(): DomainEvents {
  return new EventEmitter<DomainEventMap>();
}
