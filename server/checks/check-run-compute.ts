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
} from '../engine/check';
import type { GradeId } from '../engine/grades';
import { EngineInputError } from '../engine/input-error';
import type { Fabrication, ISectionInput } from '../engine/section';
import { shearStressProfile } from '../engine/shear-stress';
import { formatNumber as f, step } from '../engine/trace';
import { type AxisCapacity, type AxisForces, evaluateFamilyCheck, FamilyCapacityCache, type FamilyCheckFlag, type PreparedFamilyCapacity } from '../engine/family-capacity';
import { webShearArea_mm2 } from '../engine/section-family';
import { type FamilyCheckName, SHEAR_CHECK_NAMES, type ShearAxis } from '../engine/shear-axis';
import { type EnBendingCapacity, enShearBendingUtilisation } from '../engine/shear-bending';
import { type IMemberProfile, isIProfile, type MemberFlag, type MemberProfile, type MemberRecord, sectionDimensionsOf } from '../ifc/model-read-result';
import type { GoverningShear, MomentPeak } from '../results/governing-shear';
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
  | 'several-result-keys'
  /** A moment about an axis is given where that axis's shear is not: that shear with bending is not checked. */
  | 'moment-without-shear'
  /** The largest moment acts at another station than the largest shear: the interaction is checked at the shear's. */
  | 'moment-peak-elsewhere';

export interface CombinationCheck {
  combination: string;
  /** The major-axis shear (Vz), signed, as imported; station, row and key are its own. */
  VEd_N: number;
  /** The largest of the member's checks in this combination, over both axes. */
  utilisation: number;
  station_mm?: number;
  row: number;
  memberKey: string;
  /**
   * Per axis, each the larger of its shear and its shear with bending; null where the axis has no shear given. Only
   * where the results give more than Vz (older runs and Vz-only results have |VEd|/VRd of the major axis).
   */
  byAxis?: { major: number; minor: number | null };
  /** The minor-axis shear (Vy), signed, when given. */
  minorVEd_N?: number;
}

/** The governing result of one axis and check over the combinations (what `checks` of a member lists). */
export interface AxisCheck {
  axis: ShearAxis;
  check: FamilyCheckName;
  combination: string;
  station_mm?: number;
  VEd_N: number;
  /** The moment at the shear's station, for 'shear with bending'; null for the shear checks. */
  MEd_Nmm: number | null;
  /** The shear resistance of the axis. */
  VRd_N: number;
  utilisation: number;
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
  /** The moment at the governing shear's station about the axis it bends, when given. */
  MEd_Nmm?: number;
}

export interface MemberCheck {
  globalId: string;
  status: MemberCheckStatus;
  /** Passing, but at or above the warning ratio. */
  warning: boolean;
  /** Why a member was not checked or not applicable; for a checked member, what of it was not checked. */
  reason?: string;
  grade: GradeId | null;
  fy_MPa: number | null;
  fabrication: Fabrication | null;
  governing: GoverningCheck | null;
  /** The governing result per axis and check the member was checked for; absent in older runs. */
  checks?: AxisCheck[];
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
  const profile = member.profile;
  if (!profile) return unchecked('not-checked', member.reason ?? 'No section could be read for this member.');
  if (shears.length === 0) return unchecked('not-checked', 'No shear results were matched to this member.', [...memberFlags, 'no-results']);

  const material = materialOf(member, parameters);
  const fabrication = overrides.get(sectionKey(profile.name)) ?? profile.fabrication;
  const invalid = (error: EngineInputError) => unchecked('not-checked', `The section cannot be checked: ${error.message}.`, [...memberFlags, 'invalid-profile']);
  const notes: string[] = [];
  let rules: MemberRules;
  if (isIProfile(profile)) {
    const prepared = capacities.get(checkedSection(profile, overrides).section, material);
    if (prepared instanceof EngineInputError) return invalid(prepared);
    // The minor axis and shear with bending of an I go through the family engine, with the I's own dimensions.
    const needsFamily = shears.some((shear) => shear.minor !== undefined || shear.majorMoment_Nmm !== undefined || shear.minorMomentPeak !== undefined);
    let family = needsFamily ? families.get(profile, fabrication, material) : null;
    if (family instanceof EngineInputError) {
      notes.push(`Minor-axis shear and shear with bending are not checked: ${family.message}.`);
      family = null;
    }
    rules = { i: prepared, family, majorVRd_N: prepared.capacity.VRd_N, majorBending: family?.major.applicable ? family.major.bending : null };
  } else {
    const family = families.get(profile, fabrication, material);
    if (family instanceof EngineInputError) return invalid(family);
    if (!family.major.applicable) return unchecked('not-applicable', `No shear check for this section by this standard: ${family.major.reason}.`);
    rules = { i: null, family, majorVRd_N: family.major.VRd_N, majorBending: family.major.bending };
  }
  const minorAxis = rules.family?.minor.applicable ? rules.family.minor : null;
  const givenFlags = new Set<RunFlag>();
  if (rules.family && !minorAxis && shears.some((shear) => shear.minor !== undefined)) {
    notes.push(`Minor-axis shear is not checked: ${(rules.family.minor as { reason: string }).reason}.`);
  }

