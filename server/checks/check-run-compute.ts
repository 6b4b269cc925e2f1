/**
 * The computation of a check run: every member of a model revision against its governing shear per load combination,
 * by one standard with one set of parameters. Pure and synchronous (a worker runs it); plain data in and out.
 *
 * Capacity depends only on section, grade, fabrication and parameters, so it is prepared once per distinct
 * combination of those and cached; each member × combination is then one division. The full engine result with its
 * clause-by-clause trace is evaluated for the governing combination only.
 */
import { sectionKey } from '../catalogue/catalogue';
import { CapacityCache } from '../engine/capacity-cache';
import {
  type CheckFlag,
  type CheckParams,
  type CheckResult,
  evaluateCapacity,
  prepareCapacity,
  type PreparedCapacity,
  utilisationOf,
} from '../engine/check';
import type { GradeId } from '../engine/grades';
import { EngineInputError } from '../engine/input-error';
import type { Fabrication, ISectionInput } from '../engine/section';
import { shearStressProfile } from '../engine/shear-stress';
import { formatNumber as f, step } from '../engine/trace';
import { type AxisCapacity, evaluateFamilyCheck, FamilyCapacityCache, type FamilyCheckFlag, familyUtilisation, type PreparedFamilyCapacity } from '../engine/family-capacity';
import { webShearArea_mm2 } from '../engine/section-family';
import type { FamilyCheckName, ShearAxis } from '../engine/shear-axis';
import { type IMemberProfile, isIProfile, type MemberFlag, type MemberProfile, type MemberRecord, sectionDimensionsOf } from '../ifc/model-read-result';
import type { GoverningShear } from '../results/governing-shear';
import type { CheckParameters } from './check-parameters';

export type CheckableMember = Pick<MemberRecord, 'globalId' | 'status' | 'reason' | 'profile' | 'material' | 'flags'>;

export type MemberCheckStatus = 'pass' | 'fail' | 'not-checked' | 'not-applicable';

export type RunFlag =
  | CheckFlag
  | FamilyCheckFlag
  | MemberFlag
  | 'no-results'
  | 'fabrication-overridden'
  | 'resistance-factor-overridden'
  | 'several-result-keys';

export interface CombinationCheck {
  combination: string;
  /** Signed, as imported. */
  VEd_N: number;
  utilisation: number;
  station_mm?: number;
  row: number;
  memberKey: string;
}

export interface GoverningCheck extends CombinationCheck {
  VRd_N: number;
  /** Elastic τ = VQ/(It) at its peak, and the clear-web average V/(hw·tw), both for the governing |VEd|. */
  tauMax_MPa: number;
  tauAvgWeb_MPa: number;
  /** EN 1993-1-1 (6.19)/(6.20), reported beside the check; null for AISC. */
  elasticUtilisation: number | null;
  /** The axis and check that govern ('major' and 'major-axis shear' for the web of an I); absent in older runs. */
  axis?: ShearAxis;
  check?: FamilyCheckName;
}

export interface MemberCheck {
  globalId: string;
  status: MemberCheckStatus;
  /** Passing, but at or above the warning ratio. */
  warning: boolean;
  /** Why a member was not checked or not applicable. */
  reason?: string;
  grade: GradeId | null;
  fy_MPa: number | null;
  fabrication: Fabrication | null;
  governing: GoverningCheck | null;
  combinations: CombinationCheck[];
  flags: RunFlag[];
}

export interface CheckRunSummary {
  members: number;
  pass: number;
  fail: number;
  notChecked: number;
  notApplicable: number;
  warnings: number;
  maxUtilisation: number | null;
  maxUtilisationGlobalId: string | null;
  /** Distinct capacities prepared (section × grade × fabrication). */
  capacitiesPrepared: number;
}

export interface CheckRunComputation {
  members: MemberCheck[];
  summary: CheckRunSummary;
}

export interface CheckRunProgress {
  done: number;
  total: number;
}

export interface CheckRunInput {
  members: readonly CheckableMember[];
  /** Governing shear per load combination, by member GlobalId (see governingShearsByMember). */
  shears: ReadonlyMap<string, readonly GoverningShear[]>;
  parameters: CheckParameters;
  onProgress?: (progress: CheckRunProgress) => void;
}

