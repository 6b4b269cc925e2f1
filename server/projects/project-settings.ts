import { z } from 'zod';
import { type DesignStandard, type StandardFamily, standardFamily } from './design-standard';

/**
 * Check-parameter defaults stored per project; a check run copies them and may override them.
 * Partial safety factors and η are national-annex choices, so the ranges are wide on purpose.
 */
export const projectSettingsSchema = z.object({
  /** Steel grade used when the model names none, e.g. S355 or A992. */
  defaultGrade: z.string().trim().min(1).max(40),
  /** EN 1993-1-1 §6.1 partial factor for cross-section resistance. */
  gammaM0: z.number().min(1).max(1.5),
  /** EN 1993-1-1 §6.1 partial factor for member (buckling) resistance. */
  gammaM1: z.number().min(1).max(1.5),
  /** EN 1993-1-5 §5.1 shear-area factor η. */
  eta: z.number().min(1).max(1.2),
  /** Utilisation from which a passing member is flagged as near its limit (our product setting). */
  warningBand: z.number().min(0.5).max(1),
});

export type ProjectSettings = z.infer<typeof projectSettingsSchema>;

// Default grades: the usual wide-flange grade for each family (ASTM A992 in US practice, S355 in
// European practice) — common practice, no source.
const DEFAULT_GRADE: Record<StandardFamily, string> = { aisc: 'A992', en: 'S355' };

export function defaultSettingsFor(standard: DesignStandard): ProjectSettings {
  return {
    defaultGrade: DEFAULT_GRADE[standardFamily(standard)],
    // EN 1993-1-1 §6.1(1) Note 2B recommended values γM0 = γM1 = 1.00.
    gammaM0: 1.0,
    gammaM1: 1.0,
    // EN 1993-1-5 §5.1(2) Note 2 recommends η = 1.20 up to S460 (from memory; national annexes differ).
    eta: 1.2,
    warningBand: 0.9,
  };
}

/**
 * Settings after a change of standard: a grade of the old family makes no sense under the new
 * one, so it follows the new family's default unless the same change names a grade.
 */
export function settingsForStandardChange(
  current: ProjectSettings,
  from: DesignStandard,
  to: DesignStandard,
  patch: Partial<ProjectSettings>,
): ProjectSettings {
  const familyChanged = standardFamily(from) !== standardFamily(to);
  const grade = patch.defaultGrade ?? (familyChanged ? DEFAULT_GRADE[standardFamily(to)] : current.defaultGrade);
  return { ...current, ...patch, defaultGrade: grade };
}
