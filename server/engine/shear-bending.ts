/**
 * Shear with bending about the axis normal to the shear.
 *
 * EN 1993-1-1 §6.2.8 (formulae recalled from memory): where VEd ≤ 0.5·Vpl,Rd the moment resistance is not reduced;
 * above, the shear area takes the reduced yield strength (1 − ρ)·fy, ρ = (2·VEd/Vpl,Rd − 1)² (6.29). For I-sections
 * with equal flanges bent about the major axis this gives My,V,Rd = (Wpl,y − ρ·Aw²/(4·tw))·fy/γM0 ≤ My,c,Rd (6.30),
 * Aw = hw·tw. The same reduced-fy approach is applied here to every section whose shear area is made of plates
 * centred on the bending axis (webs of channels and boxes, flanges under minor-axis shear): M = (W − ρ·Σt·L²/4)·fy/γM0
 * on a plastic basis; on an elastic basis the linear stress is scaled until the plates' outer fibre reaches (1 − ρ)·fy.
 * Where the shear area is not such a plate set (tees, tubes, channels under minor-axis shear, unequal flanges), the
 * reduced strength is taken over the whole section, (1 − ρ)·Mc,Rd: conservative, never a guess.
 * Where the web buckles in shear (EN 1993-1-5 §5 applies) §6.2.8(2) sends the check to EN 1993-1-5 §7.1:
 * η̄1 + (1 − Mf,Rd/Mpl,Rd)·(2·η̄3 − 1)² ≤ 1 for η̄3 > 0.5 and η̄1 ≥ Mf,Rd/Mpl,Rd, η̄1 = MEd/Mpl,Rd, η̄3 = VEd/Vbw,Rd.
 * The section class is the caller's: 'plastic' (class 1–2) or 'elastic' (class 3); class 4 effective sections are
 * not computed.
 *
 * AISC 360-22 has no shear–flexure interaction for these checks: shear (Chapter G) and flexure (Chapter F) are each
 * checked alone, combined forces go to Chapter H. The demands are reported side by side.
 */
import { EngineInputError } from './input-error';
import type { PolygonAxisSection } from './polygon-axis-section';
import type { Fabrication } from './section';
import type { SectionDimensions } from './section-family';
import type { WebPlates } from './en-1993-families';
import type { ShearAxis } from './shear-axis';
import { formatNumber as f, step, type TraceStep } from './trace';

export type MomentBasis = 'plastic' | 'elastic';

/** Plates of the shear area, each centred on the bending axis: L along the shear, t across it. */
interface ShearPlate {
  length_mm: number;
  thickness_mm: number;
}

export interface EnBendingCapacity {
  basis: MomentBasis;
  /** Mc,Rd = W·fy/γM0 with W = Wpl or Wel by the basis. */
  mcRd_Nmm: number;
  mplRd_Nmm: number;
  vplRd_N: number;
  /** MV,Rd = Mc,Rd·min(1 − ρ·plasticShare, (1 − ρ)·elasticRatio): how the reduction of the shear area acts. */
  plasticShare: number;
  elasticRatio: number;
  /** True when the reduction follows (6.30) or its plate form; false when the whole section is reduced. */
  shearAreaPlates: boolean;
  /** EN 1993-1-5 §7.1 data when the web buckles in shear, else null. */
  buckling: { vbwRd_N: number; mfRd_Nmm: number } | null;
  trace: TraceStep[];
  /** Per-force constants, prepared once so enShearBendingUtilisation reads flat numbers: whether §7.1 applies. */
  webBuckles: boolean;
  /** §7.1: Vbw,Rd and Mf,Rd/Mpl,Rd; 0 where the web does not buckle. */
  vbwRd_N: number;
  flangeShare: number;
}

export interface ShearBendingResult {
  /** MEd / MV,Rd (§6.2.8) or the §7.1 criterion value: ≤ 1 passes. */
  utilisation: number;
  rho: number;
  mvRd_Nmm: number | null;
  trace: TraceStep[];
}

