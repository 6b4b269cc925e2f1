/**
 * Matching of result sets to model revisions: the report (computed from the stored keys, the revision's members and
 * the project's manual matches, and kept while none of those change), its pages, and the coordinator's manual fixes.
 */
import type { DataSource, EntityManager } from 'typeorm';
import { runTransaction } from '../data-source';
import { NotFoundError, ValidationError } from '../http/errors';
import type { MemberRecord } from '../ifc/model-read-result';
import type { RevisionView } from '../models/model-queries';
import { type MatchingSummary, summariseMatching } from './matching-summary';
import {
  type AmbiguousMatch,
  type GeometryMatchOptions,
  type MatchableKey,
  type MatchReport,
  type MemberMatch,
  matchResultsToMembers,
} from './member-matching';
import type { MemberKeyKind } from './column-mapping';
import type { MatchingFilter, MatchingItem, MatchingPage, MemberCandidate } from './results-api-types';
import { LruPromiseCache } from './lru-promise-cache';
import { readyRevision, revisionLabel, revisionMembers } from './ready-revision';
import { ResultKey } from './result-key.entity';
import { ResultManualMatch } from './result-manual-match.entity';
import { ResultSet } from './result-set.entity';

/** What matching a set of keys needs besides the keys. */
export interface MatchSettings {
  keyKind: MemberKeyKind;
  geometry: GeometryMatchOptions | null;
}

/** A report with the lookups its pages need. */
export interface Matching {
  report: MatchReport;
  summary: MatchingSummary;
  keys: readonly MatchableKey[];
  members: readonly MemberRecord[];
}

/** Matchings kept in memory; each holds references to cached members, so it costs little. */
const KEPT_MATCHINGS = 8;

const services = new WeakMap<DataSource, ResultMatchingService>();

export class ResultMatchingService {
  /** By `projectId|resultSetId|revisionId`. */
  private readonly cache = new LruPromiseCache<string, Matching>(KEPT_MATCHINGS);

  private constructor(private readonly dataSource: DataSource) {}

  /** One per DataSource, so a manual match made through one router is seen by the check runs of another. */
  static of(dataSource: DataSource): ResultMatchingService {
    let service = services.get(dataSource);
    if (!service) services.set(dataSource, (service = new ResultMatchingService(dataSource)));
    return service;
  }

  /** Matches keys that are not stored yet (an import in progress) against a ready revision. */
  async matchKeys(projectId: string, keys: readonly MatchableKey[], settings: MatchSettings, revision: RevisionView): Promise<Matching> {
    const [members, manual] = await Promise.all([revisionMembers(this.dataSource, revision.id), this.manualMatches(projectId)]);
    const report = matchResultsToMembers(keys, members, {
      keyKind: settings.keyKind,
      manual,
      ...(settings.geometry && { geometry: settings.geometry }),
    });
    return { report, summary: summariseMatching(report, revisionLabel(revision)), keys, members };
  }

  /** The matching of a stored result set against a revision (its own unless another is given). */
  async matchingOf(projectId: string, resultSetId: string, revisionId?: string): Promise<Matching> {
    const resultSet = await this.findResultSet(projectId, resultSetId);
    const revision = await readyRevision(this.dataSource, projectId, revisionId ?? resultSet.modelRevisionId);
    return this.cache.get(`${projectId}|${resultSet.id}|${revision.id}`, async () =>
      this.matchKeys(projectId, await this.storedKeys(resultSet.id), settingsOf(resultSet), revision),
    );
  }

  async page(projectId: string, resultSetId: string, query: { revisionId?: string; filter: MatchingFilter; page: number; pageSize: number }): Promise<MatchingPage> {
    const matching = await this.matchingOf(projectId, resultSetId, query.revisionId);
    const items = new MatchingRows(matching).select(query.filter);
    const start = query.page * query.pageSize;
    return { summary: matching.summary, total: items.length, items: items.slice(start, start + query.pageSize).map((item) => item()) };
  }

  /**
   * Sets (or with null clears) the project's manual match of a result key. The member must be in the revision the
   * matching is shown against. Every stored summary of the project's result sets that use the key is brought up to date.
   */
  async setManualMatch(
    projectId: string,
    resultSetId: string,
    resultKey: string,
    globalId: string | null,
    actorId: string,
    revisionId?: string,
  ): Promise<{ item: MatchingItem; summary: MatchingSummary }> {
    const resultSet = await this.findResultSet(projectId, resultSetId);
    if (!(await this.dataSource.getRepository(ResultKey).existsBy({ resultSetId, memberKey: resultKey }))) {
      throw new NotFoundError(`The results have no member key '${resultKey}'.`, { code: 'result_key_not_found' });
    }
    const revision = await readyRevision(this.dataSource, projectId, revisionId ?? resultSet.modelRevisionId);
    if (globalId !== null && !(await revisionMembers(this.dataSource, revision.id)).some((member) => member.globalId === globalId)) {
      throw new ValidationError(`${revisionLabel(revision)} has no member with GlobalId ${globalId}.`, {
        code: 'member_not_found',
        details: [{ location: 'body', field: 'globalId', message: 'is not a member of this revision' }],
      });
    }
    await runTransaction(this.dataSource, async (manager) => {
      if (globalId === null) await manager.delete(ResultManualMatch, { projectId, memberKey: resultKey });
      else await manager.upsert(ResultManualMatch, { projectId, memberKey: resultKey, globalId, updatedById: actorId }, ['projectId', 'memberKey']);
    });
    this.forgetProject(projectId);
    await this.refreshStoredSummaries(projectId, resultKey);
    const matching = await this.matchingOf(projectId, resultSetId, revision.id);
    return { item: new MatchingRows(matching).item(resultKey), summary: matching.summary };
  }