  const best = emptySlots();
  const beyondMajorShear = shears.some((shear) => shear.minor !== undefined || (rules.majorBending !== null && shear.majorMoment_Nmm !== undefined));
  const combinations = shears.map((shear, index): CombinationCheck => {
    const majorShear = Math.abs(shear.shear_N) / rules.majorVRd_N;
    const majorBending = rules.majorBending !== null && shear.majorMoment_Nmm !== undefined ? enShearBendingUtilisation(rules.majorBending, shear.shear_N, shear.majorMoment_Nmm) : -1;
    const minor = shear.minor;
    const minorShear = minorAxis && minor ? Math.abs(minor.shear_N) / minorAxis.VRd_N : -1;
    const minorBending = minorAxis?.bending && minor?.moment_Nmm !== undefined ? enShearBendingUtilisation(minorAxis.bending, minor.shear_N, minor.moment_Nmm) : -1;
    keepLarger(best, SLOT.majorShear, majorShear, index);
    keepLarger(best, SLOT.majorBending, majorBending, index);
    keepLarger(best, SLOT.minorShear, minorShear, index);
    keepLarger(best, SLOT.minorBending, minorBending, index);
    if (shear.minorMomentPeak !== undefined && minor === undefined) givenFlags.add('moment-without-shear');
    if (momentPeakElsewhere(shear.majorMomentPeak, shear.majorMoment_Nmm, shear.station_mm) || (minor && momentPeakElsewhere(shear.minorMomentPeak, minor.moment_Nmm, minor.station_mm))) {
      givenFlags.add('moment-peak-elsewhere');
    }
    const major = Math.max(majorShear, majorBending);
    const minorUtilisation = minorShear < 0 ? null : Math.max(minorShear, minorBending);
    return {
      combination: shear.combination,
      VEd_N: shear.shear_N,
      utilisation: minorUtilisation !== null && minorUtilisation > major ? minorUtilisation : major,
      ...(shear.station_mm !== undefined && { station_mm: shear.station_mm }),
      row: shear.row,
      memberKey: shear.memberKey,
      ...(beyondMajorShear && { byAxis: { major, minor: minorUtilisation } }),
      ...(minor !== undefined && { minorVEd_N: minor.shear_N }),
    };
  });
  if (givenFlags.has('moment-without-shear')) notes.push('A moment about the minor axis is given without the minor-axis shear (Vy): shear with bending about that axis is not checked.');
  if (givenFlags.has('moment-peak-elsewhere')) notes.push('The largest moment acts at another station than the largest shear; shear with bending is checked at the largest shear with the moment there.');

