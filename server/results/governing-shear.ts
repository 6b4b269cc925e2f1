/**
 * Governing shear per member and load combination: the largest |V| over the stations, kept with its sign, station and
 * row so the calculation sheet can say where it came from. Collected from the row stream, so only one value per
 * (member key, combination) is held, never the rows.
 */
import type { MemberMatch } from './member-matching';
import type { ResultRow } from './result-row';

export interface GoverningShear {
  combination: string;
  /** Signed as exported; the check uses |shear_N|. */
  shear_N: number;
  station_mm?: number;
  /** Row of the file it came from, and the analysis member key (several keys may feed one IFC member). */
  row: number;
  memberKey: string;
}

type PerCombination = Map<string, GoverningShear>;

export class GoverningShearCollector {
  private readonly byKey = new Map<string, PerCombination>();

  /** A results sink: pass it to readResults (bound, so `collector.add` can be handed over as is). */
  readonly add = (batch: readonly ResultRow[]): void => {
    for (const row of batch) {
      const { memberKey, combination, shear_N, station_mm } = row;
      keepLarger(entryOf(this.byKey, memberKey), { combination, shear_N, station_mm, row: row.row, memberKey });
    }
  };

  /** Governing values per member key, combinations in file order. */
  perKey(): Map<string, GoverningShear[]> {
    return listed(this.byKey);
  }
}

/**
 * Governing values per IFC member (by GlobalId) from the matched keys. Where several analysis members feed one IFC
 * member, each combination keeps the largest |V| among them.
 */
export function governingShearsByMember(
  perKey: ReadonlyMap<string, readonly GoverningShear[]>,
  matches: readonly MemberMatch[],
): Map<string, GoverningShear[]> {
  const byMember = new Map<string, PerCombination>();
  for (const match of matches) {
    for (const shear of perKey.get(match.memberKey) ?? []) keepLarger(entryOf(byMember, match.globalId), shear);
  }
  return listed(byMember);
}

function entryOf(outer: Map<string, PerCombination>, key: string): PerCombination {
  let perCombination = outer.get(key);
  if (!perCombination) {
    perCombination = new Map();
    outer.set(key, perCombination);
  }
  return perCombination;
}

/** Keeps the first of equal magnitudes, so the result does not depend on the sign convention. */
function keepLarger(perCombination: PerCombination, shear: GoverningShear): void {
  const current = perCombination.get(shear.combination);
  if (!current || Math.abs(shear.shear_N) > Math.abs(current.shear_N)) perCombination.set(shear.combination, shear);
}

function listed(outer: Map<string, PerCombination>): Map<string, GoverningShear[]> {
  return new Map([...outer].map(([key, perCombination]) => [key, [...perCombination.values()]]));
}