  async findResultSet(projectId: string, resultSetId: string, manager: EntityManager = this.dataSource.manager): Promise<ResultSet> {
    const resultSet = await manager.findOneBy(ResultSet, { id: resultSetId, projectId });
    if (!resultSet) throw new NotFoundError('Result set not found.', { code: 'result_set_not_found' });
    return resultSet;
  }

  private async refreshStoredSummaries(projectId: string, memberKey: string): Promise<void> {
    const affected = await this.dataSource
      .getRepository(ResultSet)
      .createQueryBuilder('s')
      .innerJoin(ResultKey, 'k', 'k.resultSetId = s.id AND k.memberKey = :memberKey', { memberKey })
      .where('s.projectId = :projectId', { projectId })
      .getMany();
    for (const resultSet of affected) {
      const { summary } = await this.matchingOf(projectId, resultSet.id);
      await this.dataSource.getRepository(ResultSet).update({ id: resultSet.id }, { matching: summary });
    }
  }

  private forgetProject(projectId: string): void {
    this.cache.deleteWhere((key) => key.startsWith(`${projectId}|`));
  }

  private async storedKeys(resultSetId: string): Promise<MatchableKey[]> {
    const rows = await this.dataSource.getRepository(ResultKey).find({ where: { resultSetId }, order: { keyIndex: 'ASC' } });
    return rows.map((row) => ({ memberKey: row.memberKey, ...(row.ends && { end1_mm: row.ends[0], end2_mm: row.ends[1] }) }));
  }

  private async manualMatches(projectId: string): Promise<{ memberKey: string; globalId: string }[]> {
    return this.dataSource.getRepository(ResultManualMatch).find({ where: { projectId }, select: { memberKey: true, globalId: true } });
  }
}

export function settingsOf(resultSet: Pick<ResultSet, 'mapping' | 'geometry'>): MatchSettings {
  return { keyKind: resultSet.mapping.memberKeyKind, geometry: resultSet.geometry };
}

/** The rows of a matching's pages; a page turns only its own rows into objects. */
class MatchingRows {
  private readonly byGlobalId: Map<string, MemberRecord>;
  private readonly matched: Map<string, MemberMatch>;
  private readonly ambiguous: Map<string, AmbiguousMatch>;

  constructor(private readonly matching: Matching) {
    this.byGlobalId = new Map(matching.members.map((member) => [member.globalId, member]));
    this.matched = new Map(matching.report.matched.map((match) => [match.memberKey, match]));
    this.ambiguous = new Map(matching.report.ambiguous.map((match) => [match.memberKey, match]));
  }

  /** Result keys in file order, or members in model order, that pass the filter. */
  select(filter: MatchingFilter): Array<() => MatchingItem> {
    if (filter === 'members-without-results') {
      return this.matching.report.membersWithoutResults.map((globalId) => () => ({ resultKey: null, ...this.candidate(globalId), method: null, candidates: [] }));
    }
    const keys = this.matching.keys.map((key) => key.memberKey);
    const selected = filter === 'all' ? keys : keys.filter((memberKey) => this.kindOf(memberKey) === filter);
    return selected.map((memberKey) => () => this.item(memberKey));
  }

  item(memberKey: string): MatchingItem {
    const match = this.matched.get(memberKey);
    if (match) return { resultKey: memberKey, ...this.candidate(match.globalId), method: match.method, candidates: [] };
    const candidates = this.ambiguous.get(memberKey)?.candidates.map((globalId) => this.candidate(globalId)) ?? [];
    return { resultKey: memberKey, globalId: null, tag: null, name: null, method: null, candidates };
  }

  private kindOf(memberKey: string): 'matched' | 'ambiguous' | 'unmatched' {
    if (this.matched.has(memberKey)) return 'matched';
    return this.ambiguous.has(memberKey) ? 'ambiguous' : 'unmatched';
  }

  private candidate(globalId: string): MemberCandidate {
    const member = this.byGlobalId.get(globalId);
    return { globalId, tag: member?.tag ?? null, name: member?.name ?? null };
  }
}