  const slot = governingSlot(best);
  const shear = shears[best[slot].index];
  const axis: ShearAxis = slot === SLOT.minorShear || slot === SLOT.minorBending ? 'minor' : 'major';
  const forces = axis === 'major' ? { shear_N: shear.shear_N, moment_Nmm: shear.majorMoment_Nmm } : { shear_N: shear.minor!.shear_N, moment_Nmm: shear.minor!.moment_Nmm };
  const where = axis === 'major' ? shear : shear.minor!;
  const evaluated = evaluateGoverning(rules, axis, forces, member, material);
  const magnitude = Math.abs(forces.shear_N);
  const runFlags: RunFlag[] = [...givenFlags];
  if (fabrication !== profile.fabrication) runFlags.push('fabrication-overridden');
  if (rules.i ? rules.i.resistanceOverridden : rules.family!.major.applicable && rules.family!.major.aisc && projectResistanceFactor(parameters) !== null) runFlags.push('resistance-factor-overridden');
  if (new Set(shears.map((s) => s.memberKey)).size > 1) runFlags.push('several-result-keys');
  if (parameters.standard !== 'en1993-1-1' && shears.some((s) => s.majorMoment_Nmm !== undefined || s.minor?.moment_Nmm !== undefined)) runFlags.push('flexure-checked-separately');
  return {
    globalId: member.globalId,
    status: evaluated.status,
    warning: evaluated.warning,
    ...(notes.length > 0 && { reason: notes.join(' ') }),
    grade: material.grade,
    fy_MPa: evaluated.fy_MPa,
    fabrication: rules.i ? fabrication : rules.family!.fabrication,
    governing: {
      combination: shear.combination,
      VEd_N: forces.shear_N,
      utilisation: best[slot].utilisation,
      ...(where.station_mm !== undefined && { station_mm: where.station_mm }),
      row: where.row,
      memberKey: where.memberKey,
      VRd_N: evaluated.VRd_N,
      tauMax_MPa: magnitude * evaluated.tauMaxPerNewton_MPa,
      tauAvgWeb_MPa: magnitude * evaluated.tauAvgPerNewton_MPa,
      elasticUtilisation: evaluated.elasticUtilisation,
      ...(forces.moment_Nmm !== undefined && { MEd_Nmm: forces.moment_Nmm }),
      axis,
      check: SLOT_CHECKS[slot],
    },
    checks: axisChecks(best, shears, rules, minorAxis),
    combinations,
    flags: [...new Set<RunFlag>([...memberFlags, ...evaluated.flags, ...runFlags])],
  };
}

/** What a member is checked with: an I's check.ts capacity (major-axis shear), and the family engine's both axes. */
interface MemberRules {
  i: PreparedMember | null;
  /** null for an I whose results give neither Vy nor a moment (or whose outline the family engine refused). */
  family: PreparedFamilyCapacity | null;
  majorVRd_N: number;
  majorBending: EnBendingCapacity | null;
}

/** The four checks of a member, in the order that breaks ties (the plain shear of an axis before its interaction). */
const SLOT = { majorShear: 0, majorBending: 1, minorShear: 2, minorBending: 3 } as const;
const SLOT_CHECKS: readonly FamilyCheckName[] = [SHEAR_CHECK_NAMES.major, 'shear with bending', SHEAR_CHECK_NAMES.minor, 'shear with bending'];
const SLOT_AXES: readonly ShearAxis[] = ['major', 'major', 'minor', 'minor'];

/** Per check, the largest utilisation over the combinations and the combination's index (-1: not checked). */
type Slots = Array<{ utilisation: number; index: number }>;

function emptySlots(): Slots {
  return SLOT_CHECKS.map(() => ({ utilisation: -1, index: -1 }));
}

function keepLarger(slots: Slots, slot: number, utilisation: number, index: number): void {
  if (utilisation > slots[slot].utilisation) {
    slots[slot].utilisation = utilisation;
    slots[slot].index = index;
  }
}

function governingSlot(slots: Slots): number {
  let governing: number = SLOT.majorShear;
  for (let slot = 1; slot < slots.length; slot++) if (slots[slot].utilisation > slots[governing].utilisation) governing = slot;
  return governing;
}

/** Stations closer than this are one station (common practice, no source: far below any output spacing). */
const SAME_STATION_MM = 1;

/** The largest moment is larger than the one at the largest shear and acts elsewhere: its interaction is not checked. */
function momentPeakElsewhere(peak: MomentPeak | undefined, atShear_Nmm: number | undefined, shearStation_mm: number | undefined): boolean {
  if (peak === undefined || Math.abs(peak.moment_Nmm) <= Math.abs(atShear_Nmm ?? 0)) return false;
  return peak.station_mm === undefined || shearStation_mm === undefined || Math.abs(peak.station_mm - shearStation_mm) > SAME_STATION_MM;
}

/** The governing result of each axis and check the member was checked for. */
function axisChecks(slots: Slots, shears: readonly GoverningShear[], rules: MemberRules, minorAxis: AxisCapacity | null): AxisCheck[] {
  const checks: AxisCheck[] = [];
  slots.forEach(({ utilisation, index }, slot) => {
    if (index < 0) return;
    const shear = shears[index];
    const axis = SLOT_AXES[slot];
    const at = axis === 'major' ? { VEd_N: shear.shear_N, MEd_Nmm: shear.majorMoment_Nmm, station_mm: shear.station_mm } : { VEd_N: shear.minor!.shear_N, MEd_Nmm: shear.minor!.moment_Nmm, station_mm: shear.minor!.station_mm };
    const bending = slot === SLOT.majorBending || slot === SLOT.minorBending;
    checks.push({
      axis,
      check: SLOT_CHECKS[slot],
      combination: shear.combination,
      ...(at.station_mm !== undefined && { station_mm: at.station_mm }),
      VEd_N: at.VEd_N,
      MEd_Nmm: bending ? at.MEd_Nmm! : null,
      VRd_N: axis === 'major' ? rules.majorVRd_N : minorAxis!.VRd_N,
      utilisation,
    });
  });
  return checks;
}

