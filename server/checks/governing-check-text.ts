/**
 * The governing check of a member in words, one text for the results table, the command line and BCF topics: the
 * check's name, with its axis where the name does not say it ('shear with bending, minor axis').
 */
import type { FamilyCheckName, ShearAxis } from '../engine/shear-axis';

export function governingCheckText(axis: ShearAxis | null | undefined, check: FamilyCheckName | null | undefined): string | null {
  if (!check) return null;
  return check === 'shear with bending' && axis ? `${check}, ${axis} axis` : check;
}
