/**
 * The "Start a check" form as plain data: its fields (percent and blanks as a person types them), the recommended
 * starting values taken from the project's settings, and the parameters object the server validates
 * (server/checks/check-parameters.ts). Pure, so the defaults and the conversion are tested without a dialog.
 */
import { GRADE_IDS, type GradeId, gradeFromMaterialName } from '../../../server/engine/grades';
import { standardFamily } from '../../../server/projects/design-standard';
import type { ProjectSettings } from '../../../server/projects/project-settings';
import type { StandardId } from '../projects/project';
import type { CheckParametersInput } from './checks-api';

export type { ProjectSettings };

export type Fabrication = 'rolled' | 'welded';

export interface FabricationOverrideField {
  profile: string;
  fabrication: Fabrication;
}

export interface CheckParameterFields {
  defaultGrade: GradeId;
  /** Utilisation from which a passing member is marked for attention, in percent. */
  warningPercent: number;
  /** Clear spacing of transverse stiffeners; null = unstiffened webs. */
  stiffenerSpacing_mm: number | null;
  gammaM0: number;
  gammaM1: number;
  /** null = the recommended value of EN 1993-1-5 §5.1 by grade. */
  eta: number | null;
  yieldRule: 'en10025-2' | 'en1993-1-1-table-3.1';
  endPost: 'non-rigid' | 'rigid';
  /** null = by AISC 360-22 §G1/§G2.1. */
  phiV: number | null;
  omegaV: number | null;
  fabricationOverrides: FabricationOverrideField[];
}

/** The grades a standard's family uses: EN grades for EN 1993, ASTM grades for AISC 360. */
export function gradesFor(standard: StandardId): GradeId[] {
  const en = standardFamily(standard) === 'en';
  return GRADE_IDS.filter((grade) => grade.startsWith('S') === en);
}

// Usual grade per family where the project names none that fits: S355 and A992 (common practice, no source).
const FAMILY_GRADE: Readonly<Record<'en' | 'aisc', GradeId>> = { en: 'S355', aisc: 'A992' };

/** The project's default grade read as a grade of the standard's family, or the family's usual grade. */
export function defaultGradeFor(standard: StandardId, settingsGrade: string | undefined): GradeId {
  const grade = settingsGrade ? gradeFromMaterialName(settingsGrade) : null;
  return grade !== null && gradesFor(standard).includes(grade) ? grade : FAMILY_GRADE[standardFamily(standard)];
}

/**
 * Starting values for a standard: the project's settings where it has them (γM0, γM1, η, warning band, grade), the
 * code's recommended values otherwise. η = 1.20 in the settings is the recommended value, so it stays "by grade".
 */
export function recommendedFields(standard: StandardId, settings: Partial<ProjectSettings> | undefined): CheckParameterFields {
  const eta = settings?.eta;
  return {
    defaultGrade: defaultGradeFor(standard, settings?.defaultGrade),
    warningPercent: Math.round((settings?.warningBand ?? 0.9) * 100),
    stiffenerSpacing_mm: null,
    // EN 1993-1-1 §6.1 NOTE 2B recommends γM0 = γM1 = 1.00.
    gammaM0: settings?.gammaM0 ?? 1,
    gammaM1: settings?.gammaM1 ?? 1,
    eta: eta === undefined || eta === 1.2 ? null : eta,
    yieldRule: 'en10025-2',
    endPost: 'non-rigid',
    phiV: null,
    omegaV: null,
    fabricationOverrides: [],
  };
}

/** The `parameters` of `POST …/checks` for the chosen standard; fields of the other standards are left out. */
export function checkParametersOf(standard: StandardId, fields: CheckParameterFields): CheckParametersInput {
  const overrides = Object.fromEntries(
    fields.fabricationOverrides
      .filter((override) => override.profile.trim() !== '')
      .map((override) => [override.profile.trim(), override.fabrication]),
  );
  const shared = {
    defaultGrade: fields.defaultGrade,
    warningRatio: Number((fields.warningPercent / 100).toPrecision(12)),
    stiffenerSpacing_mm: fields.stiffenerSpacing_mm,
    fabricationOverrides: overrides,
  };
  switch (standard) {
    case 'en1993-1-1':
      return {
        standard,
        ...shared,
        gammaM0: fields.gammaM0,
        gammaM1: fields.gammaM1,
        eta: fields.eta,
        yieldRule: fields.yieldRule,
        endPost: fields.endPost,
      };
    case 'aisc360-22-lrfd':
      return { standard, ...shared, phiV: fields.phiV };
    case 'aisc360-22-asd':
      return { standard, ...shared, omegaV: fields.omegaV };
  }
}
