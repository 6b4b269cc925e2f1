/**
 * Corner radii of rectangular and square hollow sections as the product standards set them for section properties,
 * and the box and tube dimensions built from them. For cold-formed sections the inner radius is the outer one less
 * the wall (common practice, no source); hot-finished ones have their own inner radius.
 */
import type { BoxDimensions, TubeDimensions } from '../engine/section-family';

export interface CornerRadii {
  outer_mm: number;
  inner_mm: number;
}

/**
 * AS/NZS 1163 cold-formed, as the Australian makers' tables compute properties: outer 2t up to 3 mm, 2.5t above
 * (from memory; the tabulated masses of 50x50x3.0 and 100x100x6.0 SHS confirm it, see the spec).
 */
export function asnzs1163Corners(wall_mm: number): CornerRadii {
  const outer_mm = wall_mm <= 3 ? 2 * wall_mm : 2.5 * wall_mm;
  return { outer_mm, inner_mm: outer_mm - wall_mm };
}

/**
 * EN 10219-2 cold-formed: outer 2t for t ≤ 6 mm, 2.5t for 6 < t ≤ 10 mm, 3t above (from memory; the listed areas of
 * every EN 10219 row in the spec confirm it).
 */
export function en10219Corners(wall_mm: number): CornerRadii {
  const outer_mm = wall_mm <= 6 ? 2 * wall_mm : wall_mm <= 10 ? 2.5 * wall_mm : 3 * wall_mm;
  return { outer_mm, inner_mm: outer_mm - wall_mm };
}

/** EN 10210-2 hot-finished: outer 1.5t, inner 1.0t (from memory; confirmed by the listed areas in the spec). */
export function en10210Corners(wall_mm: number): CornerRadii {
  return { outer_mm: 1.5 * wall_mm, inner_mm: wall_mm };
}

export function hollowBox(depth_mm: number, width_mm: number, wall_mm: number, corners: CornerRadii): BoxDimensions {
  return {
    family: 'box',
    depth_mm,
    width_mm,
    webThickness_mm: wall_mm,
    flangeThickness_mm: wall_mm,
    outerCornerRadius_mm: corners.outer_mm,
    innerCornerRadius_mm: corners.inner_mm,
  };
}

export function tube(diameter_mm: number, wallThickness_mm: number): TubeDimensions {
  return { family: 'tube', diameter_mm, wallThickness_mm };
}