const CLAUSE = 'EN 1993-1-1 §6.2.8';
const CLAUSE_7 = 'EN 1993-1-5 §7.1';

/** The shear-area plates for the §6.2.8 reduction, or null where they are not centred on the bending axis. */
function shearAreaPlates(d: SectionDimensions, axis: ShearAxis, fabrication: Fabrication): ShearPlate[] | null {
  switch (d.family) {
    case 'I': {
      if (axis === 'minor') return [d.topFlange, d.bottomFlange].map((fl) => ({ length_mm: fl.width_mm, thickness_mm: fl.thickness_mm }));
      const equal = d.topFlange.width_mm === d.bottomFlange.width_mm && d.topFlange.thickness_mm === d.bottomFlange.thickness_mm;
      return equal ? [{ length_mm: d.depth_mm - 2 * d.topFlange.thickness_mm, thickness_mm: d.webThickness_mm }] : null;
    }
    case 'channel':
      return axis === 'major' ? [{ length_mm: d.depth_mm - 2 * d.flangeThickness_mm, thickness_mm: d.webThickness_mm }] : null;
    case 'box': {
      if (axis === 'minor') return [0, 1].map(() => ({ length_mm: d.width_mm, thickness_mm: d.flangeThickness_mm }));
      // Rolled hollow sections: Av = A·h/(b + h) spans the full depth; welded boxes: the clear webs of (d).
      const length_mm = fabrication === 'rolled' && d.webThickness_mm === d.flangeThickness_mm ? d.depth_mm : d.depth_mm - 2 * d.flangeThickness_mm;
      return [0, 1].map(() => ({ length_mm, thickness_mm: d.webThickness_mm }));
    }
    default:
      return null;
  }
}

/** Mf,Rd of EN 1993-1-5 §7.1: the smaller flange force times the distance between the flange centroids. */
function flangeMoment_Nmm(d: SectionDimensions, axis: ShearAxis, fy_MPa: number, gammaM0: number): { value: number; formula: string; substituted: string } | null {
  const of = (af1: number, af2: number, lever: number) => ({
    value: (Math.min(af1, af2) * lever * fy_MPa) / gammaM0,
    formula: 'Mf,Rd = min(Af,1, Af,2)·hf·fy/γM0',
    substituted: `min(${f(af1)}, ${f(af2)}) mm² × ${f(lever)} mm × ${f(fy_MPa)} MPa / ${f(gammaM0)}`,
  });
  if (d.family === 'I' && axis === 'major') {
    const { topFlange: t, bottomFlange: b } = d;
    return of(t.width_mm * t.thickness_mm, b.width_mm * b.thickness_mm, d.depth_mm - t.thickness_mm / 2 - b.thickness_mm / 2);
  }
  if (d.family === 'channel' && axis === 'major') return of(d.width_mm * d.flangeThickness_mm, d.width_mm * d.flangeThickness_mm, d.depth_mm - d.flangeThickness_mm);
  if (d.family === 'box') {
    return axis === 'major'
      ? of(d.width_mm * d.flangeThickness_mm, d.width_mm * d.flangeThickness_mm, d.depth_mm - d.flangeThickness_mm)
      : of(d.depth_mm * d.webThickness_mm, d.depth_mm * d.webThickness_mm, d.width_mm - d.webThickness_mm);
  }
  return null;
}

export interface EnBendingInput {
  dimensions: SectionDimensions;
  axis: ShearAxis;
  fabrication: Fabrication;
  section: PolygonAxisSection;
  fy_MPa: number;
  gammaM0: number;
  basis: MomentBasis;
  vplRd_N: number;
  /** Webs and their buckling contribution when EN 1993-1-5 §5 applies. */
  webs: WebPlates | null;
  vbwRd_N: number | null;
}

