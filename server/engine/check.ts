/**
 * The member shear check: capacity by the chosen standard, demand from the imported shear force, utilisation
 * |VEd| / VRd, and a clause-by-clause trace.
 *
 * Split for speed: prepareCapacity() does everything that depends only on the profile, grade, standard and
 * parameters (once per profile; cache it), utilisationOf() is the per member × load combination arithmetic.
 */
import { aiscShearCapacity, type AiscShearCapacity } from './aisc-360-22';
import { enShearCapacity, type EndPost, type EnShearCapacity } from './en-1993';
import { type EnYieldRule, type GradeId, yieldRuleLabel, yieldStrength } from './grades';
import { EngineInputError } from './input-error';
import type { ISectionInput } from './section';
import { type SectionProperties, sectionProperties } from './section-properties';
import { formatNumber as f, step, type TraceStep } from './trace';
import { MPA_PER_KSI } from './units';

export type Standard = 'aisc360-22-lrfd' | 'aisc360-22-asd' | 'en1993-1-1';
export const STANDARDS: readonly Standard[] = ['aisc360-22-lrfd', 'aisc360-22-asd', 'en1993-1-1'];

export type CheckFlag =
  | 'web-buckling-governs'
  | 'web-proportion-limit'
  | 'elastic-check-exceeded'
  | 'yield-strength-given'
  | 'assumed-grade'
  | 'catalogue-section';

export interface CheckParams {
  /** Utilisation from which a passing member is marked as a warning. */
  warningRatio?: number;
  /** How fy of EN grades follows thickness. */
  yieldRule?: EnYieldRule;
  /** Clear spacing of transverse web stiffeners; null or absent = unstiffened web. */
  stiffenerSpacing_mm?: number | null;
  /** Modulus of elasticity for AISC 360 (E only enters the web slenderness limits). */
  e_MPa?: number;
  gammaM0?: number;
  gammaM1?: number;
  /** EN 1993-1-5 η; when absent 1.20 up to fy = 460 MPa and 1.00 above (the recommended values). */
  eta?: number;
  endPost?: EndPost;
}

export interface ResolvedCheckParams {
  warningRatio: number;
  yieldRule: EnYieldRule;
  stiffenerSpacing_mm: number | null;
  e_MPa: number;
  gammaM0: number;
  gammaM1: number;
  eta: number | null;
  endPost: EndPost;
}

/** Recommended values: EN 1993-1-1 6.1 NOTE 2B (γM0 = γM1 = 1.00), AISC 360-22 E = 29 000 ksi. */
export const DEFAULT_CHECK_PARAMS: Readonly<ResolvedCheckParams> = {
  warningRatio: 0.9,
  yieldRule: 'en10025-2',
  stiffenerSpacing_mm: null,
  e_MPa: 29000 * MPA_PER_KSI,
  gammaM0: 1.0,
  gammaM1: 1.0,
  eta: null,
  endPost: 'non-rigid',
};

export interface MaterialInput {
  grade?: GradeId;
  /** Yield strength given directly; wins over the grade. */
  fy_MPa?: number;
}

export interface PreparedCapacity {
  readonly standard: Standard;
  readonly section: SectionProperties;
  readonly fy_MPa: number;
  readonly VRd_N: number;
  readonly warningRatio: number;
  readonly flags: readonly CheckFlag[];
  readonly trace: readonly TraceStep[];
  /** The standard's own intermediate values: exactly one of the two is set. */
  readonly aisc: AiscShearCapacity | null;
  readonly en: EnShearCapacity | null;
}

export interface CheckInput extends MaterialInput {
  section: ISectionInput;
  standard: Standard;
  params?: CheckParams;
  shear_N: number;
  /** Facts known by the caller that the result should carry ('assumed-grade', 'catalogue-section'). */
  flags?: readonly CheckFlag[];
}

export type CheckStatus = 'pass' | 'fail';

export interface CheckResult {
  standard: Standard;
  fy_MPa: number;
  VEd_N: number;
  VRd_N: number;
  utilisation: number;
  status: CheckStatus;
  warning: boolean;
  /** EN: τEd/(fy/(√3·γM0)) by (6.19)/(6.20), reported beside the governing check; null for AISC. */
  elasticUtilisation: number | null;
  flags: CheckFlag[];
  trace: TraceStep[];
}

function positive(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw new EngineInputError(field, `${field} must be a positive number, got ${String(value)}`);
  }
  return value;
}

