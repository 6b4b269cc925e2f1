/** The members table's state as plain data, and the API query it becomes (`GET …/models/:revisionId/members`). */
import type { MemberStatus } from './models-api';

export const MEMBER_SORTS = ['expressId', 'tag', 'ifcClass', 'storey', 'profileName', 'depth_mm', 'webThickness_mm', 'flangeWidth_mm', 'grade', 'fy_MPa', 'length_mm', 'status'] as const;
export type MemberSort = (typeof MEMBER_SORTS)[number];

export const MEMBER_PAGE_SIZES = [25, 50, 100, 250] as const;

export interface MemberQuery {
  sort: MemberSort;
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
  /** Empty: any status. */
  statuses: MemberStatus[];
  storey: string;
  profile: string;
  q: string;
}

/** File order, the order the model was written in. */
export const DEFAULT_MEMBER_QUERY: Readonly<MemberQuery> = { sort: 'expressId', dir: 'asc', page: 0, pageSize: 50, statuses: [], storey: '', profile: '', q: '' };

export function memberApiParams(query: MemberQuery): Record<string, string> {
  const params: Record<string, string> = { sort: query.sort, dir: query.dir, page: String(query.page), pageSize: String(query.pageSize) };
  if (query.statuses.length) params['status'] = query.statuses.join(',');
  if (query.storey) params['storey'] = query.storey;
  if (query.profile) params['profile'] = query.profile;
  if (query.q.trim()) params['q'] = query.q.trim();
  return params;
}

export function isMemberSort(value: string): value is MemberSort {
  return (MEMBER_SORTS as readonly string[]).includes(value);
}
