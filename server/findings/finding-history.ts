/** Rows of a finding's history, written beside every change in the same transaction. */
import type { EntityManager } from 'typeorm';
import { percentRoundedUp } from '../reports/report-format';
import { FindingChange } from './finding-change.entity';
import type { ChangeSource } from './finding-fields';

export interface ChangeActor {
  /** Null for the system. */
  id: string | null;
  source: ChangeSource;
}

export const SYSTEM_CHANGE: ChangeActor = { id: null, source: 'system' };

export interface ChangeEntry {
  findingId: string;
  field: string;
  from: string | null;
  to: string | null;
}

/** Utilisation as the history shows it: the percentage rounded up, as in reports. */
export function utilisationText(utilisation: number | null): string | null {
  return utilisation === null ? null : `${percentRoundedUp(utilisation)} %`;
}

export async function recordChanges(manager: EntityManager, actor: ChangeActor, entries: readonly ChangeEntry[], at = new Date()): Promise<void> {
  // A few hundred rows per statement keeps far below SQLite's bound-variable limit.
  const CHUNK = 200;
  for (let start = 0; start < entries.length; start += CHUNK) {
    const rows = entries.slice(start, start + CHUNK).map((entry) => ({
      findingId: entry.findingId,
      actorId: actor.id,
      source: actor.source,
      field: entry.field,
      fromValue: entry.from,
      toValue: entry.to,
      at,
    }));
    await manager.insert(FindingChange, rows);
  }
}