/** Fills in the recommended values and rejects parameters no code would accept. */
export function resolveCheckParams(params: CheckParams = {}): ResolvedCheckParams {
  const p = { ...DEFAULT_CHECK_PARAMS };
  if (params.warningRatio !== undefined) {
    p.warningRatio = positive(params.warningRatio, 'params.warningRatio');
    if (p.warningRatio > 1) throw new EngineInputError('params.warningRatio', 'params.warningRatio must be at most 1');
  }
  if (params.yieldRule !== undefined) {
    if (params.yieldRule !== 'en10025-2' && params.yieldRule !== 'en1993-1-1-table-3.1') {
      throw new EngineInputError('params.yieldRule', `params.yieldRule must be 'en10025-2' or 'en1993-1-1-table-3.1', got ${String(params.yieldRule)}`);
    }
    p.yieldRule = params.yieldRule;
  }
  if (params.stiffenerSpacing_mm !== undefined && params.stiffenerSpacing_mm !== null) {
    p.stiffenerSpacing_mm = positive(params.stiffenerSpacing_mm, 'params.stiffenerSpacing_mm');
  }
  if (params.e_MPa !== undefined) p.e_MPa = positive(params.e_MPa, 'params.e_MPa');
  if (params.gammaM0 !== undefined) p.gammaM0 = positive(params.gammaM0, 'params.gammaM0');
  if (params.gammaM1 !== undefined) p.gammaM1 = positive(params.gammaM1, 'params.gammaM1');
  if (params.eta !== undefined) {
    const eta = positive(params.eta, 'params.eta');
    if (eta < 1 || eta > 1.2) throw new EngineInputError('params.eta', `params.eta must be between 1.0 and 1.2, got ${eta}`);
    p.eta = eta;
  }
  if (params.endPost !== undefined) {
    if (params.endPost !== 'rigid' && params.endPost !== 'non-rigid') {
      throw new EngineInputError('params.endPost', `params.endPost must be 'rigid' or 'non-rigid', got ${String(params.endPost)}`);
    }
    p.endPost = params.endPost;
  }
  return p;
}

/** The thickest plate of the section, which selects the yield strength band (common practice, no source). */
function governingThickness_mm(input: ISectionInput): number {
  return Math.max(input.topFlange.thickness_mm, input.bottomFlange.thickness_mm, input.webThickness_mm);
}

function resolveYield(input: ISectionInput, material: MaterialInput, params: ResolvedCheckParams): { fy_MPa: number; trace: TraceStep; given: boolean } {
  if (material.fy_MPa !== undefined) {
    const fy = positive(material.fy_MPa, 'fy_MPa');
    return { fy_MPa: fy, given: true, trace: step('—', 'Yield strength, given by the user', 'fy', `${f(fy)} MPa`, fy, 'MPa') };
  }
  if (material.grade === undefined) throw new EngineInputError('grade', 'either grade or fy_MPa is required');
  const t = governingThickness_mm(input);
  const y = yieldStrength(material.grade, t, params.yieldRule);
  return {
    fy_MPa: y.fy_MPa,
    given: false,
    trace: step(yieldRuleLabel(material.grade, y.rule), `Yield strength of ${material.grade} for the thickest plate`, `fy (${y.band})`, `t = ${f(t)} mm`, y.fy_MPa, 'MPa'),
  };
}

