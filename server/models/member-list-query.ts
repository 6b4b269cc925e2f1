/** The members table's query string: sort, filters and page, validated at the edge. */
import { z } from 'zod';
import { SECTION_FAMILIES } from '../engine/section-family';
import { type MemberStatus, PROFILE_SOURCES, type ProfileSource } from '../ifc/model-read-result';
import { MEMBER_ROW_COLUMNS, MEMBER_STATUSES } from './member-row';

export const MEMBER_SORT_FIELDS = MEMBER_ROW_COLUMNS.filter((c) => c !== 'flags' && c !== 'reason' && c !== 'gradeAssumed');
export type MemberSortField = (typeof MEMBER_SORT_FIELDS)[number];

export const MAX_PAGE_SIZE = 500;

// `storey=` in a link means "any storey", not "storey named ''".
const optionalText = z.preprocess((v) => (v === '' ? undefined : v), z.string().trim().max(200).optional());

const statusList = z.preprocess(
  (v) => (typeof v === 'string' && v !== '' ? v.split(',') : undefined),
  z.array(z.enum(MEMBER_STATUSES as [MemberStatus, ...MemberStatus[]], `must be ${MEMBER_STATUSES.join(', ')} (or several, comma-separated)`)).optional(),
);

export const memberListQuery = z.object({
  sort: z.enum(MEMBER_SORT_FIELDS as [MemberSortField, ...MemberSortField[]], `must be one of ${MEMBER_SORT_FIELDS.join(', ')}`).default('expressId'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(MAX_PAGE_SIZE).default(50),
  status: statusList,
  storey: optionalText,
  profile: optionalText,
  family: z.preprocess((v) => (v === '' ? undefined : v), z.enum(SECTION_FAMILIES, `must be one of ${SECTION_FAMILIES.join(', ')}`).optional()),
  source: z.preprocess((v) => (v === '' ? undefined : v), z.enum(PROFILE_SOURCES as [ProfileSource, ...ProfileSource[]], `must be one of ${PROFILE_SOURCES.join(', ')}`).optional()),
  q: optionalText,
});

export type MemberListQuery = z.output<typeof memberListQuery>;
