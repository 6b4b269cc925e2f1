/**
 * The shear check of a section of any family on both axes, with shear and bending: the entry point per member, axis
 * and load combination.
 *
 * Split for speed as check.ts is: prepareFamilyCapacity() does everything that depends only on the section, grade,
 * standard and parameters (once per profile; FamilyCapacityCache keeps them), familyUtilisation() is the per-force
 * arithmetic, evaluateFamilyCheck() adds the result's words and the clause trace (sheets and the governing case).
 * I-sections loaded parallel to the web give exactly the capacities of check.ts.
 */
import { type AiscFamilyShear, aiscFamilyShearCapacity } from './aisc-360-22-families';
import { type CheckFlag, type CheckParams, type MaterialInput, resolveCheckParams, type Standard, STANDARDS } from './check';
import { type EnFamilyShear, enFamilyShearCapacity } from './en-1993-families';
import { type GradeId, yieldRuleLabel, yieldStrength } from './grades';
import { EngineInputError } from './input-error';
import { type PolygonAxisSection, polygonAxisSection } from './polygon-axis-section';
import type { Fabrication } from './section';
import { SECTION_FAMILY_LABELS, type SectionDimensions, thickestPlate_mm } from './section-family';
import { sectionOutline } from './section-outline';
import { aiscShearAndFlexure, type EnBendingCapacity, enShearBending, enShearBendingUtilisation, type MomentBasis, prepareEnBending } from './shear-bending';
import { type FamilyCheckName, SHEAR_AXES, SHEAR_CHECK_NAMES, type ShearAxis } from './shear-axis';
import { polygonShearStressProfile } from './polygon-shear-stress';
import { formatNumber as f, step, type TraceStep } from './trace';
import { MPA_PER_KSI } from './units';

export type FamilyCheckFlag =
  | CheckFlag
  /** AISC: transverse stiffeners given, §G2.2 tension-field action would apply and is not counted. */
  | 'tension-field-not-counted'
  /** AISC: a moment acts with the shear; flexure (Chapter F) and combined forces (Chapter H) are checked elsewhere. */
  | 'flexure-checked-separately'
  /** AISC G5 without a shear length: the length-dependent buckling stress was left out (conservative). */
  | 'shear-length-not-given'
  /** EN §6.2.8: the reduced yield strength was taken over the whole section (conservative). */
  | 'whole-section-reduced-for-shear';

export interface FamilyCheckParams extends CheckParams {
  /** Rolled or welded; when absent, rolled where the section has root fillets or corner radii, welded otherwise. */
  fabrication?: Fabrication;
  /** AISC G5: distance from the maximum to the zero shear force; null or absent when not known. */
  shearLength_mm?: number | null;
  /** EN §6.2.8: moment resistance on a plastic (class 1–2) or elastic (class 3) basis; elastic when absent. */
  momentBasis?: MomentBasis;
}

export interface AxisCapacity {
  readonly axis: ShearAxis;
  readonly check: FamilyCheckName;
  readonly applicable: true;
  readonly VRd_N: number;
  readonly flags: readonly FamilyCheckFlag[];
  /** The capacity steps of this axis (the common steps are in the prepared capacity's trace). */
  readonly trace: readonly TraceStep[];
  readonly en: EnFamilyShear | null;
  readonly aisc: AiscFamilyShear | null;
  /** EN §6.2.8 / EN 1993-1-5 §7.1 data; null for AISC. */
  readonly bending: EnBendingCapacity | null;
  /** The outline along this axis: τ(s) for the sheet with polygonShearStressProfile(section, V). */
  readonly section: PolygonAxisSection;
  /** τmax per newton of shear (EN elastic check (6.19) reported beside). */
  readonly tauMaxPerShear_perMm2: number;
}

export interface NotApplicableAxis {
  readonly axis: ShearAxis;
  readonly check: FamilyCheckName;
  readonly applicable: false;
  readonly reason: string;
}

