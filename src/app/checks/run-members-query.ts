/**
 * The results table's state (sort, filters, page) as plain data, and its two written forms: the API query of
 * `GET …/checks/:runId/members` (utilisation as a ratio) and the page's own URL query (utilisation in percent, defaults
 * left out) so a filtered table survives a reload and a trip to a calculation sheet and back.
 */
import { wholeNumber } from '../core/url-query';
import type { MemberCheckStatus } from './checks-api';

export const RUN_MEMBER_SORTS = ['utilisation', 'tag', 'storey', 'profileName', 'grade', 'governingCombination', 'VEd_kN', 'VRd_kN', 'status'] as const;
export type RunMemberSort = (typeof RUN_MEMBER_SORTS)[number];

export const RUN_MEMBER_STATUSES: readonly MemberCheckStatus[] = ['fail', 'warning', 'pass', 'not-checked', 'not-applicable'];

export const PAGE_SIZES = [25, 50, 100, 250] as const;

export interface RunMembersQuery {
  sort: RunMemberSort;
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
  status: MemberCheckStatus | null;
  storey: string;
  profile: string;
  /** Utilisation range in percent (100 = at capacity); null = open. */
  minUtilPercent: number | null;
  maxUtilPercent: number | null;
  q: string;
}

/** Most utilised first: the members an engineer looks at first. */
export const DEFAULT_RUN_MEMBERS_QUERY: Readonly<RunMembersQuery> = {
  sort: 'utilisation',
  dir: 'desc',
  page: 0,
  pageSize: 50,
  status: null,
  storey: '',
  profile: '',
  minUtilPercent: null,
  maxUtilPercent: null,
  q: '',
};

type Params = Record<string, string>;

function filterParams(query: RunMembersQuery, utilisation: (percent: number) => string): Params {
  const params: Params = {};
  if (query.status) params['status'] = query.status;
  if (query.storey) params['storey'] = query.storey;
  if (query.profile) params['profile'] = query.profile;
  if (query.minUtilPercent !== null) params['minUtil'] = utilisation(query.minUtilPercent);
  if (query.maxUtilPercent !== null) params['maxUtil'] = utilisation(query.maxUtilPercent);
  if (query.q.trim()) params['q'] = query.q.trim();
  return params;
}

// Percent → ratio without binary noise (91 % is 0.91, not 0.9100000000000001).
const ratioText = (percent: number): string => String(Number((percent / 100).toPrecision(12)));

/** The filters alone, as the API reads them: shared by the table request and the CSV export. */
export function runMembersFilterParams(query: RunMembersQuery): Params {
  return filterParams(query, ratioText);
}

/** The whole API query of one table page. */
export function runMembersApiParams(query: RunMembersQuery): Params {
  return {
    sort: query.sort,
    dir: query.dir,
    page: String(query.page),
    pageSize: String(query.pageSize),
    ...runMembersFilterParams(query),
  };
}

/** The page's URL query: only what differs from the defaults. */
export function runMembersUrlParams(query: RunMembersQuery): Params {
  const params = filterParams(query, String);
  const defaults = DEFAULT_RUN_MEMBERS_QUERY;
  if (query.sort !== defaults.sort || query.dir !== defaults.dir) {
    params['sort'] = query.sort;
    params['dir'] = query.dir;
  }
  if (query.page !== defaults.page) params['page'] = String(query.page);
  if (query.pageSize !== defaults.pageSize) params['pageSize'] = String(query.pageSize);
  return params;
}

function percentOrNull(text: string | undefined): number | null {
  if (text === undefined || text.trim() === '') return null;
  const value = Number(text);
  return Number.isFinite(value) && value >= 0 ? value : null;
}

/** Reads the page's URL query back; anything unknown or malformed falls back to the default. */
export function runMembersQueryFromUrl(params: Readonly<Record<string, string | undefined>>): RunMembersQuery {
  const defaults = DEFAULT_RUN_MEMBERS_QUERY;
  const sort = RUN_MEMBER_SORTS.find((name) => name === params['sort']) ?? defaults.sort;
  const status = RUN_MEMBER_STATUSES.find((name) => name === params['status']) ?? null;
  return {
    sort,
    dir: params['dir'] === 'asc' || params['dir'] === 'desc' ? params['dir'] : defaults.dir,
    page: wholeNumber(params['page'], defaults.page),
    pageSize: wholeNumber(params['pageSize'], defaults.pageSize, PAGE_SIZES),
    status,
    storey: params['storey'] ?? '',
    profile: params['profile'] ?? '',
    minUtilPercent: percentOrNull(params['minUtil']),
    maxUtilPercent: percentOrNull(params['maxUtil']),
    q: params['q'] ?? '',
  };
}
