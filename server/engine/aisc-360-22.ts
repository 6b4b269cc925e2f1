/**
 * Shear strength of I-shaped webs by ANSI/AISC 360-22 §G2.1 (LRFD and ASD), without tension-field action (§G2.2).
 *
 *   Vn = 0.6·Fy·Aw·Cv1, Aw = d·tw
 *   (a) rolled I-shapes with h/tw ≤ 2.24·√(E/Fy): Cv1 = 1.0, φv = 1.00, Ωv = 1.50
 *   (b) all other I-shapes: φv = 0.90, Ωv = 1.67,
 *       h/tw ≤ 1.10·√(kv·E/Fy): Cv1 = 1.0; otherwise Cv1 = 1.10·√(kv·E/Fy) / (h/tw)
 *       kv = 5.34 unstiffened, or 5 + 5/(a/h)² with transverse stiffeners (5.34 when a/h > 3.0)
 * h is the clear distance between flanges less the fillets (d − 2k) for rolled shapes, the clear distance between
 * flanges for welded ones. Requirements from the standard as published; verify against the edition in force.
 */
import type { SectionProperties } from './section-properties';
import { formatNumber as f, step, type TraceStep } from './trace';

export type AiscMethod = 'lrfd' | 'asd';

export interface AiscShearParams {
  e_MPa: number;
  /** Clear distance between transverse stiffeners, or null for an unstiffened web. */
  stiffenerSpacing_mm: number | null;
}

export interface AiscShearCapacity {
  method: AiscMethod;
  aw_mm2: number;
  h_mm: number;
  hOverTw: number;
  rolledLimit: number;
  case: 'a' | 'b';
  kv: number;
  cv1: number;
  vn_N: number;
  /** φv for LRFD, 1/Ωv for ASD: the factor that turns Vn into the available strength. */
  resistanceFactor: number;
  available_N: number;
  webBucklingGoverns: boolean;
  /** h/tw above 260 for an unstiffened web: outside the proportioning limit of §F13.2 (from memory). */
  beyondProportionLimit: boolean;
  trace: TraceStep[];
}

const CLAUSE = 'AISC 360-22 §G2.1';
const UNSTIFFENED_KV = 5.34;
const UNSTIFFENED_H_OVER_TW_LIMIT = 260;

/** 2.24·√(E/Fy): the web slenderness up to which rolled I-shapes take φv = 1.00 and Cv1 = 1.0. */
export function rolledWebLimit(e_MPa: number, fy_MPa: number): number {
  return 2.24 * Math.sqrt(e_MPa / fy_MPa);
}

/** Web plate shear buckling coefficient kv for a stiffener spacing a over web depth h (null = unstiffened). */
export function webBucklingCoefficientKv(aOverH: number | null): number {
  if (aOverH === null || aOverH > 3) return UNSTIFFENED_KV;
  return 5 + 5 / (aOverH * aOverH);
}

/** Web shear strength coefficient Cv1 of §G2.1(b)(2). */
export function webShearCoefficientCv1(hOverTw: number, kv: number, e_MPa: number, fy_MPa: number): number {
  const limit = 1.1 * Math.sqrt((kv * e_MPa) / fy_MPa);
  return hOverTw <= limit ? 1 : limit / hOverTw;
}

