/**
 * The web thickness a section would need to carry a shear force, all other dimensions kept: the answer to "how much
 * thicker must this web be?". Capacity grows with tw under both standards, so bisection finds the threshold.
 */
import { type CheckParams, type MaterialInput, prepareCapacity, type Standard, utilisationOf } from './check';
import { EngineInputError } from './input-error';
import type { ISectionInput } from './section';

/** Bisection stops when the bracket is narrower than this (far below any plate tolerance). */
const TOLERANCE_MM = 1e-3;

function utilisationWithWeb(section: ISectionInput, tw_mm: number, material: MaterialInput, standard: Standard, params: CheckParams, shear_N: number): number {
  return utilisationOf(prepareCapacity({ ...section, webThickness_mm: tw_mm }, material, standard, params), shear_N);
}

/**
 * Smallest web thickness with utilisation ≤ `targetUtilisation` (default 1.0), or null when even the thickest web
 * that fits between the root fillets is not enough. Throws EngineInputError for bad input.
 */
export function requiredWebThickness_mm(
  section: ISectionInput,
  material: MaterialInput,
  standard: Standard,
  shear_N: number,
  params: CheckParams = {},
  targetUtilisation = 1,
): number | null {
  if (!Number.isFinite(shear_N)) throw new EngineInputError('shear_N', `shear_N must be a finite number of newtons, got ${shear_N}`);
  if (!(targetUtilisation > 0 && targetUtilisation <= 1)) {
    throw new EngineInputError('targetUtilisation', `targetUtilisation must be in (0, 1], got ${targetUtilisation}`);
  }
  prepareCapacity(section, material, standard, params); // validates everything once, with the caller's field names
  if (shear_N === 0) return 0;
  // The web cannot grow past the point where the root fillets no longer fit on the narrower flange.
  const room = (f: ISectionInput['topFlange']): number => f.width_mm - 2 * f.filletRadius_mm;
  let hi = Math.min(room(section.topFlange), room(section.bottomFlange)) * (1 - 1e-9);
  let lo = Math.min(section.webThickness_mm, hi) * 1e-3;
  if (utilisationWithWeb(section, hi, material, standard, params, shear_N) > targetUtilisation) return null;
  if (utilisationWithWeb(section, lo, material, standard, params, shear_N) <= targetUtilisation) return lo;
  while (hi - lo > TOLERANCE_MM) {
    const mid = (lo + hi) / 2;
    if (utilisationWithWeb(section, mid, material, standard, params, shear_N) <= targetUtilisation) hi = mid;
    else lo = mid;
  }
  return hi;
}