export interface PreparedFamilyCapacity {
  readonly standard: Standard;
  readonly dimensions: SectionDimensions;
  readonly fabrication: Fabrication;
  readonly fy_MPa: number;
  readonly warningRatio: number;
  readonly flags: readonly FamilyCheckFlag[];
  /** Steps common to both axes: yield strength and parameters. */
  readonly trace: readonly TraceStep[];
  readonly major: AxisCapacity | NotApplicableAxis;
  readonly minor: AxisCapacity | NotApplicableAxis;
}

/** Forces at one station of one combination for one axis: the shear parallel to the axis and the moment it bends with. */
export interface AxisForces {
  shear_N?: number;
  /** Bending moment about the axis normal to the shear (My with Vz for 'major'). */
  moment_Nmm?: number;
}

export type FamilyCheckStatus = 'pass' | 'fail' | 'not-applicable';

export interface FamilyCheckResult {
  standard: Standard;
  axis: ShearAxis;
  status: FamilyCheckStatus;
  /** Why there is no check, for 'not-applicable'. */
  reason: string | null;
  /** The check that governs this axis: its shear, or shear with bending. */
  governing: FamilyCheckName;
  fy_MPa: number;
  VEd_N: number;
  VRd_N: number;
  shearUtilisation: number;
  MEd_Nmm: number | null;
  /** EN §6.2.8 / EN 1993-1-5 §7.1 utilisation when a moment is given; null for AISC or without a moment. */
  bendingUtilisation: number | null;
  utilisation: number;
  warning: boolean;
  /** EN: τmax/(fy/(√3·γM0)) by (6.19)/(6.20), reported beside; null for AISC. */
  elasticUtilisation: number | null;
  flags: FamilyCheckFlag[];
  trace: TraceStep[];
}

/** Chord tolerance of the outlines the engine measures: far below any rolling tolerance (common practice, no source). */
const CHORD_TOLERANCE_MM = 0.01;

/** Rolled where the geometry shows rolling (root fillets, corner radii), welded plates otherwise. */
export function defaultFabrication(d: SectionDimensions): Fabrication {
  switch (d.family) {
    case 'I':
      return d.topFlange.filletRadius_mm > 0 || d.bottomFlange.filletRadius_mm > 0 ? 'rolled' : 'welded';
    case 'channel':
    case 'tee':
    case 'angle':
      return d.rootRadius_mm > 0 ? 'rolled' : 'welded';
    case 'box':
      return (d.outerCornerRadius_mm ?? 0) > 0 || (d.innerCornerRadius_mm ?? 0) > 0 ? 'rolled' : 'welded';
    default:
      return 'rolled';
  }
}

function resolveFamilyYield(d: SectionDimensions, material: MaterialInput, rule: ReturnType<typeof resolveCheckParams>['yieldRule']): { fy_MPa: number; given: boolean; trace: TraceStep } {
  if (material.fy_MPa !== undefined) {
    const fy = material.fy_MPa;
    if (typeof fy !== 'number' || !Number.isFinite(fy) || fy <= 0) throw new EngineInputError('fy_MPa', `fy_MPa must be a positive number, got ${String(fy)}`);
    return { fy_MPa: fy, given: true, trace: step('—', 'Yield strength, given by the user', 'fy', `${f(fy)} MPa`, fy, 'MPa') };
  }
  if (material.grade === undefined) throw new EngineInputError('grade', 'either grade or fy_MPa is required');
  const t = thickestPlate_mm(d);
  const y = yieldStrength(material.grade as GradeId, t, rule);
  return { fy_MPa: y.fy_MPa, given: false, trace: step(yieldRuleLabel(material.grade, y.rule), `Yield strength of ${material.grade} for the thickest plate`, `fy (${y.band})`, `t = ${f(t)} mm`, y.fy_MPa, 'MPa') };
}

function optionalPositive(value: unknown, field: string): number | null {
  if (value === undefined || value === null) return null;
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) throw new EngineInputError(field, `${field} must be a positive number, got ${String(value)}`);
  return value;
}

/**
 * Every checkable axis of every family and standard is built by this one literal, so that all of them share one
 * object shape: familyUtilisation() then reads VRd_N and bending through one monomorphic access (built by spreads,
 * the shapes differed per family and the per-force path ran at half the speed of the same arithmetic).
 */