export function aiscShearCapacity(props: SectionProperties, fy_MPa: number, method: AiscMethod, params: AiscShearParams): AiscShearCapacity {
  const { input } = props;
  const d = input.depth_mm;
  const tw = input.webThickness_mm;
  const rolled = input.fabrication === 'rolled';
  const e = params.e_MPa;
  const trace: TraceStep[] = [];

  const aw = props.awAisc_mm2;
  trace.push(step(CLAUSE, 'Web area', 'Aw = d·tw', `${f(d)} mm × ${f(tw)} mm`, aw, 'mm²'));

  const h = rolled ? props.webDepthLessFillets_mm : props.clearWebDepth_mm;
  trace.push(
    rolled
      ? step(CLAUSE, 'Web depth h, rolled shape: clear distance between flanges less the fillets', 'h = d − 2k', `${f(d)} − 2 × ${f((d - h) / 2)} mm`, h, 'mm')
      : step(CLAUSE, 'Web depth h, built-up shape: clear distance between flanges', 'h = d − tf,top − tf,bot', `${f(d)} − ${f(input.topFlange.thickness_mm)} − ${f(input.bottomFlange.thickness_mm)} mm`, h, 'mm'),
  );
  const hOverTw = h / tw;
  trace.push(step(CLAUSE, 'Web slenderness', 'h/tw', `${f(h)} / ${f(tw)}`, hOverTw));

  const rolledLimit = rolledWebLimit(e, fy_MPa);
  const caseA = rolled && hOverTw <= rolledLimit;
  trace.push(
    step(
      CLAUSE + '(a)',
      rolled ? 'Limit for rolled I-shapes' : 'Limit for rolled I-shapes (not applicable: built-up section)',
      '2.24·√(E/Fy)',
      `2.24 × √(${f(e, 6)} / ${f(fy_MPa)}) → h/tw ${caseA ? '≤' : '>'} limit`,
      rolledLimit,
    ),
  );

  const aOverH = params.stiffenerSpacing_mm === null ? null : params.stiffenerSpacing_mm / h;
  const kv = webBucklingCoefficientKv(aOverH);
  let cv1 = 1;
  if (!caseA) {
    trace.push(
      aOverH === null
        ? step(CLAUSE + '(b)(2)', 'Web buckling coefficient, no transverse stiffeners', 'kv = 5.34', '—', kv)
        : step(CLAUSE + '(b)(2)', 'Web buckling coefficient with transverse stiffeners', aOverH > 3 ? 'kv = 5.34 (a/h > 3.0)' : 'kv = 5 + 5/(a/h)²', `a/h = ${f(params.stiffenerSpacing_mm as number)} / ${f(h)} = ${f(aOverH)}`, kv),
    );
    cv1 = webShearCoefficientCv1(hOverTw, kv, e, fy_MPa);
    const limit = 1.1 * Math.sqrt((kv * e) / fy_MPa);
    trace.push(
      step(
        CLAUSE + '(b)(2)',
        'Web shear strength coefficient',
        hOverTw <= limit ? 'h/tw ≤ 1.10·√(kv·E/Fy) → Cv1 = 1.0' : 'Cv1 = 1.10·√(kv·E/Fy) / (h/tw)',
        `1.10 × √(${f(kv)} × ${f(e, 6)} / ${f(fy_MPa)}) = ${f(limit)}; h/tw = ${f(hOverTw)}`,
        cv1,
      ),
    );
  } else {
    trace.push(step(CLAUSE + '(a)', 'Web shear strength coefficient, rolled I-shape within the limit', 'Cv1 = 1.0', '—', 1));
  }

  const vn = 0.6 * fy_MPa * aw * cv1;
  trace.push(step(CLAUSE + ' (Eq. G2-1)', 'Nominal shear strength', 'Vn = 0.6·Fy·Aw·Cv1', `0.6 × ${f(fy_MPa)} MPa × ${f(aw)} mm² × ${f(cv1)}`, vn / 1000, 'kN'));

  const phi = caseA ? 1.0 : 0.9;
  const omega = caseA ? 1.5 : 1.67;
  const factor = method === 'lrfd' ? phi : 1 / omega;
  const available = vn * factor;
  trace.push(
    method === 'lrfd'
      ? step(CLAUSE + (caseA ? '(a)' : '(b)'), 'Design shear strength (LRFD)', `φv·Vn, φv = ${phi.toFixed(2)}`, `${phi.toFixed(2)} × ${f(vn / 1000)} kN`, available / 1000, 'kN')
      : step(CLAUSE + (caseA ? '(a)' : '(b)'), 'Allowable shear strength (ASD)', `Vn/Ωv, Ωv = ${omega.toFixed(2)}`, `${f(vn / 1000)} kN / ${omega.toFixed(2)}`, available / 1000, 'kN'),
  );
  trace.push(step('AISC 360-22 §G2.2', 'Tension-field action', 'not used', 'post-buckling strength of stiffened webs is not counted', '—'));

  const beyondProportionLimit = params.stiffenerSpacing_mm === null && hOverTw > UNSTIFFENED_H_OVER_TW_LIMIT;
  return {
    method,
    aw_mm2: aw,
    h_mm: h,
    hOverTw,
    rolledLimit,
    case: caseA ? 'a' : 'b',
    kv,
    cv1,
    vn_N: vn,
    resistanceFactor: factor,
    available_N: available,
    webBucklingGoverns: cv1 < 1,
    beyondProportionLimit,
    trace,
  };
}
