/**
 * Pairs the member keys of a results file with the members of an IFC model. The analysis model and the IFC model are
 * authored apart, so keys are tried, in order, as GlobalId, Tag and Name, and then by geometry: the analysis member's
 * two end points both lie within a tolerance of the IFC member's axis (so an analysis member split at intermediate
 * nodes still finds its beam). Manual matches, kept by GlobalId, come first and survive new revisions.
 * Every match records how it was made. Pure: plain data in, a report out.
 */
import type { MemberStatus, Point3_mm } from '../ifc/model-read-result';
import { type AxisSegment, AxisGrid } from './axis-grid';
import type { MemberKeyKind } from './column-mapping';

export type MatchMethod = 'globalId' | 'tag' | 'name' | 'geometry' | 'manual';

export interface MatchableMember {
  globalId: string;
  tag: string | null;
  name: string | null;
  axis: AxisSegment | null;
  /** Not-applicable members (tubes, angles…) may take results but are not expected to. */
  status?: MemberStatus;
}

export interface MatchableKey {
  memberKey: string;
  /** Analysis member end points, in millimetres of the results file's coordinate system. */
  end1_mm?: Point3_mm;
  end2_mm?: Point3_mm;
}

export interface GeometryMatchOptions {
  /** Largest distance of either analysis end point from the IFC axis. */
  tolerance_mm: number;
  /** Multiplies analysis coordinates (after their unit conversion), for models drawn at another scale. */
  scale?: number;
  /** Added after scaling, to move the analysis origin onto the IFC model's. */
  offset_mm?: Point3_mm;
}

export interface ManualMatch {
  memberKey: string;
  globalId: string;
}

export interface MatchOptions {
  /** Which text rule the keys follow; 'auto' (default) tries GlobalId, Tag, then Name. */
  keyKind?: MemberKeyKind;
  geometry?: GeometryMatchOptions;
  manual?: readonly ManualMatch[];
  /** Below this share of matched keys the file is probably for another model (default 0.2). */
  otherModelThreshold?: number;
}

export interface MemberMatch {
  memberKey: string;
  globalId: string;
  method: MatchMethod;
  /** Geometry matches: the larger distance of the two analysis end points from the IFC axis. */
  distance_mm?: number;
}

export interface AmbiguousMatch {
  memberKey: string;
  /** The rule that found several members. */
  method: MatchMethod;
  /** GlobalIds of the candidates (the first MAX_CANDIDATES), and how many there were. */
  candidates: string[];
  candidateCount: number;
}

export interface MatchCounts {
  keys: number;
  matched: number;
  ambiguous: number;
  unmatched: number;
  byMethod: Record<MatchMethod, number>;
  /** Members expected to take results (all but not-applicable ones). */
  members: number;
  membersWithResults: number;
  /** Members that take results from more than one key (an analysis member split in pieces). */
  membersWithSeveralKeys: number;
}

export interface MatchReport {
  matched: MemberMatch[];
  ambiguous: AmbiguousMatch[];
  /** Keys that matched no member. */
  unmatchedKeys: string[];
  /** GlobalIds of members expected to take results that no key reached. */
  membersWithoutResults: string[];
  /** Manual matches whose member is not in this model (or whose key is not in this file): kept, not applied. */
  staleManual: ManualMatch[];
  counts: MatchCounts;
  /** Matched keys over all keys. */
  matchedShare: number;
  /** Almost nothing matched: the results are probably for another model. Warn before running a check. */
  likelyOtherModel: boolean;
}

export const DEFAULT_OTHER_MODEL_THRESHOLD = 0.2;
export const MAX_CANDIDATES = 20;

type TextRule = 'globalId' | 'tag' | 'name';
const TEXT_RULES: Readonly<Record<MemberKeyKind, readonly TextRule[]>> = {
  auto: ['globalId', 'tag', 'name'],
  globalId: ['globalId'],
  tag: ['tag'],
  name: ['name'],
};