/** Everything of §6.2.8 / §7.1 that depends on the section only (once per section and axis). */
export function prepareEnBending(input: EnBendingInput): EnBendingCapacity {
  const { section, fy_MPa: fy, gammaM0, basis } = input;
  const trace: TraceStep[] = [];
  const plastic = basis === 'plastic';
  const w = plastic ? section.plasticModulus_mm3 : section.elasticModulus_mm3;
  const mc = (w * fy) / gammaM0;
  const mpl = (section.plasticModulus_mm3 * fy) / gammaM0;
  trace.push(
    step(
      plastic ? 'EN 1993-1-1 §6.2.5 (6.13)' : 'EN 1993-1-1 §6.2.5 (6.14)',
      plastic ? 'Bending resistance, plastic (class 1 or 2, as stated for the check)' : 'Bending resistance, elastic (class 3, as stated for the check)',
      plastic ? 'Mc,Rd = Wpl·fy/γM0' : 'Mc,Rd = Wel,min·fy/γM0',
      `${f(w)} mm³ × ${f(fy)} MPa / ${f(gammaM0)}`,
      mc / 1e6,
      'kNm',
    ),
  );
  const plates = shearAreaPlates(input.dimensions, input.axis, input.fabrication);
  let plasticShare = 1;
  let elasticRatio = Infinity;
  if (plates === null) {
    if (!plastic) {
      plasticShare = 0;
      elasticRatio = 1;
    }
    trace.push(step(CLAUSE + '(3)', 'Shear area for the reduced yield strength', 'the whole section (conservative)', 'the shear area is not a set of plates centred on the bending axis', '—'));
  } else if (plastic) {
    const wV = plates.reduce((sum, p) => sum + (p.thickness_mm * p.length_mm ** 2) / 4, 0);
    plasticShare = wV / section.plasticModulus_mm3;
    const i6_30 = input.dimensions.family === 'I' && input.axis === 'major';
    trace.push(
      step(
        i6_30 ? CLAUSE + '(5) (6.30)' : CLAUSE + '(3)',
        i6_30 ? 'Plastic modulus of the web, Aw = hw·tw' : 'Plastic modulus of the shear-area plates about the bending axis',
        i6_30 ? 'Aw²/(4·tw)' : 'Σ t·L²/4',
        plates.map((p) => `${f(p.thickness_mm)} × ${f(p.length_mm)}²/4`).join(' + '),
        wV,
        'mm³',
      ),
    );
  } else {
    plasticShare = 0;
    const c = section.i_mm4 / section.elasticModulus_mm3;
    const yv = Math.max(...plates.map((p) => p.length_mm / 2));
    elasticRatio = c / yv;
    trace.push(step(CLAUSE + '(3)', 'Outer fibre of the shear-area plates against the extreme fibre (elastic stress at the reduced strength)', 'c / yv', `${f(c)} mm / ${f(yv)} mm`, elasticRatio));
  }
  let buckling: EnBendingCapacity['buckling'] = null;
  if (input.vbwRd_N !== null) {
    const mf = flangeMoment_Nmm(input.dimensions, input.axis, fy, gammaM0);
    if (mf) {
      buckling = { vbwRd_N: input.vbwRd_N, mfRd_Nmm: mf.value };
      trace.push(step(CLAUSE_7, 'Plastic moment resistance of the flanges alone', mf.formula, mf.substituted, mf.value / 1e6, 'kNm'));
      trace.push(step(CLAUSE_7, 'Plastic moment resistance of the cross-section', 'Mpl,Rd = Wpl·fy/γM0', `${f(section.plasticModulus_mm3)} mm³ × ${f(fy)} MPa / ${f(gammaM0)}`, mpl / 1e6, 'kNm'));
    }
  }
  return {
    basis,
    mcRd_Nmm: mc,
    mplRd_Nmm: mpl,
    vplRd_N: input.vplRd_N,
    plasticShare,
    elasticRatio,
    shearAreaPlates: plates !== null,
    buckling,
    trace,
    webBuckles: buckling !== null,
    vbwRd_N: buckling === null ? 0 : buckling.vbwRd_N,
    flangeShare: buckling === null ? 0 : buckling.mfRd_Nmm / mpl,
  };
}

