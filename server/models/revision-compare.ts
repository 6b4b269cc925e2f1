/**
 * Compares two revisions' members by GlobalId: added, removed, and changed in section, grade, fabrication, length or
 * position. Differences within the tolerances are modelling noise (re-exported coordinates, rounding), not changes.
 */
import { dimensionValues, dimensionsLabel } from '../engine/section-family';
import { type MemberProfile, type MemberRecord, type Point3_mm, sectionDimensionsOf } from '../ifc/model-read-result';
import { type MemberRow, memberRowOf } from './member-row';

/** Our product tolerances, in millimetres: common practice, no source. */
export const COMPARE_TOLERANCES = {
  /** Section dimensions (depth, widths, thicknesses, fillet radii). */
  dimension_mm: 0.05,
  length_mm: 1,
  /** How far either end of the member axis may move. */
  position_mm: 5,
} as const;

export type ChangedField = 'section' | 'grade' | 'fabrication' | 'length' | 'position';

export interface FieldChange {
  field: ChangedField;
  from: unknown;
  to: unknown;
}

export interface ChangedMember {
  globalId: string;
  tag: string | null;
  name: string | null;
  changes: FieldChange[];
}

export interface RevisionComparison {
  added: MemberRow[];
  removed: MemberRow[];
  changed: ChangedMember[];
  unchanged: number;
}

const round = (value: number, decimals: number): number => Math.round(value * 10 ** decimals) / 10 ** decimals;

function sameSection(a: MemberProfile | null, b: MemberProfile | null): boolean {
  if (!a || !b) return a === b;
  if (a.name !== b.name || a.family !== b.family) return false;
  // Every dimension, flanges, radii and slopes included: the same fields within the tolerance.
  const da = dimensionValues(sectionDimensionsOf(a));
  const db = dimensionValues(sectionDimensionsOf(b));
  const keys = Object.keys(da);
  return keys.length === Object.keys(db).length && keys.every((key) => key in db && Math.abs(da[key] - db[key]) <= COMPARE_TOLERANCES.dimension_mm);
}

/** The name, and the dimensions when the name alone would not show the change. */
function sectionLabel(profile: MemberProfile | null, withDimensions: boolean): string | null {
  if (!profile) return null;
  const name = profile.name || profile.ifcType;
  return withDimensions ? `${name} (${dimensionsLabel(sectionDimensionsOf(profile))} mm)` : name;
}

const distance = (a: Point3_mm, b: Point3_mm): number => Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);

/** How far the axis moved: the larger end movement, allowing for an axis drawn the other way round. */
function axisMovement(a: NonNullable<MemberRecord['axis']>, b: NonNullable<MemberRecord['axis']>): number {
  const same = Math.max(distance(a.start_mm, b.start_mm), distance(a.end_mm, b.end_mm));
  const reversed = Math.max(distance(a.start_mm, b.end_mm), distance(a.end_mm, b.start_mm));
  return Math.min(same, reversed);
}

function roundedAxis(axis: MemberRecord['axis']) {
  if (!axis) return null;
  const point = (p: Point3_mm): Point3_mm => [round(p[0], 0), round(p[1], 0), round(p[2], 0)];
  return { start_mm: point(axis.start_mm), end_mm: point(axis.end_mm) };
}

export function memberChanges(before: MemberRecord, after: MemberRecord): FieldChange[] {
  const changes: FieldChange[] = [];
  if (!sameSection(before.profile, after.profile)) {
    const namesEqual = before.profile?.name === after.profile?.name;
    changes.push({ field: 'section', from: sectionLabel(before.profile, namesEqual), to: sectionLabel(after.profile, namesEqual) });
  }
  const gradeBefore = before.material?.grade ?? null;
  const gradeAfter = after.material?.grade ?? null;
  if (gradeBefore !== gradeAfter) changes.push({ field: 'grade', from: gradeBefore, to: gradeAfter });
  if (before.profile && after.profile && before.profile.fabrication !== after.profile.fabrication) {
    changes.push({ field: 'fabrication', from: before.profile.fabrication, to: after.profile.fabrication });
  }
  const lengthChanged =
    before.length_mm === null || after.length_mm === null
      ? before.length_mm !== after.length_mm
      : Math.abs(before.length_mm - after.length_mm) > COMPARE_TOLERANCES.length_mm;
  if (lengthChanged) {
    const rounded = (v: number | null) => (v === null ? null : round(v, 1));
    changes.push({ field: 'length', from: rounded(before.length_mm), to: rounded(after.length_mm) });
  }
  const moved =
    before.axis === null || after.axis === null ? before.axis !== after.axis : axisMovement(before.axis, after.axis) > COMPARE_TOLERANCES.position_mm;
  if (moved) changes.push({ field: 'position', from: roundedAxis(before.axis), to: roundedAxis(after.axis) });
  return changes;
}

/** By GlobalId; a GlobalId written twice in one file counts once (its first member). */
function byGlobalId(records: readonly MemberRecord[]): Map<string, MemberRecord> {
  const map = new Map<string, MemberRecord>();
  for (const record of records) if (!map.has(record.globalId)) map.set(record.globalId, record);
  return map;
}

export function compareRevisions(from: readonly MemberRecord[], to: readonly MemberRecord[]): RevisionComparison {
  const before = byGlobalId(from);
  const after = byGlobalId(to);
  const result: RevisionComparison = { added: [], removed: [], changed: [], unchanged: 0 };
  for (const [globalId, record] of after) {
    const previous = before.get(globalId);
    if (!previous) {
      result.added.push(memberRowOf(record));
      continue;
    }
    const changes = memberChanges(previous, record);
    if (changes.length === 0) result.unchanged++;
    else result.changed.push({ globalId, tag: record.tag, name: record.name, changes });
  }
  for (const [globalId, record] of before) if (!after.has(globalId)) result.removed.push(memberRowOf(record));
  return result;
}