/** Outcome of one key: matched, ambiguous with candidates (member indices), or nothing. */
type KeyOutcome =
  | { kind: 'matched'; member: number; method: MatchMethod; distance_mm?: number }
  | { kind: 'ambiguous'; members: number[]; method: MatchMethod }
  | { kind: 'none' };

export function matchResultsToMembers(
  keys: readonly MatchableKey[],
  members: readonly MatchableMember[],
  options: MatchOptions = {},
): MatchReport {
  const textIndex = buildTextIndex(members);
  const manual = manualIndex(options.manual ?? [], members, keys);
  const geometry = options.geometry && geometryMatcher(members, options.geometry);
  const rules = TEXT_RULES[options.keyKind ?? 'auto'];

  const matched: MemberMatch[] = [];
  const ambiguous: AmbiguousMatch[] = [];
  const unmatchedKeys: string[] = [];
  const keysPerMember = new Map<number, number>();
  for (const key of keys) {
    const manualMember = manual.applied.get(key.memberKey);
    const outcome: KeyOutcome =
      manualMember === undefined ? matchKey(key, rules, textIndex, geometry) : { kind: 'matched', member: manualMember, method: 'manual' };
    if (outcome.kind === 'matched') {
      const { member, method, distance_mm } = outcome;
      matched.push({ memberKey: key.memberKey, globalId: members[member].globalId, method, ...(distance_mm !== undefined && { distance_mm }) });
      keysPerMember.set(member, (keysPerMember.get(member) ?? 0) + 1);
    } else if (outcome.kind === 'ambiguous') {
      ambiguous.push({
        memberKey: key.memberKey,
        method: outcome.method,
        candidates: outcome.members.slice(0, MAX_CANDIDATES).map((index) => members[index].globalId),
        candidateCount: outcome.members.length,
      });
    } else {
      unmatchedKeys.push(key.memberKey);
    }
  }

  const expected = members.flatMap((member, index) => (member.status === 'not-applicable' ? [] : [index]));
  const membersWithoutResults = expected.filter((index) => !keysPerMember.has(index)).map((index) => members[index].globalId);
  const matchedShare = keys.length === 0 ? 0 : matched.length / keys.length;
  return {
    matched,
    ambiguous,
    unmatchedKeys,
    membersWithoutResults,
    staleManual: manual.stale,
    counts: {
      keys: keys.length,
      matched: matched.length,
      ambiguous: ambiguous.length,
      unmatched: unmatchedKeys.length,
      byMethod: countByMethod(matched),
      members: expected.length,
      membersWithResults: expected.length - membersWithoutResults.length,
      membersWithSeveralKeys: [...keysPerMember.values()].filter((count) => count > 1).length,
    },
    matchedShare,
    likelyOtherModel: keys.length > 0 && matchedShare < (options.otherModelThreshold ?? DEFAULT_OTHER_MODEL_THRESHOLD),
  };
}

/**
 * The first text rule that finds any member decides; several candidates are narrowed by geometry when the key has
 * end points. Keys no text rule finds go to geometry alone.
 */
function matchKey(
  key: MatchableKey,
  rules: readonly TextRule[],
  textIndex: TextIndex,
  geometry: GeometryMatcher | undefined,
): KeyOutcome {
  const near = geometry && key.end1_mm && key.end2_mm ? geometry(key.end1_mm, key.end2_mm) : undefined;
  for (const rule of rules) {
    const found = textIndex.lookup(rule, key.memberKey);
    if (found.length === 0) continue;
    if (found.length === 1) return { kind: 'matched', member: found[0], method: rule };
    const narrowed = near ? near.filter((hit) => found.includes(hit.member)) : [];
    if (narrowed.length === 1) return { kind: 'matched', member: narrowed[0].member, method: 'geometry', distance_mm: narrowed[0].distance_mm };
    return { kind: 'ambiguous', members: narrowed.length > 1 ? narrowed.map((hit) => hit.member) : found, method: rule };
  }
  if (!near || near.length === 0) return { kind: 'none' };
  if (near.length === 1) return { kind: 'matched', member: near[0].member, method: 'geometry', distance_mm: near[0].distance_mm };
  return { kind: 'ambiguous', members: near.map((hit) => hit.member), method: 'geometry' };
}