/** About a hundred progress reports per run, whatever its size. */
const PROGRESS_STEPS = 100;

export function computeCheckRun(input: CheckRunInput): CheckRunComputation {
  const { members, shears, parameters, onProgress } = input;
  const capacities = new RunCapacities(parameters);
  const families = new RunFamilyCapacities(parameters);
  const overrides = fabricationOverrides(parameters);
  const every = Math.max(1, Math.ceil(members.length / PROGRESS_STEPS));
  const results: MemberCheck[] = [];
  members.forEach((member, index) => {
    results.push(checkOneMember(member, shears.get(member.globalId) ?? [], parameters, overrides, capacities, families));
    if (onProgress && ((index + 1) % every === 0 || index + 1 === members.length)) {
      onProgress({ done: index + 1, total: members.length });
    }
  });
  return { members: results, summary: summarise(results, capacities.size + families.size) };
}

function checkOneMember(
  member: CheckableMember,
  shears: readonly GoverningShear[],
  parameters: CheckParameters,
  overrides: ReadonlyMap<string, Fabrication>,
  capacities: RunCapacities,
  families: RunFamilyCapacities,
): MemberCheck {
  const memberFlags: RunFlag[] = [...member.flags];
  const unchecked = (status: MemberCheckStatus, reason: string, flags: RunFlag[] = memberFlags): MemberCheck => ({
    globalId: member.globalId,
    status,
    warning: false,
    reason,
    grade: null,
    fy_MPa: null,
    fabrication: member.profile?.fabrication ?? null,
    governing: null,
    combinations: [],
    flags,
  });
  if (member.status === 'not-applicable') return unchecked('not-applicable', member.reason ?? 'The profile is not an I-section.');
  // A flagged member may carry a section (read, but on a member of no length, say); it is never checked.
  if (member.status === 'flagged') return unchecked('not-checked', member.reason ?? 'The model reader flagged this member.');
  if (!member.profile) return unchecked('not-checked', member.reason ?? 'No section could be read for this member.');
  if (shears.length === 0) return unchecked('not-checked', 'No shear results were matched to this member.', [...memberFlags, 'no-results']);
  if (!isIProfile(member.profile)) return checkFamilyMember(member, member.profile, shears, parameters, overrides, families, unchecked);

  const { section, overridden } = checkedSection(member.profile, overrides);
  const material = materialOf(member, parameters);
  const prepared = capacities.get(section, material);
  if (prepared instanceof EngineInputError) {
    return unchecked('not-checked', `The section cannot be checked: ${prepared.message}.`, [...memberFlags, 'invalid-profile']);
  }
  const { capacity } = prepared;

  const combinations = shears.map((shear) => ({
    combination: shear.combination,
    VEd_N: shear.shear_N,
    utilisation: utilisationOf(capacity, shear.shear_N),
    ...(shear.station_mm !== undefined && { station_mm: shear.station_mm }),
    row: shear.row,
    memberKey: shear.memberKey,
  }));
  let governing = combinations[0];
  for (const combination of combinations) if (combination.utilisation > governing.utilisation) governing = combination;

  const result = evaluateCapacity(capacity, governing.VEd_N, contextFlagsOf(member.profile, material));
  const runFlags: RunFlag[] = [];
  if (overridden) runFlags.push('fabrication-overridden');
  if (prepared.resistanceOverridden) runFlags.push('resistance-factor-overridden');
  if (new Set(shears.map((shear) => shear.memberKey)).size > 1) runFlags.push('several-result-keys');
  const magnitude = Math.abs(governing.VEd_N);
  return {
    globalId: member.globalId,
    status: result.status,
    warning: result.warning,
    grade: material.grade,
    fy_MPa: result.fy_MPa,
    fabrication: section.fabrication,
    governing: {
      ...governing,
      VRd_N: result.VRd_N,
      tauMax_MPa: magnitude * prepared.tauMaxPerNewton_MPa,
      tauAvgWeb_MPa: magnitude * prepared.tauAvgWebPerNewton_MPa,
      elasticUtilisation: result.elasticUtilisation,
    },
    combinations,
    flags: [...new Set<RunFlag>([...memberFlags, ...result.flags, ...runFlags])],
  };
}

