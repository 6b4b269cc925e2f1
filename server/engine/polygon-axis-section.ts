/**
 * A section outline seen along one shear axis: area, neutral axis, second moment, elastic and plastic moduli, and the
 * two functions of the elastic shear-stress method, the first moment Q(s) of the part beyond a cut and the total cut
 * width b(s) (both webs of a box, both walls of a tube). s is the coordinate along the shear force (y of the outline
 * turned by outlineAlongShear), in millimetres.
 *
 * Q(s) is exact for the polygon: the part beyond the cut is the outline clipped by the line (Sutherland–Hodgman
 * against one half-plane, which stays exact for non-convex loops: the bridges it leaves along the cut enclose no
 * area), measured with the Green's-theorem sums of section-polygon.ts. Arcs are chords there, fine enough by the
 * outline's chord tolerance. b(s) is read without sorting: for a counter-clockwise outer loop and clockwise voids,
 * Σ sign(Δy)·x over the edges crossing the cut is the solid width.
 */
import { SectionInputError } from './section';
import type { Point2_mm, SectionPolygon } from './section-family';
import { normalisePolygon, polygonProperties } from './section-polygon';
import { outlineAlongShear, type ShearAxis } from './shear-axis';

type Loop = readonly Point2_mm[];
export type CutSide = 'below' | 'above';

export interface PolygonAxisSection {
  readonly axis: ShearAxis;
  /** The outline turned so the shear force is parallel to its y; s levels are its y values. */
  readonly polygon: SectionPolygon;
  readonly area_mm2: number;
  /** Level of the centroid (elastic neutral axis of bending about the axis normal to the shear). */
  readonly neutralAxis_mm: number;
  /** Second moment about the elastic neutral axis. */
  readonly i_mm4: number;
  /** Product of area in the turned frame; the shear formula assumes it is (near) zero. */
  readonly ixy_mm4: number;
  /** True when the bending axis is a principal axis (|Ixy| ≤ 1e-6·√(Ix·Iy)), as V·Q/(I·b) assumes. */
  readonly principal: boolean;
  readonly from_mm: number;
  readonly to_mm: number;
  /** Distinct levels of the horizontal edges, ascending: where b(s) jumps (the flange faces of an I or a box). */
  readonly jumpLevels_mm: readonly number[];
  /** Elastic modulus I / (largest distance of a fibre from the neutral axis). */
  readonly elasticModulus_mm3: number;
  /** Level that halves the area, and the plastic modulus about it: Σ|s − s_pl|·dA. */
  readonly plasticNeutralAxis_mm: number;
  readonly plasticModulus_mm3: number;
  /** Q(s) about the neutral axis of the part beyond the cut at s, ≥ 0. */
  firstMoment_mm3(s_mm: number): number;
  /** Total solid width along the cut at s; at a level where it jumps, `side` picks the value. */
  widthAt_mm(s_mm: number, side?: CutSide): number;
}

/** Area and ∫s dA of the loops clipped to the half-plane s ≥ level (loops oriented: voids count negative). */
function momentsAbove(loops: readonly Loop[], level_mm: number): { area: number; first: number } {
  let twiceArea = 0;
  let sixFirst = 0;
  for (const loop of loops) {
    const clipped: Point2_mm[] = [];
    for (let i = 0; i < loop.length; i++) {
      const a = loop[i];
      const b = loop[(i + 1) % loop.length];
      const aIn = a[1] >= level_mm;
      if (aIn) clipped.push(a);
      if (aIn !== b[1] >= level_mm) {
        const t = (level_mm - a[1]) / (b[1] - a[1]);
        clipped.push([a[0] + t * (b[0] - a[0]), level_mm]);
      }
    }
    for (let i = 0; i < clipped.length; i++) {
      const [x0, y0] = clipped[i];
      const [x1, y1] = clipped[(i + 1) % clipped.length];
      const c = x0 * y1 - x1 * y0;
      twiceArea += c;
      sixFirst += c * (y0 + y1);
    }
  }
  return { area: twiceArea / 2, first: sixFirst / 6 };
}

function cutWidth(loops: readonly Loop[], s_mm: number, side: CutSide): number {
  let width = 0;
  for (const loop of loops) {
    for (let i = 0; i < loop.length; i++) {
      const a = loop[i];
      const b = loop[(i + 1) % loop.length];
      const lo = Math.min(a[1], b[1]);
      const hi = Math.max(a[1], b[1]);
      const spans = side === 'above' ? lo <= s_mm && s_mm < hi : lo < s_mm && s_mm <= hi;
      if (!spans) continue;
      const x = a[0] + ((s_mm - a[1]) / (b[1] - a[1])) * (b[0] - a[0]);
      width += b[1] > a[1] ? x : -x;
    }
  }
  return width;
}

/**
 * The outline measured along the shear axis. Throws SectionInputError with the reason when the outline cannot be
 * measured (open, crossing, no area).
 */
export function polygonAxisSection(outline: SectionPolygon, axis: ShearAxis): PolygonAxisSection {
  const normalised = normalisePolygon(outline);
  if (normalised.status === 'invalid') throw new SectionInputError('outline', normalised.reason);
  const polygon = outlineAlongShear(normalised.polygon, axis);
  const loops: Loop[] = [polygon.outer, ...polygon.voids];
  const props = polygonProperties(polygon);
  const area = props.area_mm2;
  const na = props.centroid_mm[1];
  const { minY_mm: from, maxY_mm: to } = props.bounds;
  const eps = 1e-9 * (to - from);
  const flat = loops.flatMap((loop) => loop.filter((p, i) => Math.abs(loop[(i + 1) % loop.length][1] - p[1]) <= eps).map((p) => p[1]));
  const levels = [...new Set(flat)].sort((a, b) => a - b);
  const jumps = levels.filter((y, i) => i === 0 || y - levels[i - 1] > eps);

  // Plastic neutral axis: bisection on the area above, which falls monotonically with the level.
  let lo = from;
  let hi = to;
  for (let k = 0; k < 200 && hi - lo > 1e-12 * (to - from); k++) {
    const mid = (lo + hi) / 2;
    if (momentsAbove(loops, mid).area > area / 2) lo = mid;
    else hi = mid;
  }
  const pna = (lo + hi) / 2;
  const total = momentsAbove(loops, from - 1);
  const above = momentsAbove(loops, pna);
  // Σ|s − p|dA = (S_above − p·A/2) + (p·A/2 − S_below) = 2·S_above − S_total with equal halves.
  const plastic = 2 * above.first - total.first;

  const i = props.ix_mm4;
  const scale = Math.sqrt(Math.abs(props.ix_mm4 * props.iy_mm4));
  return {
    axis,
    polygon,
    area_mm2: area,
    neutralAxis_mm: na,
    i_mm4: i,
    ixy_mm4: props.ixy_mm4,
    principal: Math.abs(props.ixy_mm4) <= 1e-6 * scale,
    from_mm: from,
    to_mm: to,
    jumpLevels_mm: jumps,
    elasticModulus_mm3: i / Math.max(to - na, na - from),
    plasticNeutralAxis_mm: pna,
    plasticModulus_mm3: plastic,
    firstMoment_mm3(s_mm: number): number {
      if (!(s_mm > from && s_mm < to)) return 0;
      const part = momentsAbove(loops, s_mm);
      return Math.max(0, part.first - na * part.area);
    },
    widthAt_mm(s_mm: number, side: CutSide = 'above'): number {
      return cutWidth(loops, s_mm, side);
    },
  };
}