function requireForces(shear_N: unknown, moment_Nmm: unknown): { v: number; m: number } {
  if (typeof moment_Nmm !== 'number' || !Number.isFinite(moment_Nmm)) {
    throw new EngineInputError('moment_Nmm', `moment_Nmm must be a finite number of newton-millimetres, got ${String(moment_Nmm)}`);
  }
  if (shear_N === undefined || shear_N === null) {
    throw new EngineInputError('shear_N', 'a bending moment was given without its shear force: shear with bending needs both at the same station');
  }
  if (typeof shear_N !== 'number' || !Number.isFinite(shear_N)) {
    throw new EngineInputError('shear_N', `shear_N must be a finite number of newtons, got ${String(shear_N)}`);
  }
  return { v: Math.abs(shear_N), m: Math.abs(moment_Nmm) };
}

/** ρ of (6.29), 0 up to VEd = 0.5·Vpl,Rd, held at 1 beyond Vpl,Rd (the shear check itself fails there). */
export function shearReductionRho(shear_N: number, vplRd_N: number): number {
  const ratio = Math.abs(shear_N) / vplRd_N;
  if (ratio <= 0.5) return 0;
  return ratio >= 1 ? 1 : (2 * ratio - 1) ** 2;
}

/**
 * The per-force arithmetic: the shear-with-bending utilisation alone, without a trace. It reads only numbers prepared
 * once per section and axis and allocates nothing, so a check run can call it for every station and combination.
 */
export function enShearBendingUtilisation(c: EnBendingCapacity, shear_N: number, moment_Nmm: number): number {
  const v = Math.abs(shear_N);
  const m = Math.abs(moment_Nmm);
  if (c.webBuckles) {
    const e1 = m / c.mplRd_Nmm;
    const e3 = v / c.vbwRd_N;
    const flanges = c.flangeShare;
    return e3 > 0.5 && e1 >= flanges ? e1 + (1 - flanges) * (2 * e3 - 1) ** 2 : e1;
  }
  return ratioTo(m, reducedMoment_Nmm(c, shearReductionRho(v, c.vplRd_N)));
}

function reducedMoment_Nmm(c: EnBendingCapacity, rho: number): number {
  return c.mcRd_Nmm * Math.min(1 - rho * c.plasticShare, (1 - rho) * c.elasticRatio);
}

/** MEd / MV,Rd; a moment against a resistance used up by shear (ρ = 1 on the whole section) fails without a NaN. */
function ratioTo(m_Nmm: number, mv_Nmm: number): number {
  if (mv_Nmm > 0) return m_Nmm / mv_Nmm;
  return m_Nmm > 0 ? Number.POSITIVE_INFINITY : 0;
}