/**
 * A member of another family (channel, tee, angle, box, tube) against the shear parallel to its web(s): the results
 * give one shear force per combination, taken as the major-axis shear.
 */
function checkFamilyMember(
  member: CheckableMember,
  profile: MemberProfile,
  shears: readonly GoverningShear[],
  parameters: CheckParameters,
  overrides: ReadonlyMap<string, Fabrication>,
  families: RunFamilyCapacities,
  unchecked: (status: MemberCheckStatus, reason: string, flags?: RunFlag[]) => MemberCheck,
): MemberCheck {
  const memberFlags: RunFlag[] = [...member.flags];
  const fabrication = overrides.get(sectionKey(profile.name)) ?? profile.fabrication;
  const material = materialOf(member, parameters);
  const prepared = families.get(profile, fabrication, material);
  if (prepared instanceof EngineInputError) {
    return unchecked('not-checked', `The section cannot be checked: ${prepared.message}.`, [...memberFlags, 'invalid-profile']);
  }
  const axis = prepared.major;
  if (!axis.applicable) return unchecked('not-applicable', `No shear check for this section by this standard: ${axis.reason}.`);
  const combinations = shears.map((shear) => ({
    combination: shear.combination,
    VEd_N: shear.shear_N,
    utilisation: familyUtilisation(axis, shear.shear_N),
    ...(shear.station_mm !== undefined && { station_mm: shear.station_mm }),
    row: shear.row,
    memberKey: shear.memberKey,
  }));
  let governing = combinations[0];
  for (const combination of combinations) if (combination.utilisation > governing.utilisation) governing = combination;
  const contextFlags: FamilyCheckFlag[] = material.assumed ? ['assumed-grade'] : [];
  if (profile.source === 'catalogue' || profile.source === 'project-catalogue') contextFlags.push('catalogue-section');
  const result = evaluateFamilyCheck(prepared, 'major', { shear_N: governing.VEd_N }, contextFlags);
  const runFlags: RunFlag[] = fabrication !== profile.fabrication ? ['fabrication-overridden'] : [];
  if (axis.aisc && projectResistanceFactor(parameters) !== null) runFlags.push('resistance-factor-overridden');
  if (new Set(shears.map((shear) => shear.memberKey)).size > 1) runFlags.push('several-result-keys');
  const magnitude = Math.abs(governing.VEd_N);
  return {
    globalId: member.globalId,
    status: result.status === 'fail' ? 'fail' : 'pass',
    warning: result.warning,
    grade: material.grade,
    fy_MPa: result.fy_MPa,
    fabrication: prepared.fabrication,
    governing: {
      ...governing,
      VRd_N: result.VRd_N,
      tauMax_MPa: magnitude * axis.tauMaxPerShear_perMm2,
      tauAvgWeb_MPa: magnitude / webShearArea_mm2(prepared.dimensions),
      elasticUtilisation: result.elasticUtilisation,
      axis: 'major',
      check: result.governing,
    },
    combinations,
    flags: [...new Set<RunFlag>([...memberFlags, ...result.flags, ...runFlags])],
  };
}

interface MaterialChoice {
  grade: GradeId;
  assumed: boolean;
}

/** The section as a run checks it: the model's dimensions, with the run's fabrication for that profile if it has one. */
function checkedSection(profile: IMemberProfile, overrides: ReadonlyMap<string, Fabrication>): { section: ISectionInput; overridden: boolean } {
  const fabrication = overrides.get(sectionKey(profile.name)) ?? profile.fabrication;
  const { depth_mm, webThickness_mm, topFlange, bottomFlange } = profile;
  return { section: { depth_mm, webThickness_mm, topFlange, bottomFlange, fabrication }, overridden: fabrication !== profile.fabrication };
}

/** What the member's data tells the result beside the engine's own flags. */
function contextFlagsOf(profile: IMemberProfile, material: MaterialChoice): CheckFlag[] {
  const flags: CheckFlag[] = [];
  if (material.assumed) flags.push('assumed-grade');
  if (profile.source === 'catalogue' || profile.source === 'project-catalogue') flags.push('catalogue-section');
  return flags;
}

export interface MemberEvaluation {
  section: ISectionInput;
  grade: GradeId;
  /** With the project's resistance factor, if the run has one. */
  capacity: PreparedCapacity;
  /** The engine's full result for the shear, with its clause-by-clause trace. */
  result: CheckResult;
}