function checkableAxis(
  axis: ShearAxis,
  check: FamilyCheckName,
  section: PolygonAxisSection,
  tauMaxPerShear_perMm2: number,
  VRd_N: number,
  flags: readonly FamilyCheckFlag[],
  trace: readonly TraceStep[],
  en: EnFamilyShear | null,
  aisc: AiscFamilyShear | null,
  bending: EnBendingCapacity | null,
): AxisCapacity {
  return { axis, check, applicable: true, section, tauMaxPerShear_perMm2, VRd_N, flags, trace, en, aisc, bending };
}

/** Everything of the check that does not depend on the forces. Throws EngineInputError / SectionInputError for bad input. */
export function prepareFamilyCapacity(d: SectionDimensions, material: MaterialInput, standard: Standard, params: FamilyCheckParams = {}): PreparedFamilyCapacity {
  if (!STANDARDS.includes(standard)) throw new EngineInputError('standard', `standard must be one of ${STANDARDS.join(', ')}, got ${String(standard)}`);
  const p = resolveCheckParams(params);
  if (params.fabrication !== undefined && params.fabrication !== 'rolled' && params.fabrication !== 'welded') {
    throw new EngineInputError('params.fabrication', `params.fabrication must be 'rolled' or 'welded', got ${String(params.fabrication)}`);
  }
  if (params.momentBasis !== undefined && params.momentBasis !== 'plastic' && params.momentBasis !== 'elastic') {
    throw new EngineInputError('params.momentBasis', `params.momentBasis must be 'plastic' or 'elastic', got ${String(params.momentBasis)}`);
  }
  const shearLength_mm = optionalPositive(params.shearLength_mm, 'params.shearLength_mm');
  const fabrication = params.fabrication ?? defaultFabrication(d);
  const yieldInfo = resolveFamilyYield(d, material, p.yieldRule);
  const fy = yieldInfo.fy_MPa;
  const flags: FamilyCheckFlag[] = yieldInfo.given ? ['yield-strength-given'] : [];
  const trace: TraceStep[] = [yieldInfo.trace];
  const en = standard === 'en1993-1-1';
  const eta = p.eta ?? (fy <= 460 ? 1.2 : 1.0);
  if (en) {
    trace.push(step('EN 1993-1-5 §5.1(2) NOTE 2', 'Factor η', p.eta === null ? 'η = 1.20 for fy ≤ 460 MPa, else 1.00 (recommended)' : 'η (project parameter)', `fy = ${f(fy)} MPa`, eta));
    trace.push(step('EN 1993-1-1 §6.1 NOTE 2B', 'Partial factors', 'γM0, γM1 (project parameters)', `γM0 = ${f(p.gammaM0)}, γM1 = ${f(p.gammaM1)}`, '—'));
  } else {
    trace.push(step('AISC 360-22 §B3', 'Modulus of elasticity', 'E', `${f(p.e_MPa / MPA_PER_KSI, 5)} ksi`, p.e_MPa, 'MPa'));
  }

  const outline = d.family === 'other' ? null : sectionOutline(d, CHORD_TOLERANCE_MM);
  const prepareAxis = (axis: ShearAxis): AxisCapacity | NotApplicableAxis => {
    const check = SHEAR_CHECK_NAMES[axis];
    if (outline === null) {
      return { axis, check, applicable: false, reason: `no shear rule for this family (${d.family === 'other' ? d.description : SECTION_FAMILY_LABELS[d.family]}): only its extent is known` };
    }
    const section = polygonAxisSection(outline, axis);
    const axisFlags: FamilyCheckFlag[] = [];
    const profile = polygonShearStressProfile(section, 1);
    const checkable = (VRd_N: number, trace: readonly TraceStep[], en: EnFamilyShear | null, aisc: AiscFamilyShear | null, bending: EnBendingCapacity | null) =>
      checkableAxis(axis, check, section, profile.tauMax_MPa, VRd_N, axisFlags, trace, en, aisc, bending);
    if (en) {
      const rule = enFamilyShearCapacity(d, axis, section.area_mm2, fabrication, fy, { gammaM0: p.gammaM0, gammaM1: p.gammaM1, eta, endPost: p.endPost, stiffenerSpacing_mm: p.stiffenerSpacing_mm });
      if (!rule.applicable) return { axis, check, applicable: false, reason: rule.reason };
      const c = rule.capacity;
      const bending = prepareEnBending({
        dimensions: d,
        axis,
        fabrication,
        section,
        fy_MPa: fy,
        gammaM0: p.gammaM0,
        basis: params.momentBasis ?? 'elastic',
        vplRd_N: c.vplRd_N,
        webs: c.webs,
        vbwRd_N: c.bucklingChecked ? c.vbwRd_N : null,
      });
      if (c.webBucklingGoverns) axisFlags.push('web-buckling-governs');
      if (!bending.shearAreaPlates && bending.buckling === null) axisFlags.push('whole-section-reduced-for-shear');
      return checkable(c.vRd_N, c.trace, c, null, bending);
    }
    const method = standard === 'aisc360-22-lrfd' ? 'lrfd' : 'asd';
    const rule = aiscFamilyShearCapacity(d, axis, section.area_mm2, fabrication, fy, method, { e_MPa: p.e_MPa, stiffenerSpacing_mm: p.stiffenerSpacing_mm, shearLength_mm });
    if (!rule.applicable) return { axis, check, applicable: false, reason: rule.reason };
    const c = rule.capacity;
    if (c.webBucklingGoverns) axisFlags.push('web-buckling-governs');
    if (c.beyondProportionLimit) axisFlags.push('web-proportion-limit');
    if (c.tensionFieldNotCounted) axisFlags.push('tension-field-not-counted');
    if (d.family === 'tube' && shearLength_mm === null) axisFlags.push('shear-length-not-given');
    return checkable(c.available_N, c.trace, null, c, null);
  };
  const [major, minor] = SHEAR_AXES.map(prepareAxis);
  return { standard, dimensions: d, fabrication, fy_MPa: fy, warningRatio: p.warningRatio, flags, trace, major, minor };
}

