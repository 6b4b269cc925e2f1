/**
 * Elastic shear stress of any section, on either shear axis: τ(s) = V·Q(s) / (I·b(s)) (Jourawski's formula, in any
 * mechanics-of-materials text), b(s) the total cut width (two webs of a box, two walls of a tube). Where b jumps, τ
 * jumps and both values are sampled. Stresses are magnitudes for |V|. For a closed section symmetric about the
 * shear axis (box, tube) the shear flow is zero on the axis of symmetry, so the formula holds there as for open ones;
 * for a section whose bending axis is not principal (an angle) the formula is only an estimate, and `principal`
 * says so.
 */
import { EngineInputError } from './input-error';
import type { CutSide, PolygonAxisSection } from './polygon-axis-section';

export interface PolygonShearPoint {
  s_mm: number;
  width_mm: number;
  q_mm3: number;
  tau_MPa: number;
}

export interface PolygonShearProfile {
  shear_N: number;
  /** Ascending in s; at a width jump the value below comes first, so a plot draws a vertical step. */
  points: PolygonShearPoint[];
  tauMax_MPa: number;
  tauMaxAt_mm: number;
  /** Average over the whole section, V/A, for comparison (never a code check). */
  average_MPa: number;
  principal: boolean;
}

const DEFAULT_SAMPLES = 60;

function pointAt(section: PolygonAxisSection, v_N: number, s_mm: number, side: CutSide): PolygonShearPoint {
  const width_mm = section.widthAt_mm(s_mm, side);
  const q_mm3 = section.firstMoment_mm3(s_mm);
  return { s_mm, width_mm, q_mm3, tau_MPa: width_mm > 0 ? (v_N * q_mm3) / (section.i_mm4 * width_mm) : 0 };
}

/** τ at one level for |V|, with the width on the given side of the level. */
export function polygonShearStressAt_MPa(section: PolygonAxisSection, shear_N: number, s_mm: number, side: CutSide = 'above'): number {
  return pointAt(section, Math.abs(shear_N), s_mm, side).tau_MPa;
}

/**
 * τ over the whole extent: `samples` evenly spaced levels, both sides of every width jump and the neutral axis.
 * τmax is the largest sampled value (the neutral axis for every family whose width does not shrink towards it).
 */
export function polygonShearStressProfile(section: PolygonAxisSection, shear_N: number, samples = DEFAULT_SAMPLES): PolygonShearProfile {
  if (typeof shear_N !== 'number' || !Number.isFinite(shear_N)) {
    throw new EngineInputError('shear_N', `shear_N must be a finite number of newtons, got ${String(shear_N)}`);
  }
  const v = Math.abs(shear_N);
  const { from_mm: from, to_mm: to } = section;
  const eps = 1e-9 * (to - from);
  const count = Math.max(2, Math.floor(samples));
  const points: PolygonShearPoint[] = [];
  const levels = section.jumpLevels_mm;
  for (let i = 0; i <= count; i++) {
    const s = from + ((to - from) * i) / count;
    if (!levels.some((level) => Math.abs(level - s) < eps)) points.push(pointAt(section, v, s, 'above'));
  }
  for (const level of levels) {
    if (level > from) points.push(pointAt(section, v, level, 'below'));
    if (level < to) points.push(pointAt(section, v, level, 'above'));
  }
  const na = pointAt(section, v, section.neutralAxis_mm, 'above');
  points.push(na);
  points.sort((a, b) => a.s_mm - b.s_mm);
  let peak = na;
  for (const p of points) if (p.tau_MPa > peak.tau_MPa) peak = p;
  return {
    shear_N,
    points,
    tauMax_MPa: peak.tau_MPa,
    tauMaxAt_mm: peak.s_mm,
    average_MPa: v / section.area_mm2,
    principal: section.principal,
  };
}
