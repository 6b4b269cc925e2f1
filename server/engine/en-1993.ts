/**
 * Shear resistance of I-section webs by EN 1993-1-1 §6.2.6 and, for slender webs, EN 1993-1-5 §5.
 *
 *   Vpl,Rd = Av·(fy/√3)/γM0                                                         (6.18)
 *   Av, rolled I/H, load parallel to the web: A − 2b·tf + (tw + 2r)·tf ≥ η·hw·tw      6.2.6(3)(a)
 *   Av, welded I/H: η·Σ(hw·tw)                                                      6.2.6(3)(d)
 *   buckling to be checked when hw/tw > 72·ε/η (unstiffened) or 31·ε·√kτ/η           (6.22), 1-5 §5.1
 *   Vb,Rd = Vbw,Rd = χw·fyw·hw·t/(√3·γM1) ≤ η·fyw·hw·t/(√3·γM1)                      1-5 (5.1), (5.2)
 *   λw = hw/(86.4·t·ε) with stiffeners at supports only, hw/(37.4·t·ε·√kτ) otherwise   1-5 (5.5), (5.6)
 *   χw by Table 5.1: η for λw < 0.83/η; 0.83/λw up to 1.08; beyond, 0.83/λw (non-rigid end post) or 1.37/(0.7 + λw)
 *   (rigid end post)
 * The flange contribution Vbf,Rd (1-5 §5.4) is not counted: it needs the coexisting bending moment, which shear results
 * alone do not give, and leaving it out is on the safe side. The elastic check (6.19)/(6.20) is reported beside.
 * Formulae as published in the standards (coefficients recalled from memory): verify against your national annex.
 */
import type { SectionProperties } from './section-properties';
import { formatNumber as f, step, type TraceStep } from './trace';

export type EndPost = 'non-rigid' | 'rigid';

export interface EnShearParams {
  gammaM0: number;
  gammaM1: number;
  eta: number;
  endPost: EndPost;
  stiffenerSpacing_mm: number | null;
}

export interface EnShearCapacity {
  epsilon: number;
  av_mm2: number;
  vplRd_N: number;
  hwOverTw: number;
  bucklingLimit: number;
  bucklingChecked: boolean;
  kTau: number | null;
  lambdaW: number | null;
  chiW: number | null;
  vbRd_N: number | null;
  vRd_N: number;
  webBucklingGoverns: boolean;
  /** fy/(√3·γM0): the limit of the elastic verification (6.19). */
  elasticStressLimit_MPa: number;
  trace: TraceStep[];
}

const CLAUSE = 'EN 1993-1-1 §6.2.6';
const CLAUSE_1_5 = 'EN 1993-1-5 §5';
const SQRT3 = Math.sqrt(3);

/** ε = √(235/fy), fy in MPa. */
export function epsilonOf(fy_MPa: number): number {
  return Math.sqrt(235 / fy_MPa);
}

/** Shear buckling coefficient kτ for a plate without longitudinal stiffeners (EN 1993-1-5 A.3). */
export function shearBucklingCoefficientKTau(aOverHw: number): number {
  const r = 1 / aOverHw;
  return aOverHw >= 1 ? 5.34 + 4 * r * r : 4 + 5.34 * r * r;
}

/** Contribution factor of the web, EN 1993-1-5 Table 5.1. */
export function webContributionFactorChiW(lambdaW: number, eta: number, endPost: EndPost): number {
  if (lambdaW < 0.83 / eta) return eta;
  if (lambdaW < 1.08 || endPost === 'non-rigid') return 0.83 / lambdaW;
  return 1.37 / (0.7 + lambdaW);
}