/**
 * One member against one shear force exactly as a run checks it (section, grade, fabrication override, resistance
 * factor): what a calculation sheet shows for the governing combination. Throws EngineInputError for a section the
 * engine refuses; null for a member without an I-section.
 */
export function evaluateMember(member: CheckableMember, parameters: CheckParameters, shear_N: number): MemberEvaluation | null {
  if (!isIProfile(member.profile) || member.status === 'not-applicable') return null;
  const { section } = checkedSection(member.profile, fabricationOverrides(parameters));
  const material = materialOf(member, parameters);
  const capacity = withResistanceFactor(prepareCapacity(section, { grade: material.grade }, parameters.standard, engineParamsOf(parameters)), parameters);
  return { section, grade: material.grade, capacity, result: evaluateCapacity(capacity, shear_N, contextFlagsOf(member.profile, material)) };
}

/** The member's grade, or the run's default grade when the model's material named none. */
function materialOf(member: CheckableMember, parameters: CheckParameters): MaterialChoice {
  const material = member.material;
  if (material && !material.assumed) return { grade: material.grade, assumed: false };
  return { grade: parameters.defaultGrade, assumed: true };
}

function fabricationOverrides(parameters: CheckParameters): Map<string, Fabrication> {
  return new Map(Object.entries(parameters.fabricationOverrides).map(([name, fabrication]) => [sectionKey(name), fabrication]));
}

interface PreparedMember {
  capacity: PreparedCapacity;
  /** τ is proportional to V, so the profile is computed once for 1 N and scaled. */
  tauMaxPerNewton_MPa: number;
  tauAvgWebPerNewton_MPa: number;
  resistanceOverridden: boolean;
}

/**
 * The engine's capacity cache plus what a run adds once per prepared capacity: the unit shear-stress profile and a
 * project resistance factor. A section the engine refuses comes back as its error.
 */
class RunCapacities {
  private readonly engine = new CapacityCache();
  private readonly prepared = new Map<PreparedCapacity, PreparedMember>();
  private readonly engineParams: CheckParams;

  constructor(private readonly parameters: CheckParameters) {
    this.engineParams = engineParamsOf(parameters);
  }

  get size(): number {
    return this.engine.size;
  }

  get(section: ISectionInput, material: MaterialChoice): PreparedMember | EngineInputError {
    let base: PreparedCapacity;
    try {
      base = this.engine.get(section, { grade: material.grade }, this.parameters.standard, this.engineParams);
    } catch (error) {
      if (error instanceof EngineInputError) return error;
      throw error;
    }
    let entry = this.prepared.get(base);
    if (!entry) {
      const capacity = withResistanceFactor(base, this.parameters);
      const unit = shearStressProfile(capacity.section, 1);
      entry = {
        capacity,
        tauMaxPerNewton_MPa: unit.tauMax_MPa,
        tauAvgWebPerNewton_MPa: unit.webAverageClear_MPa,
        resistanceOverridden: capacity !== base,
      };
      this.prepared.set(base, entry);
    }
    return entry;
  }
}

/**
 * Prepared capacities of the other families for a run: both axes, once per section, grade and fabrication. A
 * project resistance factor (AISC φv / Ωv) replaces the standard's, as for I-sections.
 */
class RunFamilyCapacities {
  private readonly engine = new FamilyCapacityCache();
  private readonly adjusted = new Map<PreparedFamilyCapacity, PreparedFamilyCapacity>();

  constructor(private readonly parameters: CheckParameters) {}

  get size(): number {
    return this.engine.size;
  }

  get(profile: MemberProfile, fabrication: Fabrication, material: MaterialChoice): PreparedFamilyCapacity | EngineInputError {
    let base: PreparedFamilyCapacity;
    try {
      base = this.engine.get(sectionDimensionsOf(profile), { grade: material.grade }, this.parameters.standard, { ...engineParamsOf(this.parameters), fabrication });
    } catch (error) {
      if (error instanceof EngineInputError) return error;
      throw error;
    }
    let prepared = this.adjusted.get(base);
    if (!prepared) {
      prepared = { ...base, major: this.withResistanceFactor(base.major), minor: this.withResistanceFactor(base.minor) };
      this.adjusted.set(base, prepared);
    }
    return prepared;
  }