interface GoverningEvaluation {
  status: 'pass' | 'fail';
  warning: boolean;
  fy_MPa: number;
  VRd_N: number;
  elasticUtilisation: number | null;
  /** τ is proportional to V: per newton of the governing shear, the peak and the average over the shear-carrying plates. */
  tauMaxPerNewton_MPa: number;
  tauAvgPerNewton_MPa: number;
  flags: readonly RunFlag[];
}

/**
 * The engine's full result for the governing axis and forces: check.ts for the major-axis shear of an I (unchanged),
 * the family engine for everything else (its I capacities on the major axis equal check.ts's).
 */
function evaluateGoverning(rules: MemberRules, axis: ShearAxis, forces: AxisForces & { shear_N: number }, member: CheckableMember, material: MaterialChoice): GoverningEvaluation {
  const profile = member.profile!;
  if (rules.i && axis === 'major' && (forces.moment_Nmm === undefined || rules.majorBending === null)) {
    const result = evaluateCapacity(rules.i.capacity, forces.shear_N, contextFlagsOf(profile, material));
    const { tauMaxPerNewton_MPa, tauAvgWebPerNewton_MPa } = rules.i;
    return { ...result, tauMaxPerNewton_MPa, tauAvgPerNewton_MPa: tauAvgWebPerNewton_MPa };
  }
  const prepared = rules.family!;
  const capacity = prepared[axis] as AxisCapacity;
  const result = evaluateFamilyCheck(prepared, axis, forces, contextFlagsOf(profile, material));
  // The web(s) for the major axis as before; for the minor axis the code's shear area of that axis (the flanges).
  const tauAvgPerNewton_MPa = 1 / (axis === 'major' ? webShearArea_mm2(prepared.dimensions) : (capacity.en?.av_mm2 ?? capacity.aisc!.aw_mm2));
  return {
    status: result.status === 'fail' ? 'fail' : 'pass',
    warning: result.warning,
    fy_MPa: result.fy_MPa,
    VRd_N: result.VRd_N,
    elasticUtilisation: result.elasticUtilisation,
    tauMaxPerNewton_MPa: capacity.tauMaxPerShear_perMm2,
    tauAvgPerNewton_MPa,
    flags: result.flags,
  };
}

export interface MaterialChoice {
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
function contextFlagsOf(profile: MemberProfile, material: MaterialChoice): CheckFlag[] {
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
export function materialOf(member: CheckableMember, parameters: CheckParameters): MaterialChoice {
  const material = member.material;
  if (material && !material.assumed) return { grade: material.grade, assumed: false };
  return { grade: parameters.defaultGrade, assumed: true };
}

/** The run's fabrication per section, by catalogue key. */
export function fabricationOverrides(parameters: CheckParameters): Map<string, Fabrication> {
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
      prepared = { ...base, major: withProjectResistanceFactor(base.major, this.parameters), minor: withProjectResistanceFactor(base.minor, this.parameters) };
      this.adjusted.set(base, prepared);
    }
    return prepared;
  }
}

/**
 * An axis of another family with the project's AISC resistance factor in place of the code's, and its step in the
 * trace, as runs and calculation sheets apply it.
 */
export function withProjectResistanceFactor<A extends PreparedFamilyCapacity['major']>(axis: A, parameters: CheckParameters): A {
  if (!axis.applicable || !axis.aisc) return axis;
  const factor = projectResistanceFactor(parameters);
  if (factor === null) return axis;
  const VRd_N = factor * axis.aisc.vn_N;
  const formula = parameters.standard === 'aisc360-22-lrfd' ? 'φv·Vn' : 'Vn/Ωv';
  const override = step('AISC 360-22 §G1', 'Available shear strength with the project’s resistance factor', formula, `${f(factor)} × ${f(axis.aisc.vn_N / 1000)} kN`, VRd_N / 1000, 'kN');
  const adjusted: AxisCapacity = { ...axis, VRd_N, trace: [...axis.trace, override] };
  return adjusted as A;
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
