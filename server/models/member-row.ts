/**
 * The flat row of a member that the members table shows, sorts and filters: what the ingest stores as columns beside
 * the whole MemberRecord. Lengths in millimetres, fy in MPa, as in the record.
 */
import type { Fabrication } from '../engine/section';
import { flangeThickness_mm, overallDepth_mm, overallWidth_mm, type SectionFamily, webThickness_mm } from '../engine/section-family';
import type { MemberFlag, MemberProfile, MemberRecord, MemberStatus, ProfileSource } from '../ifc/model-read-result';

export const MEMBER_STATUSES: readonly MemberStatus[] = ['ok', 'not-applicable', 'flagged'];

/** `GET …/members/labels`: every member's GlobalId, tag, section and storey as rows of `columns`, compact enough to
 * send 50,000 members in one answer. */
export interface MemberLabels {
  columns: ['globalId', 'tag', 'profileName', 'storey'];
  members: MemberLabelRow[];
}
export type MemberLabelRow = [globalId: string, tag: string | null, profileName: string | null, storey: string | null];

/** `GET …/members`: one page of the sorted, filtered table. */
export interface MemberPage {
  total: number;
  members: MemberRow[];
}

/** Members that will not be checked, counted by reason. */
export interface SkippedReason {
  reason: string;
  count: number;
}

/** `GET …/members/facets`: the values the table's filters offer, and the skipped members counted by reason. */
export interface MemberFacets {
  storeys: string[];
  profiles: string[];
  /** Section families present, in SECTION_FAMILIES order. */
  families: SectionFamily[];
  /** How the sections were found, in PROFILE_SOURCES order. */
  sources: ProfileSource[];
  /** Most frequent first. */
  skipped: SkippedReason[];
}

export interface MemberRow {
  globalId: string;
  expressId: number;
  ifcClass: string;
  name: string | null;
  tag: string | null;
  storey: string | null;
  status: MemberStatus;
  reason: string | null;
  profileName: string | null;
  profileSource: MemberProfile['source'] | null;
  profileType: string | null;
  profileFamily: SectionFamily | null;
  fabrication: Fabrication | null;
  depth_mm: number | null;
  webThickness_mm: number | null;
  flangeWidth_mm: number | null;
  flangeThickness_mm: number | null;
  grade: string | null;
  fy_MPa: number | null;
  gradeAssumed: boolean | null;
  length_mm: number | null;
  flags: MemberFlag[];
}

/** Column order of MemberRow, shared by the worker's INSERT and the list query's SELECT. */
export const MEMBER_ROW_COLUMNS = [
  'globalId',
  'expressId',
  'ifcClass',
  'name',
  'tag',
  'storey',
  'status',
  'reason',
  'profileName',
  'profileSource',
  'profileType',
  'profileFamily',
  'fabrication',
  'depth_mm',
  'webThickness_mm',
  'flangeWidth_mm',
  'flangeThickness_mm',
  'grade',
  'fy_MPa',
  'gradeAssumed',
  'length_mm',
  'flags',
] as const satisfies readonly (keyof MemberRow)[];

export function memberRowOf(record: MemberRecord): MemberRow {
  const profile = record.profile;
  return {
    globalId: record.globalId,
    expressId: record.expressId,
    ifcClass: record.ifcClass,
    name: record.name,
    tag: record.tag,
    storey: record.storey,
    status: record.status,
    reason: record.reason ?? null,
    profileName: profile?.name || null,
    profileSource: profile?.source ?? null,
    profileType: profile?.ifcType ?? null,
    fabrication: profile?.fabrication ?? null,
    profileFamily: profile?.family ?? null,
    depth_mm: profile ? overallDepth_mm(profile) : null,
    webThickness_mm: profile ? webThickness_mm(profile) : null,
    flangeWidth_mm: profile ? (profile.family === 'I' ? profile.topFlange.width_mm : overallWidth_mm(profile)) : null,
    flangeThickness_mm: profile ? flangeThickness_mm(profile) : null,
    grade: record.material?.grade ?? null,
    fy_MPa: record.material?.fy_MPa ?? null,
    gradeAssumed: record.material ? record.material.assumed : null,
    length_mm: record.length_mm,
    flags: record.flags,
  };
}
