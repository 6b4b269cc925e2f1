/**
 * The two shear axes of a section in its local frame (section-family.ts): 'major' = shear force parallel to y (the
 * web(s) of an I, channel, tee or box), bending about x; 'minor' = shear force parallel to x (the flanges), bending
 * about y. The names of the checks are the words the run, the sheet, the CSV and the BCF use.
 */
import type { SectionPolygon } from './section-family';
import { quarterTurn } from './section-polygon';

export type ShearAxis = 'major' | 'minor';
export const SHEAR_AXES: readonly ShearAxis[] = ['major', 'minor'];

export type FamilyCheckName = 'major-axis shear' | 'minor-axis shear' | 'shear with bending';

export const SHEAR_CHECK_NAMES: Readonly<Record<ShearAxis, FamilyCheckName>> = {
  major: 'major-axis shear',
  minor: 'minor-axis shear',
};

/**
 * The outline turned so that the shear force of `axis` is parallel to its y: unchanged for 'major'; a quarter turn
 * counter-clockwise for 'minor' ((x, y) → (−y, x)), which keeps loop orientations, so the new y is the old x.
 */
export function outlineAlongShear(p: SectionPolygon, axis: ShearAxis): SectionPolygon {
  return axis === 'major' ? p : quarterTurn(p, 1);
}

/** A code rule for one family and axis, or the plain reason why the code gives none (never a guess). */
export type ShearRule<T> = { applicable: true; capacity: T } | { applicable: false; reason: string };
