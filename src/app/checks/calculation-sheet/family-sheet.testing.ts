// Invented members of other families for client specs; the family part of the sheet is built by the server's own
// code, as the API sends it. Not imported by the app.
import { recommendedParameters } from '../../../../server/checks/check-parameters';
import type { FamilySheetSection, FamilySheetStress, MemberSheet } from '../../../../server/checks/checks-api-types';
import { evaluateFamilyMember, familySectionOf, familyStressOf } from '../../../../server/checks/family-member-sheet';
import type { Standard } from '../../../../server/engine/check';
import { memberSheet } from '../checks.testing';

const SHEAR_N = 250_000;

/** The sheet of an invented S355 member of the given section under 250 kN on the major axis. */
export function familySheet(dimensions: FamilySheetSection['dimensions'], standard: Standard): MemberSheet & { familySection: FamilySheetSection; familyStress: FamilySheetStress } {
  const base = memberSheet();
  const parameters = recommendedParameters(standard);
  const member = {
    ...base.member,
    material: { name: 'S355', grade: 'S355' as const, fy_MPa: 355, assumed: false },
    profile: { ...dimensions, name: `invented ${dimensions.family}`, source: 'ifc-profile' as const, ifcType: 'IfcParameterizedProfileDef', fabrication: 'welded' as const },
  };
  const evaluation = evaluateFamilyMember(member, parameters, 'major', SHEAR_N);
  if (!evaluation) throw new Error(`no shear rule for the invented ${dimensions.family}`);
  return {
    ...base,
    member,
    standard,
    parameters,
    section: null,
    stress: null,
    familySection: familySectionOf(evaluation),
    familyStress: familyStressOf(evaluation, SHEAR_N),
    trace: evaluation.result.trace,
    suggestion: null,
  };
}