/**
 * The per-force arithmetic: the larger of |VEd|/VRd and, by EN, the shear-with-bending utilisation (0 for no moment).
 * No checks of its input: the caller has validated the forces (evaluateFamilyCheck does). No allocation, one object
 * shape (checkableAxis); the division by VRd is kept (not a stored 1/VRd) so results match evaluateFamilyCheck bit for bit.
 */
export function familyUtilisation(c: AxisCapacity, shear_N: number, moment_Nmm = 0): number {
  const shear = Math.abs(shear_N) / c.VRd_N;
  if (c.bending === null || moment_Nmm === 0) return shear;
  const bending = enShearBendingUtilisation(c.bending, shear_N, moment_Nmm);
  return bending > shear ? bending : shear;
}

/** The full result with its trace for the forces of one axis at one station of one combination. */
export function evaluateFamilyCheck(prepared: PreparedFamilyCapacity, axis: ShearAxis, forces: AxisForces, contextFlags: readonly FamilyCheckFlag[] = []): FamilyCheckResult {
  if (axis !== 'major' && axis !== 'minor') throw new EngineInputError('axis', `axis must be 'major' or 'minor', got ${String(axis)}`);
  const c = prepared[axis];
  const { shear_N, moment_Nmm } = forces;
  const hasMoment = moment_Nmm !== undefined && moment_Nmm !== null;
  if (hasMoment && (shear_N === undefined || shear_N === null)) {
    throw new EngineInputError('shear_N', 'a bending moment was given without its shear force: shear with bending needs both at the same station');
  }
  if (typeof shear_N !== 'number' || !Number.isFinite(shear_N)) throw new EngineInputError('shear_N', `shear_N must be a finite number of newtons, got ${String(shear_N)}`);
  if (hasMoment && (typeof moment_Nmm !== 'number' || !Number.isFinite(moment_Nmm))) {
    throw new EngineInputError('moment_Nmm', `moment_Nmm must be a finite number of newton-millimetres, got ${String(moment_Nmm)}`);
  }
  const base = { standard: prepared.standard, axis, fy_MPa: prepared.fy_MPa, VEd_N: shear_N, MEd_Nmm: hasMoment ? (moment_Nmm as number) : null };
  if (!c.applicable) {
    return { ...base, status: 'not-applicable', reason: c.reason, governing: c.check, VRd_N: 0, shearUtilisation: 0, bendingUtilisation: null, utilisation: 0, warning: false, elasticUtilisation: null, flags: [...new Set([...prepared.flags, ...contextFlags])], trace: [...prepared.trace] };
  }
  const flags: FamilyCheckFlag[] = [...new Set([...prepared.flags, ...c.flags, ...contextFlags])];
  const trace = [...prepared.trace, ...c.trace];
  const v = Math.abs(shear_N);
  const shearUtilisation = v / c.VRd_N;
  trace.push(step('—', `Utilisation, ${c.check}`, '|VEd| / VRd', `${f(v / 1000)} kN / ${f(c.VRd_N / 1000)} kN`, shearUtilisation));

  let elasticUtilisation: number | null = null;
  if (c.en !== null) {
    const tau = v * c.tauMaxPerShear_perMm2;
    elasticUtilisation = tau / c.en.elasticStressLimit_MPa;
    trace.push(
      step('EN 1993-1-1 §6.2.6(4) (6.20)', 'Largest elastic shear stress over the section (reported beside the check)', 'τEd = VEd·S/(I·t)', `${f(v / 1000)} kN, τ/V from the section outline`, tau, 'MPa'),
      step('EN 1993-1-1 §6.2.6(4) (6.19)', 'Elastic verification (not governing)', 'τEd / (fy/(√3·γM0))', `${f(tau)} MPa / ${f(c.en.elasticStressLimit_MPa)} MPa`, elasticUtilisation),
    );
  }
  let bendingUtilisation: number | null = null;
  if (hasMoment) {
    if (c.bending !== null) {
      const result = enShearBending(c.bending, shear_N, moment_Nmm as number);
      bendingUtilisation = result.utilisation;
      trace.push(...result.trace);
    } else if (c.aisc !== null) {
      trace.push(...aiscShearAndFlexure(shear_N, moment_Nmm as number, c.VRd_N));
      flags.push('flexure-checked-separately');
    }
  }
  const withBending = bendingUtilisation !== null && bendingUtilisation > shearUtilisation;
  const utilisation = withBending ? (bendingUtilisation as number) : shearUtilisation;
  const status = utilisation <= 1 ? 'pass' : 'fail';
  if (elasticUtilisation !== null && elasticUtilisation > 1 && status === 'pass') flags.push('elastic-check-exceeded');
  return {
    ...base,
    status,
    reason: null,
    governing: withBending ? 'shear with bending' : c.check,
    VRd_N: c.VRd_N,
    shearUtilisation,
    bendingUtilisation,
    utilisation,
    warning: status === 'pass' && utilisation >= prepared.warningRatio,
    elasticUtilisation,
    flags,
    trace,
  };
}

/** Prepared capacities by everything they depend on: a model has thousands of members but a few dozen sections. */
export class FamilyCapacityCache {
  private readonly entries = new Map<string, PreparedFamilyCapacity>();

  get(d: SectionDimensions, material: MaterialInput, standard: Standard, params: FamilyCheckParams = {}): PreparedFamilyCapacity {
    const sortedParams = Object.keys(params)
      .sort()
      .map((k) => [k, params[k as keyof FamilyCheckParams] ?? null]);
    const key = JSON.stringify([standard, d, material.grade ?? null, material.fy_MPa ?? null, sortedParams]);
    let prepared = this.entries.get(key);
    if (!prepared) {
      prepared = prepareFamilyCapacity(d, material, standard, params);
      this.entries.set(key, prepared);
    }
    return prepared;
  }

  get size(): number {
    return this.entries.size;
  }
}