export function enShearCapacity(props: SectionProperties, fy_MPa: number, params: EnShearParams): EnShearCapacity {
  const { input } = props;
  const tw = input.webThickness_mm;
  const hw = props.clearWebDepth_mm;
  const { gammaM0, gammaM1, eta } = params;
  const trace: TraceStep[] = [];

  const epsilon = epsilonOf(fy_MPa);
  trace.push(step('EN 1993-1-1 Table 5.2', 'Material factor', 'ε = √(235/fy)', `√(235 / ${f(fy_MPa)})`, epsilon));
  trace.push(step(CLAUSE + '(3)', 'Clear web depth', 'hw = h − tf,top − tf,bot', `${f(input.depth_mm)} − ${f(input.topFlange.thickness_mm)} − ${f(input.bottomFlange.thickness_mm)} mm`, hw, 'mm'));

  const lowerBound = eta * hw * tw;
  let av: number;
  if (input.fabrication === 'rolled') {
    const t = input.topFlange;
    const b = input.bottomFlange;
    const symmetric = t.width_mm === b.width_mm && t.thickness_mm === b.thickness_mm && t.filletRadius_mm === b.filletRadius_mm;
    trace.push(
      step(
        CLAUSE + '(3)(a)',
        'Shear area, rolled I/H section, load parallel to the web',
        symmetric ? 'Av = A − 2b·tf + (tw + 2r)·tf' : 'Av = A − Σ[b·tf − (tw + 2r)·tf/2] over both flanges',
        symmetric
          ? `${f(props.area_mm2)} − 2 × ${f(t.width_mm)} × ${f(t.thickness_mm)} + (${f(tw)} + 2 × ${f(t.filletRadius_mm)}) × ${f(t.thickness_mm)} mm²`
          : `A = ${f(props.area_mm2)} mm², top ${f(t.width_mm)} × ${f(t.thickness_mm)} r ${f(t.filletRadius_mm)}, bottom ${f(b.width_mm)} × ${f(b.thickness_mm)} r ${f(b.filletRadius_mm)}`,
        props.avEn_mm2,
        'mm²',
      ),
    );
    av = Math.max(props.avEn_mm2, lowerBound);
    trace.push(step(CLAUSE + '(3)(a)', 'Shear area not less than η·hw·tw', 'Av = max(Av, η·hw·tw)', `max(${f(props.avEn_mm2)}, ${f(eta)} × ${f(hw)} × ${f(tw)}) mm²`, av, 'mm²'));
  } else {
    av = lowerBound;
    trace.push(step(CLAUSE + '(3)(d)', 'Shear area, welded I/H section, load parallel to the web', 'Av = η·hw·tw', `${f(eta)} × ${f(hw)} mm × ${f(tw)} mm`, av, 'mm²'));
  }
  const vpl = (av * fy_MPa) / SQRT3 / gammaM0;
  trace.push(step(CLAUSE + ' (6.18)', 'Plastic shear resistance', 'Vpl,Rd = Av·(fy/√3)/γM0', `${f(av)} mm² × ${f(fy_MPa)} MPa / √3 / ${f(gammaM0)}`, vpl / 1000, 'kN'));

  const hwOverTw = hw / tw;
  const aOverHw = params.stiffenerSpacing_mm === null ? null : params.stiffenerSpacing_mm / hw;
  const kTau = aOverHw === null ? null : shearBucklingCoefficientKTau(aOverHw);
  const bucklingLimit = kTau === null ? (72 * epsilon) / eta : (31 * epsilon * Math.sqrt(kTau)) / eta;
  const bucklingChecked = hwOverTw > bucklingLimit;
  trace.push(
    step(
      CLAUSE + '(6)',
      bucklingChecked ? 'Web slenderness above the limit: shear buckling to EN 1993-1-5 §5' : 'Web slenderness within the limit: no shear buckling check',
      kTau === null ? 'hw/tw vs 72·ε/η' : 'hw/tw vs 31·ε·√kτ/η',
      kTau === null
        ? `${f(hwOverTw)} ${bucklingChecked ? '>' : '≤'} 72 × ${f(epsilon)} / ${f(eta)}`
        : `${f(hwOverTw)} ${bucklingChecked ? '>' : '≤'} 31 × ${f(epsilon)} × √${f(kTau)} / ${f(eta)}`,
      bucklingLimit,
    ),
  );

  let lambdaW: number | null = null;
  let chiW: number | null = null;
  let vbRd: number | null = null;
  if (bucklingChecked) {
    if (kTau !== null) {
      trace.push(step('EN 1993-1-5 A.3', 'Shear buckling coefficient', (aOverHw as number) >= 1 ? 'kτ = 5.34 + 4.00·(hw/a)²' : 'kτ = 4.00 + 5.34·(hw/a)²', `a/hw = ${f(aOverHw as number)}`, kTau));
    }
    lambdaW = kTau === null ? hw / (86.4 * tw * epsilon) : hw / (37.4 * tw * epsilon * Math.sqrt(kTau));
    trace.push(
      kTau === null
        ? step(CLAUSE_1_5 + '.3 (5.5)', 'Web slenderness, transverse stiffeners at supports only', 'λw = hw/(86.4·t·ε)', `${f(hw)} / (86.4 × ${f(tw)} × ${f(epsilon)})`, lambdaW)
        : step(CLAUSE_1_5 + '.3 (5.6)', 'Web slenderness with transverse stiffeners', 'λw = hw/(37.4·t·ε·√kτ)', `${f(hw)} / (37.4 × ${f(tw)} × ${f(epsilon)} × √${f(kTau)})`, lambdaW),
    );
    chiW = webContributionFactorChiW(lambdaW, eta, params.endPost);
    const rule = lambdaW < 0.83 / eta ? 'χw = η (λw < 0.83/η)' : lambdaW < 1.08 || params.endPost === 'non-rigid' ? 'χw = 0.83/λw' : 'χw = 1.37/(0.7 + λw)';
    trace.push(step(CLAUSE_1_5 + '.3 Table 5.1', `Web contribution factor, ${params.endPost} end post`, rule, `λw = ${f(lambdaW)}, η = ${f(eta)}`, chiW));
    const vbw = (chiW * fy_MPa * hw * tw) / (SQRT3 * gammaM1);
    trace.push(step(CLAUSE_1_5 + '.2 (5.2)', 'Web contribution', 'Vbw,Rd = χw·fyw·hw·t/(√3·γM1)', `${f(chiW)} × ${f(fy_MPa)} × ${f(hw)} × ${f(tw)} / (√3 × ${f(gammaM1)})`, vbw / 1000, 'kN'));
    trace.push(step(CLAUSE_1_5 + '.4', 'Flange contribution', 'Vbf,Rd = 0 (not counted)', 'needs the coexisting bending moment; omitting it is conservative', 0, 'kN'));
    const cap = (eta * fy_MPa * hw * tw) / (SQRT3 * gammaM1);
    vbRd = Math.min(vbw, cap);
    trace.push(step(CLAUSE_1_5 + '.2 (5.1)', 'Shear buckling resistance', 'Vb,Rd = Vbw,Rd + Vbf,Rd ≤ η·fyw·hw·t/(√3·γM1)', `min(${f(vbw / 1000)}, ${f(cap / 1000)}) kN`, vbRd / 1000, 'kN'));
  }
  const vRd = vbRd === null ? vpl : Math.min(vpl, vbRd);
  trace.push(
    step(
      bucklingChecked ? `${CLAUSE}, ${CLAUSE_1_5}` : CLAUSE,
      'Design shear resistance',
      bucklingChecked ? 'VRd = min(Vpl,Rd, Vb,Rd)' : 'VRd = Vpl,Rd',
      bucklingChecked ? `min(${f(vpl / 1000)}, ${f((vbRd as number) / 1000)}) kN` : `${f(vpl / 1000)} kN`,
      vRd / 1000,
      'kN',
    ),
  );

  return {
    epsilon,
    av_mm2: av,
    vplRd_N: vpl,
    hwOverTw,
    bucklingLimit,
    bucklingChecked,
    kTau,
    lambdaW,
    chiW,
    vbRd_N: vbRd,
    vRd_N: vRd,
    webBucklingGoverns: vbRd !== null && vbRd < vpl,
    elasticStressLimit_MPa: fy_MPa / (SQRT3 * gammaM0),
    trace,
  };
}