  private withResistanceFactor(axis: PreparedFamilyCapacity['major']): PreparedFamilyCapacity['major'] {
    if (!axis.applicable || !axis.aisc) return axis;
    const parameters = this.parameters;
    const factor = projectResistanceFactor(parameters);
    if (factor === null) return axis;
    const VRd_N = factor * axis.aisc.vn_N;
    const formula = parameters.standard === 'aisc360-22-lrfd' ? 'φv·Vn' : 'Vn/Ωv';
    const override = step('AISC 360-22 §G1', 'Available shear strength with the project’s resistance factor', formula, `${f(factor)} × ${f(axis.aisc.vn_N / 1000)} kN`, VRd_N / 1000, 'kN');
    const adjusted: AxisCapacity = { ...axis, VRd_N, trace: [...axis.trace, override] };
    return adjusted;
  }
}

/** The project's AISC resistance factor φv, or 1/Ωv for ASD, when the run sets one; null otherwise. */
function projectResistanceFactor(parameters: CheckParameters): number | null {
  if (parameters.standard === 'aisc360-22-lrfd') return parameters.phiV;
  if (parameters.standard === 'aisc360-22-asd' && parameters.omegaV !== null) return 1 / parameters.omegaV;
  return null;
}

/** The engine's parameters for a run's. */
export function engineParamsOf(parameters: CheckParameters): CheckParams {
  const shared = { warningRatio: parameters.warningRatio, stiffenerSpacing_mm: parameters.stiffenerSpacing_mm };
  if (parameters.standard !== 'en1993-1-1') return shared;
  const { gammaM0, gammaM1, eta, yieldRule, endPost } = parameters;
  return { ...shared, gammaM0, gammaM1, yieldRule, endPost, ...(eta !== null && { eta }) };
}

/**
 * A project's own φv (LRFD) or Ωv (ASD) in place of the code's: available strength = φv·Vn or Vn/Ωv, with the step
 * in the trace so the calculation sheet shows it.
 */
function withResistanceFactor(capacity: PreparedCapacity, parameters: CheckParameters): PreparedCapacity {
  if (!capacity.aisc) return capacity;
  const { vn_N } = capacity.aisc;
  if (parameters.standard === 'aisc360-22-lrfd' && parameters.phiV !== null) {
    const VRd_N = parameters.phiV * vn_N;
    const override = step('AISC 360-22 §G1', 'Available shear strength with the project’s resistance factor', 'φv·Vn', `${f(parameters.phiV)} × ${f(vn_N / 1000)} kN`, VRd_N / 1000, 'kN');
    return { ...capacity, VRd_N, trace: [...capacity.trace, override] };
  }
  if (parameters.standard === 'aisc360-22-asd' && parameters.omegaV !== null) {
    const VRd_N = vn_N / parameters.omegaV;
    const override = step('AISC 360-22 §G1', 'Allowable shear strength with the project’s safety factor', 'Vn/Ωv', `${f(vn_N / 1000)} kN / ${f(parameters.omegaV)}`, VRd_N / 1000, 'kN');
    return { ...capacity, VRd_N, trace: [...capacity.trace, override] };
  }
  return capacity;
}

function summarise(results: readonly MemberCheck[], capacitiesPrepared: number): CheckRunSummary {
  const summary: CheckRunSummary = {
    members: results.length,
    pass: 0,
    fail: 0,
    notChecked: 0,
    notApplicable: 0,
    warnings: 0,
    maxUtilisation: null,
    maxUtilisationGlobalId: null,
    capacitiesPrepared,
  };
  for (const result of results) {
    if (result.status === 'pass') summary.pass++;
    else if (result.status === 'fail') summary.fail++;
    else if (result.status === 'not-checked') summary.notChecked++;
    else summary.notApplicable++;
    if (result.warning) summary.warnings++;
    const utilisation = result.governing?.utilisation;
    if (utilisation !== undefined && (summary.maxUtilisation === null || utilisation > summary.maxUtilisation)) {
      summary.maxUtilisation = utilisation;
      summary.maxUtilisationGlobalId = result.globalId;
    }
  }
  return summary;
}
