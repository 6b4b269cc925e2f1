/** The members table's state as plain data, and the API query it becomes (`GET …/models/:revisionId/members`). */
import type { SectionFamily } from '../../../server/engine/section-family';
import type { ProfileSource } from '../../../server/ifc/model-read-result';
import type { MemberSortField } from '../../../server/models/member-list-query';
import type { MemberStatus } from './models-api';

export const MEMBER_SORTS = [
  'expressId',
  'tag',
  'ifcClass',
  'storey',
  'profileName',
  'profileFamily',
  'depth_mm',
  'webThickness_mm',
  'flangeWidth_mm',
  'grade',
  'fy_MPa',
  'length_mm',
  'status',
] as const satisfies readonly MemberSortField[];
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
  /** Empty: any family. */
  family: SectionFamily | '';
  /** How the section was found; empty: any way. */
  source: ProfileSource | '';
  q: string;
}

/** File order, the order the model was written in. */
export const DEFAULT_MEMBER_QUERY: Readonly<MemberQuery> = {
  sort: 'expressId',
  dir: 'asc',
  page: 0,
  pageSize: 50,
  statuses: [],
  storey: '',
  profile: '',
  family: '',
  source: '',
  q: '',
};

export function memberApiParams(query: MemberQuery): Record<string, string> {
  const params: Record<string, string> = { sort: query.sort, dir: query.dir, page: String(query.page), pageSize: String(query.pageSize) };
  if (query.statuses.length) params['status'] = query.statuses.join(',');
  if (query.storey) params['storey'] = query.storey;
  if (query.profile) params['profile'] = query.profile;
  if (query.family) params['family'] = query.family;
  if (query.source) params['source'] = query.source;
  if (query.q.trim()) params['q'] = query.q.trim();
  return params;
}

export function isMemberSort(value: string): value is MemberSort {
  return (MEMBER_SORTS as readonly string[]).includes(value);
}
