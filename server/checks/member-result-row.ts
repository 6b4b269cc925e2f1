/**
 * A member's outcome in a check run as it is stored: the table's columns (check_member_result), and the engine result
 * without its per-combination list plus that list in a compact form (check_member_detail: combinations by index into
 * the run's list, the analysis member keys listed once). Where the results give only Vz, utilisations are not stored
 * per combination (|VEd| / VRd gives them back); where they give Vy or moments too, the utilisation of each axis is
 * stored per combination with the minor-axis shear: two or three numbers more per combination, only for such members.
 */
import type { MemberRecord } from '../ifc/model-read-result';
import type { CombinationCheck, MemberCheck } from './check-run-compute';
import type { CheckMemberDetail } from './check-member-detail.entity';
import type { CheckMemberResult } from './check-member-result.entity';
import type { ResultStatus } from './checks-api-types';

/** A member's two stored rows without their run id. */
export type MemberResultRow = Omit<CheckMemberResult, 'runId' | 'run'> & Pick<CheckMemberDetail, 'detail' | 'combinations'>;

interface CompactCombinations {
  /** Combination index, signed VEd in N, station in mm (null when none) and file row, per combination. */
  c: number[];
  v: number[];
  s: (number | null)[];
  r: number[];
  /** Distinct analysis member keys; `k` gives each combination's key when there are several. */
  keys: string[];
  k?: number[];
  /** Per combination, when the member has more than Vz: utilisation of the major and of the minor axis, and Vy in N. */
  u?: number[];
  n?: (number | null)[];
  w?: (number | null)[];
}

/** Column order of the two stored rows after their run id, for bulk inserts. */
export const MEMBER_RESULT_COLUMNS = [
  'ordinal',
  'globalId',
  'tag',
  'name',
  'storey',
  'profileName',
  'grade',
  'status',
  'governingCombination',
  'governingAxis',
  'governingCheck',
  'VEd_kN',
  'VRd_kN',
  'utilisation',
  'tauMax_MPa',
  'tauAvgWeb_MPa',
  'flags',
  'search',
] as const satisfies readonly (keyof CheckMemberResult)[];
export const MEMBER_DETAIL_COLUMNS = ['ordinal', 'detail', 'combinations'] as const satisfies readonly (keyof CheckMemberDetail)[];

/** The values of both rows in column order, as the database stores them (simple-json columns as JSON text). */
export function memberResultValues(row: MemberResultRow): { result: unknown[]; detail: unknown[] } {
  const stored = (column: keyof MemberResultRow) => (column === 'flags' || column === 'detail' ? JSON.stringify(row[column]) : row[column]);
  return { result: MEMBER_RESULT_COLUMNS.map(stored), detail: MEMBER_DETAIL_COLUMNS.map(stored) };
}

export function resultStatusOf(check: Pick<MemberCheck, 'status' | 'warning'>): ResultStatus {
  return check.status === 'pass' && check.warning ? 'warning' : check.status;
}

export function memberResultRow(
  ordinal: number,
  member: Pick<MemberRecord, 'tag' | 'name' | 'storey' | 'profile'>,
  check: MemberCheck,
  combinationIndex: ReadonlyMap<string, number>,
): MemberResultRow {
  const { combinations, ...detail } = check;
  const governing = check.governing;
  return {
    ordinal,
    globalId: check.globalId,
    tag: member.tag,
    name: member.name,
    storey: member.storey,
    profileName: member.profile?.name || null,
    grade: check.grade,
    status: resultStatusOf(check),
    governingCombination: governing?.combination ?? null,
    governingAxis: governing?.axis ?? null,
    governingCheck: governing?.check ?? null,
    VEd_kN: governing ? governing.VEd_N / 1000 : null,
    VRd_kN: governing ? governing.VRd_N / 1000 : null,
    utilisation: governing?.utilisation ?? null,
    tauMax_MPa: governing?.tauMax_MPa ?? null,
    tauAvgWeb_MPa: governing?.tauAvgWeb_MPa ?? null,
    flags: check.flags,
    search: searchTextOf([check.globalId, member.tag, member.name, member.profile?.name ?? null]),
    detail,
    combinations: JSON.stringify(compactCombinations(combinations, combinationIndex)),
  };
}

/** What the text filter looks in: the words joined, lower case (the filter lower-cases its text the same way). */
export function searchTextOf(parts: readonly (string | null)[]): string {
  return parts
    .filter((part): part is string => !!part)
    .join('\n')
    .toLowerCase();
}

function compactCombinations(combinations: readonly CombinationCheck[], combinationIndex: ReadonlyMap<string, number>): CompactCombinations {
  const keys = [...new Set(combinations.map((combination) => combination.memberKey))];
  const compact: CompactCombinations = {
    c: combinations.map((combination) => combinationIndex.get(combination.combination)!),
    v: combinations.map((combination) => combination.VEd_N),
    s: combinations.map((combination) => combination.station_mm ?? null),
    r: combinations.map((combination) => combination.row),
    keys,
  };
  if (keys.length > 1) compact.k = combinations.map((combination) => keys.indexOf(combination.memberKey));
  if (combinations.some((combination) => combination.byAxis)) {
    compact.u = combinations.map((combination) => combination.byAxis?.major ?? combination.utilisation);
    compact.n = combinations.map((combination) => combination.byAxis?.minor ?? null);
    if (combinations.some((combination) => combination.minorVEd_N !== undefined)) compact.w = combinations.map((combination) => combination.minorVEd_N ?? null);
  }
  return compact;
}

/** The per-combination list of a stored row, as the run computed it. */
export function combinationsOf(row: Pick<CheckMemberDetail, 'combinations' | 'detail'>, runCombinations: readonly string[]): CombinationCheck[] {
  const compact = JSON.parse(row.combinations) as CompactCombinations;
  const VRd_N = row.detail.governing?.VRd_N;
  if (VRd_N === undefined) return [];
  return compact.c.map((index, i) => {
    const major = compact.u?.[i];
    const minor = compact.n?.[i] ?? null;
    const minorVEd_N = compact.w?.[i] ?? null;
    return {
      combination: runCombinations[index],
      VEd_N: compact.v[i],
      utilisation: major === undefined ? Math.abs(compact.v[i]) / VRd_N : minor !== null && minor > major ? minor : major,
      ...(compact.s[i] !== null && { station_mm: compact.s[i]! }),
      row: compact.r[i],
      memberKey: compact.keys[compact.k?.[i] ?? 0],
      ...(major !== undefined && { byAxis: { major, minor } }),
      ...(minorVEd_N !== null && { minorVEd_N }),
    };
  });
}

/** The engine's MemberCheck back from a stored row. */
export function memberCheckOf(row: Pick<CheckMemberDetail, 'combinations' | 'detail'>, runCombinations: readonly string[]): MemberCheck {
  return { ...row.detail, combinations: combinationsOf(row, runCombinations) };
}
