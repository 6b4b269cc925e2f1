/**
 * The results table of a check run: server-side sort, filter and paging over check_member_result, answered from the
 * per-run indexes (run + utilisation, run + status + utilisation, run + storey, run + profile, run + tag). A finished
 * run never changes, so its facets and colours are computed once and kept.
 */
import type { DataSource, SelectQueryBuilder } from 'typeorm';
import { LruPromiseCache } from '../results/lru-promise-cache';
import { CheckMemberResult } from './check-member-result.entity';
import type { ResultStatus, RunFacets, RunMemberRow, RunMembersPage } from './checks-api-types';
import { MEMBER_RESULT_COLUMNS } from './member-result-row';

export const RUN_MEMBER_SORTS = [
  'utilisation',
  'tag',
  'name',
  'storey',
  'profileName',
  'grade',
  'governingCombination',
  'VEd_kN',
  'VRd_kN',
  'tauMax_MPa',
  'tauAvgWeb_MPa',
  'status',
  'globalId',
] as const;
export type RunMemberSort = (typeof RUN_MEMBER_SORTS)[number];

export interface RunMemberFilter {
  status?: ResultStatus;
  storey?: string;
  profile?: string;
  /** Utilisation range as ratios (1 = at capacity), inclusive. */
  minUtil?: number;
  maxUtil?: number;
  /** Part of the GlobalId, tag, name or profile, any case. */
  q?: string;
}

export interface RunMembersQuery extends RunMemberFilter {
  sort: RunMemberSort;
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

/** `{[globalId]: {u, s}}` for the 3D view: utilisation (null when not checked) and status. */
export type RunColours = Record<string, { u: number | null; s: ResultStatus }>;

/** The stored columns a table row shows: all but the ordinal and the search text. */
const ROW_COLUMNS = MEMBER_RESULT_COLUMNS.filter((column): column is keyof RunMemberRow & (typeof MEMBER_RESULT_COLUMNS)[number] => column !== 'ordinal' && column !== 'search');

/** Sorts with few distinct values, whose ties are ordered by utilisation. */
const GROUPING_SORTS: ReadonlySet<RunMemberSort> = new Set(['storey', 'profileName', 'status', 'grade', 'governingCombination']);

/** Finished runs whose facets and colours are kept; each costs about a megabyte at 50,000 members. */
const KEPT_RUNS = 8;

export class RunMembersQueries {
  private readonly facets = new LruPromiseCache<string, RunFacets>(KEPT_RUNS);
  private readonly colours = new LruPromiseCache<string, string>(KEPT_RUNS);

  constructor(private readonly dataSource: DataSource) {}

  async page(runId: string, query: RunMembersQuery): Promise<RunMembersPage> {
    const filtered = this.filtered(runId, query);
    const [total, rows, facets] = await Promise.all([
      filtered.getCount(),
      this.ordered(filtered.clone(), query)
        .select(ROW_COLUMNS.map((column) => `m.${column}`))
        .offset(query.page * query.pageSize)
        .limit(query.pageSize)
        .getMany(),
      this.facetsOf(runId),
    ]);
    return { total, rows: rows.map(toRow), facets };
  }

  /** Every row the filter passes, in the requested order (for the CSV export). */
  async all(runId: string, query: RunMemberFilter & Pick<RunMembersQuery, 'sort' | 'dir'>): Promise<RunMemberRow[]> {
    const rows = await this.ordered(this.filtered(runId, query), query)
      .select(ROW_COLUMNS.map((column) => `m.${column}`))
      .getMany();
    return rows.map(toRow);
  }

  facetsOf(runId: string): Promise<RunFacets> {
    return this.facets.get(runId, async () => {
      const distinct = async (column: 'storey' | 'profileName'): Promise<string[]> => {
        const rows = await this.dataSource
          .getRepository(CheckMemberResult)
          .createQueryBuilder('m')
          .select(`DISTINCT m.${column}`, 'value')
          .where('m.runId = :runId', { runId })
          .andWhere(`m.${column} IS NOT NULL`)
          .orderBy('value', 'ASC')
          .getRawMany<{ value: string }>();
        return rows.map((row) => row.value);
      };
      const [storeys, profiles] = await Promise.all([distinct('storey'), distinct('profileName')]);
      return { storeys, profiles };
    });
  }

  /** The colours payload as JSON text, ready to send. */
  coloursJson(runId: string): Promise<string> {
    return this.colours.get(runId, async () => {
      const rows = await this.dataSource
        .getRepository(CheckMemberResult)
        .createQueryBuilder('m')
        .select(['m.globalId AS globalId', 'm.utilisation AS u', 'm.status AS s'])
        .where('m.runId = :runId', { runId })
        .orderBy('m.ordinal', 'ASC')
        .getRawMany<{ globalId: string; u: number | null; s: ResultStatus }>();
      const members: RunColours = {};
      for (const row of rows) members[row.globalId] = { u: row.u, s: row.s };
      return JSON.stringify({ members });
    });
  }

  private filtered(runId: string, filter: RunMemberFilter): SelectQueryBuilder<CheckMemberResult> {
    const query = this.dataSource.getRepository(CheckMemberResult).createQueryBuilder('m').where('m.runId = :runId', { runId });
    if (filter.status) query.andWhere('m.status = :status', { status: filter.status });
    if (filter.storey) query.andWhere('m.storey = :storey', { storey: filter.storey });
    if (filter.profile) query.andWhere('m.profileName = :profile', { profile: filter.profile });
    if (filter.minUtil !== undefined) query.andWhere('m.utilisation >= :minUtil', { minUtil: filter.minUtil });
    if (filter.maxUtil !== undefined) query.andWhere('m.utilisation <= :maxUtil', { maxUtil: filter.maxUtil });
    const text = filter.q?.trim().toLowerCase();
    if (text) {
      // Case was folded when the row was written (searchTextOf); only the wildcards need escaping.
      const pattern = `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
      query.andWhere("m.search LIKE :pattern ESCAPE '\\'", { pattern });
    }
    return query;
  }

  /**
   * Members without a value (not checked) come last either way. Within a storey, profile or status the members follow
   * their utilisation in the same direction, which the (run, column, utilisation) indexes give without sorting (so
   * ascending, unchecked ones lead their group); the model's order breaks the remaining ties.
   */
  private ordered(query: SelectQueryBuilder<CheckMemberResult>, order: Pick<RunMembersQuery, 'sort' | 'dir'>): SelectQueryBuilder<CheckMemberResult> {
    const dir = order.dir === 'asc' ? 'ASC' : 'DESC';
    query.orderBy(`m.${order.sort}`, dir, 'NULLS LAST');
    if (GROUPING_SORTS.has(order.sort)) query.addOrderBy('m.utilisation', dir);
    return query.addOrderBy('m.ordinal', 'ASC');
  }
}

function toRow(row: CheckMemberResult): RunMemberRow {
  return {
    globalId: row.globalId,
    tag: row.tag,
    name: row.name,
    storey: row.storey,
    profileName: row.profileName,
    grade: row.grade,
    governingCombination: row.governingCombination,
    governingAxis: row.governingAxis,
    governingCheck: row.governingCheck,
    VEd_kN: row.VEd_kN,
    VRd_kN: row.VRd_kN,
    utilisation: row.utilisation,
    tauMax_MPa: row.tauMax_MPa,
    tauAvgWeb_MPa: row.tauAvgWeb_MPa,
    status: row.status,
    flags: row.flags,
  };
}