/** The shear-with-bending check with its trace, for one shear force and moment at the same station. */
export function enShearBending(c: EnBendingCapacity, shear_N: number | undefined, moment_Nmm: number): ShearBendingResult {
  const { v, m } = requireForces(shear_N, moment_Nmm);
  const trace: TraceStep[] = [...c.trace];
  if (c.buckling !== null) {
    const { vbwRd_N } = c.buckling;
    const e1 = m / c.mplRd_Nmm;
    const e3 = v / vbwRd_N;
    const flanges = c.flangeShare;
    trace.push(step(CLAUSE + '(2)', 'The web buckles in shear: interaction by EN 1993-1-5 §7.1', '—', '—', '—'));
    trace.push(step(CLAUSE_7 + ' (7.1)', 'Bending ratio', 'η̄1 = MEd/Mpl,Rd', `${f(m / 1e6)} / ${f(c.mplRd_Nmm / 1e6)} kNm`, e1));
    trace.push(step(CLAUSE_7 + ' (7.1)', 'Shear ratio of the web', 'η̄3 = VEd/Vbw,Rd', `${f(v / 1000)} / ${f(vbwRd_N / 1000)} kN`, e3));
    const applies = e3 > 0.5 && e1 >= flanges;
    const utilisation = enShearBendingUtilisation(c, v, m);
    trace.push(
      applies
        ? step(CLAUSE_7 + '(1)', 'Interaction of shear and bending', 'η̄1 + (1 − Mf,Rd/Mpl,Rd)·(2η̄3 − 1)² ≤ 1', `${f(e1)} + (1 − ${f(flanges)}) × (2 × ${f(e3)} − 1)²`, utilisation)
        : step(CLAUSE_7 + '(1)', e3 <= 0.5 ? 'η̄3 ≤ 0.5: no reduction for shear' : 'η̄1 < Mf,Rd/Mpl,Rd: the flanges alone carry the moment', 'η̄1 ≤ 1', f(e1), utilisation),
    );
    return { utilisation, rho: 0, mvRd_Nmm: null, trace };
  }
  const rho = shearReductionRho(v, c.vplRd_N);
  const half = 0.5 * c.vplRd_N;
  trace.push(step(CLAUSE + '(2)', v <= half ? 'VEd ≤ 0.5·Vpl,Rd: no reduction of the moment resistance' : 'VEd > 0.5·Vpl,Rd: reduced yield strength on the shear area', 'VEd vs 0.5·Vpl,Rd', `${f(v / 1000)} kN vs 0.5 × ${f(c.vplRd_N / 1000)} kN`, half / 1000, 'kN'));
  if (v > half) {
    trace.push(step(CLAUSE + '(3) (6.29)', v >= c.vplRd_N ? 'Reduction factor (held at 1: VEd ≥ Vpl,Rd)' : 'Reduction factor', 'ρ = (2·VEd/Vpl,Rd − 1)²', `(2 × ${f(v / 1000)} / ${f(c.vplRd_N / 1000)} − 1)²`, rho));
    trace.push(step(CLAUSE + '(3)', 'Reduced yield strength of the shear area', '(1 − ρ)·fy', `(1 − ${f(rho)}) × fy`, 1 - rho));
  }
  const mv = reducedMoment_Nmm(c, rho);
  const formula = !c.shearAreaPlates ? 'MV,Rd = (1 − ρ)·Mc,Rd' : c.basis === 'plastic' ? 'MV,Rd = (W − ρ·Σt·L²/4)·fy/γM0 ≤ Mc,Rd' : 'MV,Rd = Mc,Rd·min(1, (1 − ρ)·c/yv)';
  trace.push(step(CLAUSE + '(3)', 'Moment resistance reduced for shear', formula, `ρ = ${f(rho)}, Mc,Rd = ${f(c.mcRd_Nmm / 1e6)} kNm`, mv / 1e6, 'kNm'));
  const utilisation = ratioTo(m, mv);
  trace.push(step(CLAUSE, 'Utilisation, shear with bending', 'MEd / MV,Rd', `${f(m / 1e6)} / ${f(mv / 1e6)} kNm`, utilisation));
  return { utilisation, rho, mvRd_Nmm: mv, trace };
}

/** AISC: shear and flexural demand side by side; no combined formula exists in the specification for this. */
export function aiscShearAndFlexure(shear_N: number | undefined, moment_Nmm: number, available_N: number): TraceStep[] {
  const { v, m } = requireForces(shear_N, moment_Nmm);
  return [
    step('AISC 360-22 §G', 'Required shear strength against the available', 'Vr / Vc', `${f(v / 1000)} kN / ${f(available_N / 1000)} kN`, v / available_N),
    step('AISC 360-22 §F', 'Required flexural strength at the same station (flexure is checked by Chapter F, not here)', 'Mr', `${f(m / 1e6)} kNm`, m / 1e6, 'kNm'),
    step('AISC 360-22 §H', 'Shear with flexure', 'no interaction formula', 'the specification checks shear and flexure each alone; combined flexure and axial force go to Chapter H', '—'),
  ];
}
