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
import { sectionPropertyValues } from '../engine/section-properties';
import { shearStressProfile } from '../engine/shear-stress';
import { requiredWebThickness_mm } from '../engine/web-thickness';
import { dimensionsLabel } from '../engine/section-family';
import { isIProfile, type MemberRecord, PROFILE_SOURCE_LABELS } from '../ifc/model-read-result';
import { REPORT_CAUTIONS } from '../reports/report-cautions';
import type { CheckParameters } from './check-parameters';
import { engineParamsOf, evaluateMember, type MemberCheck } from './check-run-compute';
import type { MemberSheet } from './checks-api-types';
import { evaluateFamilyMember, familySectionOf, familyStressOf } from './family-member-sheet';
import { governingCheckText } from './governing-check-text';
import { resultStatusOf } from './member-result-row';

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

const percent = (fraction: number): string => `${Math.round(fraction * 100)} %`;

/**
 * Where the section came from and, for a tapered member, its sections along the axis and the one checked: the smaller
 * one, since the imported results keep only the largest shear of each combination, not the force at every station.
 */
export function sectionNoteOf(member: MemberRecord): string | null {
  const profile = member.profile;
  if (!profile) return null;
  const found = `Section ${PROFILE_SOURCE_LABELS[profile.source]}.`;
  if (!profile.along?.length) return found;
  const sections = profile.along.map((s) => `at ${percent(s.at)} of the length: ${dimensionsLabel(s.dimensions)} mm`).join('; ');
  const governing = profile.governingAt === undefined ? '' : ` Checked with the smaller section, at ${percent(profile.governingAt)} of the length, for every combination (safe side).`;
  return `${found} Tapered member — ${sections}.${governing}`;
}

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
    sectionNote: sectionNoteOf(member),
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
  const recorded = {
    governing: governingOf(check, governing),
    combinations: combinationsOf(check),
  };
  if (member.profile && !isIProfile(member.profile)) {
    const family = evaluateFamilyMember(member, parameters, governing.axis ?? 'major', governing.VEd_N, governing.MEd_Nmm);
    if (!family) return base;
    return {
      ...base,
      gradeRule: gradeRuleOf(family.grade, parameters),
      ...recorded,
      familySection: familySectionOf(family),
      familyStress: familyStressOf(family, governing.VEd_N),
      trace: family.result.trace,
    };
  }
  if (governing.check !== undefined && governing.check !== 'major-axis shear') {
    // The I-section sheet draws the major-axis web check; a member governed by its minor axis or by shear with bending
    // shows the run's recorded result and says so, rather than a trace of a check that does not govern.
    return { ...base, ...recorded, sectionNote: `${base.sectionNote ?? ''} Governed by ${governingCheckText(governing.axis, governing.check)}: the recorded result is shown; its clause trace is not drawn on this sheet.`.trim() };
  }
  const evaluation = evaluateMember(member, parameters, governing.VEd_N);
  if (!evaluation) return base;
  const { section, capacity, result, grade } = evaluation;
  const profile = shearStressProfile(capacity.section, governing.VEd_N);
  return {
    ...base,
    section: { input: section, properties: sectionPropertyValues(capacity.section) },
    gradeRule: gradeRuleOf(grade, parameters),
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
    governing: recorded.governing,
    trace: result.trace,
    combinations: recorded.combinations,
    suggestion: suggestionFor(member, section, grade, input.standard, parameters, governing.VEd_N),
  };
}

const toKN = (value_N: number) => value_N / 1000;

// The engine reads EN grades by the run's yield rule (EN 10025-2 bands unless an EN run says otherwise).
function gradeRuleOf(grade: GradeId, parameters: CheckParameters): string {
  return yieldRuleLabel(grade, parameters.standard === 'en1993-1-1' ? parameters.yieldRule : 'en10025-2');
}

function governingOf(check: MemberCheck, governing: NonNullable<MemberCheck['governing']>): NonNullable<MemberSheet['governing']> {
  return {
    combination: governing.combination,
    station_mm: governing.station_mm ?? null,
    VEd_kN: toKN(governing.VEd_N),
    VRd_kN: toKN(governing.VRd_N),
    utilisation: governing.utilisation,
    status: resultStatusOf(check),
    flags: check.flags,
  };
}

function combinationsOf(check: MemberCheck): MemberSheet['combinations'] {
  return check.combinations.map((combination) => ({
    combination: combination.combination,
    station_mm: combination.station_mm ?? null,
    VEd_kN: toKN(combination.VEd_N),
    utilisation: combination.utilisation,
    memberKey: combination.memberKey,
    row: combination.row,
  }));
}

function cautionsFor(input: SheetInput): string[] {
  return input.runEngineVersion === input.currentEngineVersion ? [...REPORT_CAUTIONS] : [ENGINE_CHANGED, ...REPORT_CAUTIONS];
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