// --- Text rules ----------------------------------------------------------------------------------------------------

interface TextIndex {
  /** Member indices whose field equals the key: exactly first, then ignoring case (never for GlobalIds, whose case is meaningful). */
  lookup(rule: TextRule, key: string): number[];
}

function buildTextIndex(members: readonly MatchableMember[]): TextIndex {
  const exact: Record<TextRule, Map<string, number[]>> = { globalId: new Map(), tag: new Map(), name: new Map() };
  const folded: Record<'tag' | 'name', Map<string, number[]>> = { tag: new Map(), name: new Map() };
  members.forEach((member, index) => {
    add(exact.globalId, member.globalId.trim(), index);
    for (const rule of ['tag', 'name'] as const) {
      const value = member[rule]?.trim();
      if (!value) continue;
      add(exact[rule], value, index);
      add(folded[rule], value.toLowerCase(), index);
    }
  });
  return {
    lookup(rule, key) {
      const hits = exact[rule].get(key);
      if (hits || rule === 'globalId') return hits ?? [];
      return folded[rule].get(key.toLowerCase()) ?? [];
    },
  };
}

function add(index: Map<string, number[]>, value: string, member: number): void {
  const list = index.get(value);
  if (list) list.push(member);
  else index.set(value, [member]);
}

// --- Manual matches ------------------------------------------------------------------------------------------------

function manualIndex(
  manual: readonly ManualMatch[],
  members: readonly MatchableMember[],
  keys: readonly MatchableKey[],
): { applied: Map<string, number>; stale: ManualMatch[] } {
  const memberByGlobalId = new Map(members.map((member, index) => [member.globalId, index]));
  const keyNames = new Set(keys.map((key) => key.memberKey));
  const applied = new Map<string, number>();
  const stale: ManualMatch[] = [];
  for (const match of manual) {
    const member = memberByGlobalId.get(match.globalId);
    if (member === undefined || !keyNames.has(match.memberKey)) stale.push(match);
    else applied.set(match.memberKey, member);
  }
  return { applied, stale };
}

// --- Geometry ------------------------------------------------------------------------------------------------------

interface GeometryHit {
  member: number;
  distance_mm: number;
}

/** Members whose axis passes within tolerance of both end points, best first. */
type GeometryMatcher = (end1_mm: Point3_mm, end2_mm: Point3_mm) => GeometryHit[];

function geometryMatcher(members: readonly MatchableMember[], options: GeometryMatchOptions): GeometryMatcher {
  const { tolerance_mm } = options;
  if (!(tolerance_mm > 0) || !Number.isFinite(tolerance_mm)) {
    throw new RangeError(`The geometry tolerance must be a positive number of millimetres, got ${tolerance_mm}.`);
  }
  const scale = options.scale ?? 1;
  const offset = options.offset_mm ?? [0, 0, 0];
  const axes = members.map((member) => member.axis);
  const grid = new AxisGrid(axes, tolerance_mm);
  const toModel = (point: Point3_mm): Point3_mm => [
    point[0] * scale + offset[0],
    point[1] * scale + offset[1],
    point[2] * scale + offset[2],
  ];
  return (end1, end2) => {
    const nearB = new Map(grid.near(toModel(end2)).map((hit) => [hit.index, hit.distance_mm]));
    return grid
      .near(toModel(end1))
      .filter((hit) => nearB.has(hit.index))
      .map((hit) => ({ member: hit.index, distance_mm: Math.max(hit.distance_mm, nearB.get(hit.index)!) }))
      .sort((x, y) => x.distance_mm - y.distance_mm);
  };
}

function countByMethod(matched: readonly MemberMatch[]): Record<MatchMethod, number> {
  const counts: Record<MatchMethod, number> = { globalId: 0, tag: 0, name: 0, geometry: 0, manual: 0 };
  for (const match of matched) counts[match.method]++;
  return counts;
}
