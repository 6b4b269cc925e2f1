/**
 * The calculation sheet of one member in a check run: the section and its properties, τ(y) over the depth for the
 * governing shear, the clause-by-clause trace, the per-combination table, a section that would pass and the web a
 * passing section would need, and the cautions. Pure: the stored run and member in, the sheet out.
 *
 * The recorded values (governing combination, VEd, VRd, utilisation) come from the run. The trace and τ(y) are
 * recomputed from the run's inputs; when the engine has changed since the run, the sheet says so.
 */
import { findSection, seriesOf } from '../catalogue/catalogue';
import { lightestPassingSection } from '../catalogue/section-selection';
import type { Standard } from '../engine/check';
import { type GradeId, yieldRuleLabel } from '../engine/grades';
import type { ISectionInput } from '../engine/section';
import type { SectionProperties } from '../engine/section-properties';
import { shearStressProfile, type JunctionStress } from '../engine/shear-stress';
import type { TraceStep } from '../engine/trace';
import { requiredWebThickness_mm } from '../engine/web-thickness';
import type { MemberRecord } from '../ifc/model-read-result';
import { REPORT_CAUTIONS } from '../reports/report-cautions';
import type { CheckParameters } from './check-parameters';
import { engineParamsOf, evaluateMember, type MemberCheck, type RunFlag } from './check-run-compute';
import type { ResultStatus } from './check-member-result.entity';
import { resultStatusOf } from './member-result-row';

export type SectionPropertyValues = Omit<SectionProperties, 'input' | 'levels_mm' | 'firstMoment_mm3' | 'widthAt_mm'>;

export interface MemberSheet {
  member: MemberRecord;
  standard: Standard;
  parameters: CheckParameters;
  status: ResultStatus;
  /** Why the member was not checked or is not applicable. */
  reason: string | null;
  /** The member's result as the run recorded it (with its per-combination list). */
  check: MemberCheck;
  section: { input: ISectionInput; properties: SectionPropertyValues } | null;
  grade: GradeId | null;
  fy_MPa: number | null;
  gradeRule: string | null;
  stress: {
    shear_kN: number;
    samples: { y_mm: number; tau_MPa: number }[];
    tauMax_MPa: number;
    at_mm: number;
    junctions: { top: JunctionStress; bottom: JunctionStress };
    webAverageClear_MPa: number;
    webAverageFullDepth_MPa: number;
    /** EN 1993-1-1 (6.19): fy/(√3·γM0); absent for AISC, whose check is not a stress check. */
    elasticLimit_MPa?: number;
  } | null;
  governing: {
    combination: string;
    station_mm: number | null;
    VEd_kN: number;
    VRd_kN: number;
    utilisation: number;
    status: ResultStatus;
    flags: RunFlag[];
  } | null;
  trace: TraceStep[];
  combinations: { combination: string; station_mm: number | null; VEd_kN: number; utilisation: number; memberKey: string; row: number }[];
  suggestion: {
    /** The lightest section of the same catalogue series that carries the governing shear (null: none, or not a catalogue section). */
    lighterPassing: { name: string; utilisation: number } | null;
    /** Web thickness that would bring the utilisation to 1.0, other dimensions kept; null when no web that fits would. */
    requiredWebThickness_mm: number | null;
  } | null;
  engineVersion: { run: string; sheet: string };
  cautions: string[];
}

export interface SheetInput {
  member: MemberRecord;
  check: MemberCheck;
  standard: Standard;
  parameters: CheckParameters;
  runEngineVersion: string;
  currentEngineVersion: string;
}

const ENGINE_CHANGED =
  'The engine has changed since this run: the trace and τ(y) below were recomputed by the current engine; the recorded values of the run are the governing row above.';

export function buildMemberSheet(input: SheetInput): MemberSheet {
  const { member, check, parameters } = input;
  const governing = check.governing;
  const base: MemberSheet = {
    member,
    standard: input.standard,
    parameters,
    status: resultStatusOf(check),
    reason: check.reason ?? null,
    check,
    section: null,
    grade: check.grade,
    fy_MPa: check.fy_MPa,
    gradeRule: null,
    stress: null,
    governing: null,
    trace: [],
    combinations: [],
    suggestion: null,
    engineVersion: { run: input.runEngineVersion, sheet: input.currentEngineVersion },
    cautions: cautionsFor(input),
  };
  if (!governing) return base;
  const evaluation = evaluateMember(member, parameters, governing.VEd_N);
  if (!evaluation) return base;
  const { section, capacity, result, grade } = evaluation;
  const profile = shearStressProfile(capacity.section, governing.VEd_N);
  const toKN = (value_N: number) => value_N / 1000;
  return {
    ...base,
    section: { input: section, properties: propertyValues(capacity.section) },
    // The engine reads EN grades by the run's yield rule (EN 10025-2 bands unless an EN run says otherwise).
    gradeRule: yieldRuleLabel(grade, parameters.standard === 'en1993-1-1' ? parameters.yieldRule : 'en10025-2'),
    stress: {
      shear_kN: toKN(governing.VEd_N),
      samples: profile.points.map((point) => ({ y_mm: point.y_mm, tau_MPa: point.tau_MPa })),
      tauMax_MPa: profile.tauMax_MPa,
      at_mm: profile.tauMaxAt_mm,
      junctions: { top: profile.topJunction, bottom: profile.bottomJunction },
      webAverageClear_MPa: profile.webAverageClear_MPa,
      webAverageFullDepth_MPa: profile.webAverageFullDepth_MPa,
      ...(capacity.en && { elasticLimit_MPa: capacity.en.elasticStressLimit_MPa }),
    },
    governing: {
      combination: governing.combination,
      station_mm: governing.station_mm ?? null,
      VEd_kN: toKN(governing.VEd_N),
      VRd_kN: toKN(governing.VRd_N),
      utilisation: governing.utilisation,
      status: resultStatusOf(check),
      flags: check.flags,
    },
    trace: result.trace,
    combinations: check.combinations.map((combination) => ({
      combination: combination.combination,
      station_mm: combination.station_mm ?? null,
      VEd_kN: toKN(combination.VEd_N),
      utilisation: combination.utilisation,
      memberKey: combination.memberKey,
      row: combination.row,
    })),
    suggestion: suggestionFor(member, section, grade, input.standard, parameters, governing.VEd_N),
  };
}

function cautionsFor(input: SheetInput): string[] {
  return input.runEngineVersion === input.currentEngineVersion ? [...REPORT_CAUTIONS] : [ENGINE_CHANGED, ...REPORT_CAUTIONS];
}

function propertyValues(props: SectionProperties): SectionPropertyValues {
  const { input: _input, levels_mm: _levels, firstMoment_mm3: _q, widthAt_mm: _b, ...values } = props;
  return values;
}

function suggestionFor(
  member: MemberRecord,
  section: ISectionInput,
  grade: GradeId,
  standard: Standard,
  parameters: CheckParameters,
  shear_N: number,
): NonNullable<MemberSheet['suggestion']> {
  const params = engineParamsOf(parameters);
  const catalogued = member.profile ? findSection(member.profile.name) : null;
  const lightest = catalogued ? lightestPassingSection({ series: seriesOf(catalogued), shear_N, material: { grade }, standard, params }) : null;
  return {
    lighterPassing: lightest && { name: lightest.section.name, utilisation: lightest.utilisation },
    requiredWebThickness_mm: requiredWebThickness_mm(section, { grade }, standard, shear_N, params),
  };
}
