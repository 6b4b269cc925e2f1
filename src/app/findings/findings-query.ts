/**
 * The findings list's state (filters, sort, page) as plain data, and its written forms: the API query of
 * `GET …/findings` (also used for the export links, so a file holds what the list shows) and the page's own URL
 * query, defaults left out, so a filtered list survives a reload and a trip to a finding and back.
 */
import { wholeNumber } from '../core/url-query';
import { FINDING_KINDS, FINDING_STATUSES, FindingKind, FindingPriority, FindingStatus, PRIORITIES } from './finding';

export const FINDING_SORTS = ['number', 'title', 'status', 'priority', 'utilisation', 'dueDate', 'updatedAt', 'assignee'] as const;
export type FindingSort = (typeof FINDING_SORTS)[number];

export const PAGE_SIZES = [25, 50, 100, 200] as const;

export interface FindingsQuery {
  sort: FindingSort;
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
  /** Empty: every status. */
  status: FindingStatus[];
  kind: FindingKind | null;
  priority: FindingPriority | null;
  /** '' any, 'me', 'none' (unassigned) or a user id. */
  assignee: string;
  q: string;
}

/** Newest first. */
export const DEFAULT_FINDINGS_QUERY: Readonly<FindingsQuery> = {
  sort: 'number',
  dir: 'desc',
  page: 0,
  pageSize: 25,
  status: [],
  kind: null,
  priority: null,
  assignee: '',
  q: '',
};

type Params = Record<string, string>;

/** The filters alone, as the API reads them (list and exports). */
export function findingsFilterParams(query: FindingsQuery): Params {
  const params: Params = {};
  if (query.status.length > 0) params['status'] = query.status.join(',');
  if (query.kind) params['kind'] = query.kind;
  if (query.priority) params['priority'] = query.priority;
  if (query.assignee) params['assignee'] = query.assignee;
  if (query.q.trim()) params['q'] = query.q.trim();
  return params;
}

export function findingsApiParams(query: FindingsQuery): Params {
  return { sort: query.sort, dir: query.dir, page: String(query.page), pageSize: String(query.pageSize), ...findingsFilterParams(query) };
}

export function findingsUrlParams(query: FindingsQuery): Params {
  const params = findingsFilterParams(query);
  const defaults = DEFAULT_FINDINGS_QUERY;
  if (query.sort !== defaults.sort || query.dir !== defaults.dir) {
    params['sort'] = query.sort;
    params['dir'] = query.dir;
  }
  if (query.page !== defaults.page) params['page'] = String(query.page);
  if (query.pageSize !== defaults.pageSize) params['pageSize'] = String(query.pageSize);
  return params;
}

function oneOf<T extends string>(values: readonly T[], text: string | undefined): T | null {
  return values.find((value) => value === text) ?? null;
}

/** Reads the page's URL query back; anything unknown falls back to the default. */
export function findingsQueryFromUrl(params: Readonly<Record<string, string | undefined>>): FindingsQuery {
  const defaults = DEFAULT_FINDINGS_QUERY;
  const status = (params['status'] ?? '').split(',').flatMap((text) => oneOf(FINDING_STATUSES, text) ?? []);
  return {
    sort: oneOf(FINDING_SORTS, params['sort']) ?? defaults.sort,
    dir: params['dir'] === 'asc' || params['dir'] === 'desc' ? params['dir'] : defaults.dir,
    page: wholeNumber(params['page'], defaults.page),
    pageSize: wholeNumber(params['pageSize'], defaults.pageSize, PAGE_SIZES),
    status,
    kind: oneOf(FINDING_KINDS, params['kind']),
    priority: oneOf(PRIORITIES, params['priority']),
    assignee: params['assignee'] ?? '',
    q: params['q'] ?? '',
  };
}
