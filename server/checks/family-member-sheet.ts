/**
 * The part of a calculation sheet that belongs to a member of another family (channel, tee, angle, box, tube): the
 * governing axis's check as the run made it, the outline to draw and τ(s) for the governing shear. Pure; no entities,
 * so client specs build sheet data with it too.
 */
import { sectionKey } from '../catalogue/catalogue';
import { type AxisCapacity, evaluateFamilyCheck, type FamilyCheckFlag, type FamilyCheckResult, prepareFamilyCapacity } from '../engine/family-capacity';
import type { GradeId } from '../engine/grades';
import { polygonShearStressProfile } from '../engine/polygon-shear-stress';
import { webShearArea_mm2 } from '../engine/section-family';
import { sectionOutline } from '../engine/section-outline';
import type { ShearAxis } from '../engine/shear-axis';
import { isIProfile, type MemberRecord, sectionDimensionsOf } from '../ifc/model-read-result';
import type { CheckParameters } from './check-parameters';
import { engineParamsOf, fabricationOverrides, materialOf, withProjectResistanceFactor } from './check-run-compute';
import type { FamilySheetSection, FamilySheetStress } from './checks-api-types';

/** Chord tolerance of the drawn outline: a tenth of a millimetre is below what any print of a section shows (common practice, no source). */
const DRAWING_CHORD_TOLERANCE_MM = 0.1;
/** A jump in τ smaller than this share of τmax is a chord of an arc, not a flange face: left unlabelled. */
const JUMP_LABEL_SHARE = 0.05;

export interface FamilyEvaluation {
  dimensions: FamilySheetSection['dimensions'];
  grade: GradeId;
  capacity: AxisCapacity;
  result: FamilyCheckResult;
}

/**
 * A member of another family against one shear on one axis as a run checks it (check-run-compute.ts
 * checkFamilyMember: the run's fabrication for the profile, the member's grade or the run's default, a project
 * resistance factor, the moment at the station for shear with bending): the governing trace the sheet shows. Null
 * when the axis has no rule for this section.
 */
export function evaluateFamilyMember(member: MemberRecord, parameters: CheckParameters, axis: ShearAxis, shear_N: number, moment_Nmm?: number): FamilyEvaluation | null {
  const profile = member.profile;
  if (!profile || isIProfile(profile) || member.status === 'not-applicable') return null;
  const fabrication = fabricationOverrides(parameters).get(sectionKey(profile.name)) ?? profile.fabrication;
  const { grade, assumed } = materialOf(member, parameters);
  const dimensions = sectionDimensionsOf(profile) as FamilySheetSection['dimensions'];
  const prepared = prepareFamilyCapacity(dimensions, { grade }, parameters.standard, { ...engineParamsOf(parameters), fabrication });
  const base = prepared[axis];
  if (!base.applicable) return null;
  const capacity = withProjectResistanceFactor(base, parameters);
  const contextFlags: FamilyCheckFlag[] = assumed ? ['assumed-grade'] : [];
  if (profile.source === 'catalogue' || profile.source === 'project-catalogue') contextFlags.push('catalogue-section');
  const result = evaluateFamilyCheck({ ...prepared, [axis]: capacity }, axis, { shear_N, ...(moment_Nmm !== undefined && { moment_Nmm }) }, contextFlags);
  return { dimensions, grade, capacity, result };
}

export function familySectionOf({ dimensions, capacity }: FamilyEvaluation): FamilySheetSection {
  const s = capacity.section;
  return {
    dimensions,
    outline: sectionOutline(dimensions, DRAWING_CHORD_TOLERANCE_MM),
    axis: capacity.axis,
    properties: {
      area_mm2: s.area_mm2,
      neutralAxis_mm: s.neutralAxis_mm,
      i_mm4: s.i_mm4,
      elasticModulus_mm3: s.elasticModulus_mm3,
      plasticNeutralAxis_mm: s.plasticNeutralAxis_mm,
      plasticModulus_mm3: s.plasticModulus_mm3,
      from_mm: s.from_mm,
      to_mm: s.to_mm,
      principal: s.principal,
    },
  };
}

export function familyStressOf({ dimensions, capacity }: FamilyEvaluation, shear_N: number): FamilySheetStress {
  const section = capacity.section;
  const profile = polygonShearStressProfile(section, shear_N);
  const points = profile.points;
  const jumps: FamilySheetStress['jumps'] = [];
  for (let i = 1; i < points.length; i++) {
    const [below, above] = [points[i - 1], points[i]];
    const inside = below.s_mm > section.from_mm && below.s_mm < section.to_mm;
    if (inside && below.s_mm === above.s_mm && Math.abs(above.tau_MPa - below.tau_MPa) >= JUMP_LABEL_SHARE * profile.tauMax_MPa) {
      jumps.push({ level_mm: below.s_mm, below_MPa: below.tau_MPa, above_MPa: above.tau_MPa });
    }
  }
  return {
    shear_kN: shear_N / 1000,
    samples: points.map((point) => ({ s_mm: point.s_mm, width_mm: point.width_mm, tau_MPa: point.tau_MPa })),
    tauMax_MPa: profile.tauMax_MPa,
    at_mm: profile.tauMaxAt_mm,
    jumps,
    average_MPa: profile.average_MPa,
    webAverage_MPa: capacity.axis === 'major' ? Math.abs(shear_N) / webShearArea_mm2(dimensions) : null,
    ...(capacity.en && { elasticLimit_MPa: capacity.en.elasticStressLimit_MPa }),
  };
}