/** Everything of the check that does not depend on the shear force. Throws EngineInputError for bad input. */
export function prepareCapacity(section: ISectionInput, material: MaterialInput, standard: Standard, params: CheckParams = {}): PreparedCapacity {
  if (!STANDARDS.includes(standard)) {
    throw new EngineInputError('standard', `standard must be one of ${STANDARDS.join(', ')}, got ${String(standard)}`);
  }
  const props = sectionProperties(section);
  const p = resolveCheckParams(params);
  const yieldInfo = resolveYield(section, material, p);
  const fy = yieldInfo.fy_MPa;
  const flags: CheckFlag[] = yieldInfo.given ? ['yield-strength-given'] : [];
  const trace: TraceStep[] = [yieldInfo.trace];

  if (standard === 'en1993-1-1') {
    const eta = p.eta ?? (fy <= 460 ? 1.2 : 1.0);
    trace.push(step('EN 1993-1-5 §5.1(2) NOTE 2', 'Factor η', p.eta === null ? 'η = 1.20 for fy ≤ 460 MPa, else 1.00 (recommended)' : 'η (project parameter)', `fy = ${f(fy)} MPa`, eta));
    trace.push(step('EN 1993-1-1 §6.1 NOTE 2B', 'Partial factors', 'γM0, γM1 (project parameters)', `γM0 = ${f(p.gammaM0)}, γM1 = ${f(p.gammaM1)}`, '—'));
    const en = enShearCapacity(props, fy, { gammaM0: p.gammaM0, gammaM1: p.gammaM1, eta, endPost: p.endPost, stiffenerSpacing_mm: p.stiffenerSpacing_mm });
    if (en.webBucklingGoverns) flags.push('web-buckling-governs');
    trace.push(...en.trace);
    return { standard, section: props, fy_MPa: fy, VRd_N: en.vRd_N, warningRatio: p.warningRatio, flags, trace, aisc: null, en };
  }
  const method = standard === 'aisc360-22-lrfd' ? 'lrfd' : 'asd';
  trace.push(step('AISC 360-22 §B3', 'Modulus of elasticity', 'E', `${f(p.e_MPa / MPA_PER_KSI, 5)} ksi`, p.e_MPa, 'MPa'));
  const aisc = aiscShearCapacity(props, fy, method, { e_MPa: p.e_MPa, stiffenerSpacing_mm: p.stiffenerSpacing_mm });
  if (aisc.webBucklingGoverns) flags.push('web-buckling-governs');
  if (aisc.beyondProportionLimit) flags.push('web-proportion-limit');
  trace.push(...aisc.trace);
  return { standard, section: props, fy_MPa: fy, VRd_N: aisc.available_N, warningRatio: p.warningRatio, flags, trace, aisc, en: null };
}

/** |VEd| / VRd: the per member × combination arithmetic (shear sign is irrelevant). */
export function utilisationOf(capacity: PreparedCapacity, shear_N: number): number {
  return Math.abs(shear_N) / capacity.VRd_N;
}

export function statusOf(utilisation: number): CheckStatus {
  return utilisation <= 1 ? 'pass' : 'fail';
}

/** The full result with its trace for one shear force against prepared capacity. */
export function evaluateCapacity(capacity: PreparedCapacity, shear_N: number, contextFlags: readonly CheckFlag[] = []): CheckResult {
  if (typeof shear_N !== 'number' || !Number.isFinite(shear_N)) {
    throw new EngineInputError('shear_N', `shear_N must be a finite number of newtons, got ${String(shear_N)}`);
  }
  const utilisation = utilisationOf(capacity, shear_N);
  const status = statusOf(utilisation);
  const flags = [...new Set([...capacity.flags, ...contextFlags])];
  const trace = [...capacity.trace];
  let elasticUtilisation: number | null = null;
  if (capacity.en !== null) {
    const props = capacity.section;
    const tNa = props.widthAt_mm(props.neutralAxisFromBottom_mm);
    const tauEd = (Math.abs(shear_N) * props.qMax_mm3) / (props.iMajor_mm4 * tNa);
    elasticUtilisation = tauEd / capacity.en.elasticStressLimit_MPa;
    trace.push(
      step('EN 1993-1-1 §6.2.6(4) (6.20)', 'Elastic shear stress at the neutral axis (reported beside the check)', 'τEd = VEd·S/(I·t)', `${f(Math.abs(shear_N) / 1000)} kN × ${f(props.qMax_mm3)} mm³ / (${f(props.iMajor_mm4)} mm⁴ × ${f(tNa)} mm)`, tauEd, 'MPa'),
      step('EN 1993-1-1 §6.2.6(4) (6.19)', 'Elastic verification (not governing)', 'τEd / (fy/(√3·γM0))', `${f(tauEd)} MPa / ${f(capacity.en.elasticStressLimit_MPa)} MPa`, elasticUtilisation),
    );
    if (elasticUtilisation > 1 && status === 'pass') flags.push('elastic-check-exceeded');
  }
  trace.push(
    step('—', 'Utilisation', '|VEd| / VRd', `${f(Math.abs(shear_N) / 1000)} kN / ${f(capacity.VRd_N / 1000)} kN`, utilisation),
  );
  return {
    standard: capacity.standard,
    fy_MPa: capacity.fy_MPa,
    VEd_N: shear_N,
    VRd_N: capacity.VRd_N,
    utilisation,
    status,
    warning: status === 'pass' && utilisation >= capacity.warningRatio,
    elasticUtilisation,
    flags,
    trace,
  };
}

/** One member, one shear force: capacity, utilisation, status and trace. */
export function checkMember(input: CheckInput): CheckResult {
  const capacity = prepareCapacity(input.section, input, input.standard, input.params);
  return evaluateCapacity(capacity, input.shear_N, input.flags);
}
