/**
 * Who accepted a finding and when, read from the history row that recorded its justification: exports carry the
 * reason with its author and date, and a BCF import recognises the comment an export wrote for it.
 */
import { type EntityManager, In, Not, IsNull } from 'typeorm';
import { acceptanceCommentGuid } from './bcf/bcf-export-check';
import { FindingChange } from './finding-change.entity';
import { Finding } from './finding.entity';

export interface AcceptanceRecord {
  /** Null when the acceptance was made by no account (the history shows the system). */
  email: string | null;
  at: Date;
}

/** The latest acceptance of each accepted finding among `findings`, by finding id. */
export async function acceptanceRecords(manager: EntityManager, findings: readonly Finding[]): Promise<Map<string, AcceptanceRecord>> {
  const ids = findings.filter((finding) => finding.status === 'accepted').map((finding) => finding.id);
  if (ids.length === 0) return new Map();
  const changes = await manager.find(FindingChange, {
    where: { findingId: In(ids), field: 'justification', toValue: Not(IsNull()) },
    relations: { actor: true },
    order: { at: 'ASC' },
  });
  return new Map(changes.map((change) => [change.findingId, { email: change.actor?.email ?? null, at: change.at }]));
}

/** The GUIDs of the comments that exports wrote for every acceptance ever made in the project. */
export async function acceptanceCommentGuids(manager: EntityManager, projectId: string): Promise<string[]> {
  const changes = await manager.find(FindingChange, {
    where: { field: 'justification', toValue: Not(IsNull()), finding: { projectId } },
    relations: { finding: true },
    select: { id: true, at: true, finding: { id: true, guid: true } },
  });
  return changes.map((change) => acceptanceCommentGuid(change.finding!.guid, change.at.toISOString()));
}
