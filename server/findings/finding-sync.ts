/** Applies a check run to the project's findings (the rules are in finding-sync-plan.ts), in one transaction. */
import { randomUUID } from 'node:crypto';
import { type DataSource, type EntityManager, In } from 'typeorm';
import { runTransaction } from '../data-source';
import type { FindingStatus, GeneratedKind } from './finding-fields';
import { type ChangeEntry, SYSTEM_CHANGE, recordChanges, utilisationText } from './finding-history';
import { type RunMemberResult, type SyncRun, type SyncedFinding, planRunSync } from './finding-sync-plan';
import { Finding } from './finding.entity';

export interface StatusChange {
  findingId: string;
  from: FindingStatus;
  to: FindingStatus;
}

export interface SyncOutcome {
  created: number;
  updated: number;
  statusChanges: StatusChange[];
}

const GENERATED_KINDS: GeneratedKind[] = ['web-shear-fail', 'web-shear-warning', 'flag'];
const INSERT_CHUNK = 100;

async function generatedFindings(manager: EntityManager, projectId: string): Promise<(SyncedFinding & Pick<Finding, 'description' | 'title' | 'justification'>)[]> {
  const rows = await manager.find(Finding, {
    where: { projectId, kind: In(GENERATED_KINDS) },
    select: { id: true, memberKey: true, kind: true, status: true, priority: true, revisionNumber: true, utilisation: true, description: true, title: true, justification: true },
    order: { number: 'ASC' },
  });
  return rows.map((row) => ({ ...row, kind: row.kind as GeneratedKind, memberKey: row.memberKey ?? '' }));
}

/**
 * Creates and updates the findings a run calls for. `results` are the run's member rows; members it does not list
 * are left alone. Returns the status changes, for the e-mails sent once this has been committed.
 */
export async function syncFindingsFromRun(
  dataSource: DataSource,
  projectId: string,
  run: SyncRun,
  results: readonly RunMemberResult[],
): Promise<SyncOutcome> {
  return runTransaction(dataSource, async (manager) => {
    const existing = await generatedFindings(manager, projectId);
    const byId = new Map(existing.map((finding) => [finding.id, finding]));
    const plan = planRunSync(run, results, existing);
    let number = (await manager.maximum(Finding, 'number', { projectId })) ?? 0;
    const history: ChangeEntry[] = [];

    const created = plan.create.map((draft) => {
      const id = randomUUID();
      history.push({ findingId: id, field: 'created', from: null, to: 'open' });
      return {
        id,
        projectId,
        number: ++number,
        guid: randomUUID(),
        kind: draft.kind,
        title: draft.title,
        description: draft.description,
        priority: draft.priority,
        labels: [],
        memberGlobalIds: [draft.globalId],
        memberKey: draft.globalId,
        memberTag: draft.memberTag,
        memberLabel: draft.memberLabel,
        runId: run.runId,
        revisionNumber: run.revisionNumber,
        utilisation: draft.utilisation,
        createdById: null,
      };
    });
    for (let start = 0; start < created.length; start += INSERT_CHUNK) {
      await manager.insert(Finding, created.slice(start, start + INSERT_CHUNK));
    }

    const statusChanges: StatusChange[] = [];
    for (const update of plan.update) {
      const before = byId.get(update.id);
      const { escalated } = update;
      await manager.update(Finding, update.id, {
        runId: run.runId,
        revisionNumber: update.revisionNumber,
        utilisation: update.utilisation,
        description: update.description,
        memberTag: update.memberTag,
        memberLabel: update.memberLabel,
        ...(update.status && { status: update.status.to }),
        // Reopened by a worse condition: any justification was for the lesser one.
        ...(update.status?.from === 'accepted' && { justification: null }),
        ...(escalated && { kind: escalated.kind, title: escalated.title, priority: escalated.priority }),
      });
      const note = (field: string, from: string | null, to: string | null) => {
        if (from !== to) history.push({ findingId: update.id, field, from, to });
      };
      if (escalated && before) {
        note('title', before.title, escalated.title);
        note('priority', before.priority, escalated.priority);
      }
      if (update.status) {
        statusChanges.push({ findingId: update.id, ...update.status });
        history.push({ findingId: update.id, field: 'status', ...update.status });
        if (update.status.from === 'accepted') note('justification', before?.justification ?? null, null);
      }
      note('utilisation', utilisationText(before?.utilisation ?? null), utilisationText(update.utilisation));
      note('description', before?.description || null, update.description);
    }
    await recordChanges(manager, SYSTEM_CHANGE, history);
    return { created: created.length, updated: plan.update.length, statusChanges };
  });
}
