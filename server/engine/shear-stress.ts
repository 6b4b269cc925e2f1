/**
 * Elastic shear stress over the depth of an I-section: τ(y) = V·Q(y) / (I·b(y)) (Jourawski's formula, found in any
 * mechanics-of-materials text). At a web–flange junction the width jumps, so τ jumps; both values are sampled there.
 * Stresses are magnitudes for |V|; the sign of the shear only sets their direction.
 */
import { EngineInputError } from './input-error';
import type { SectionProperties } from './section-properties';

export interface ShearStressPoint {
  y_mm: number;
  width_mm: number;
  q_mm3: number;
  tau_MPa: number;
}

export interface JunctionStress {
  level_mm: number;
  /** Stress in the web (or fillet) just inside the junction and in the flange just outside it. */
  webSide_MPa: number;
  flangeSide_MPa: number;
  webSideWidth_mm: number;
  flangeSideWidth_mm: number;
}

export interface ShearStressProfile {
  shear_N: number;
  points: ShearStressPoint[];
  tauMax_MPa: number;
  tauMaxAt_mm: number;
  topJunction: JunctionStress;
  bottomJunction: JunctionStress;
  /** V / (hw·tw), hw the clear web depth. */
  webAverageClear_MPa: number;
  /** V / (d·tw), the average AISC's Aw is based on. */
  webAverageFullDepth_MPa: number;
  /** Web averages divided by τmax (≈ 0.9–1.0 for wide-flange beams: a rule of thumb, never the code check). */
  clearAverageToMax: number;
  fullDepthAverageToMax: number;
}

const DEFAULT_SAMPLES = 60;

function pointAt(props: SectionProperties, shear_N: number, y_mm: number, side: 'below' | 'above'): ShearStressPoint {
  const width_mm = props.widthAt_mm(y_mm, side);
  const q_mm3 = props.firstMoment_mm3(y_mm);
  return { y_mm, width_mm, q_mm3, tau_MPa: width_mm > 0 ? (shear_N * q_mm3) / (props.iMajor_mm4 * width_mm) : 0 };
}

/** τ at one level: VQ/(I·b) with the width on the given side of the level. */
export function shearStressAt_MPa(props: SectionProperties, shear_N: number, y_mm: number, side: 'below' | 'above' = 'above'): number {
  return pointAt(props, Math.abs(shear_N), y_mm, side).tau_MPa;
}

function junction(props: SectionProperties, shear_N: number, level_mm: number, flangeSide: 'below' | 'above'): JunctionStress {
  const webSide = flangeSide === 'above' ? 'below' : 'above';
  const web = pointAt(props, shear_N, level_mm, webSide);
  const flange = pointAt(props, shear_N, level_mm, flangeSide);
  return {
    level_mm,
    webSide_MPa: web.tau_MPa,
    flangeSide_MPa: flange.tau_MPa,
    webSideWidth_mm: web.width_mm,
    flangeSideWidth_mm: flange.width_mm,
  };
}

/**
 * τ(y) from the underside (y = 0) to the top (y = d): `samples` evenly spaced levels plus every level where the width
 * changes form (each taken from below and from above) and the neutral axis.
 */
export function shearStressProfile(props: SectionProperties, shear_N: number, samples = DEFAULT_SAMPLES): ShearStressProfile {
  if (!Number.isFinite(shear_N)) throw new EngineInputError('shear_N', `shear_N must be a finite number of newtons, got ${shear_N}`);
  const v = Math.abs(shear_N);
  const d = props.depth_mm;
  const count = Math.max(2, Math.floor(samples));
  const inner = props.levels_mm.slice(1, -1);
  const points: ShearStressPoint[] = [];
  for (let i = 0; i <= count; i++) {
    const y = (d * i) / count;
    if (!inner.some((level) => Math.abs(level - y) < 1e-9 * d)) points.push(pointAt(props, v, y, 'above'));
  }
  for (const level of inner) {
    points.push(pointAt(props, v, level, 'below'), pointAt(props, v, level, 'above'));
  }
  const na = pointAt(props, v, props.neutralAxisFromBottom_mm, 'above');
  points.push(na);
  // Stable sort keeps 'below' before 'above' at a shared level, so a plot draws the jump as a vertical step.
  points.sort((a, b) => a.y_mm - b.y_mm);

  let peak = na;
  for (const p of points) if (p.tau_MPa > peak.tau_MPa) peak = p;
  const tw = props.input.webThickness_mm;
  const clear = v / (props.clearWebDepth_mm * tw);
  const full = v / (d * tw);
  const ratio = (avg: number): number => (peak.tau_MPa > 0 ? avg / peak.tau_MPa : 1);
  return {
    shear_N,
    points,
    tauMax_MPa: peak.tau_MPa,
    tauMaxAt_mm: peak.y_mm,
    topJunction: junction(props, v, props.topJunctionFromBottom_mm, 'above'),
    bottomJunction: junction(props, v, props.bottomJunctionFromBottom_mm, 'below'),
    webAverageClear_MPa: clear,
    webAverageFullDepth_MPa: full,
    clearAverageToMax: ratio(clear),
    fullDepthAverageToMax: ratio(full),
  };
}
