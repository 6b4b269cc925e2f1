/**
 * The project's check defaults as a form: the default grade, the national-annex factors of EN 1993 (γM0, γM1, η) and
 * the warning band in percent, with the ranges the server accepts (server/projects/project-settings.ts).
 */
import { FormControl, FormGroup, Validators } from '@angular/forms';
import { standardFamily } from '../../../../server/projects/design-standard';
import { type GradeId } from '../../../../server/engine/grades';
import { defaultGradeFor } from '../../checks/check-parameter-fields';
import type { ProjectSettings, StandardId } from '../project';

export const FACTOR_RANGE = { min: 1, max: 1.5 } as const;
export const ETA_RANGE = { min: 1, max: 1.2 } as const;
export const WARNING_PERCENT_RANGE = { min: 50, max: 100 } as const;

export type CheckDefaultsForm = FormGroup<{
  defaultGrade: FormControl<GradeId>;
  gammaM0: FormControl<number | null>;
  gammaM1: FormControl<number | null>;
  eta: FormControl<number | null>;
  warningPercent: FormControl<number | null>;
}>;

const ranged = (range: { min: number; max: number }) => [Validators.required, Validators.min(range.min), Validators.max(range.max)];

export function createCheckDefaultsForm(standard: StandardId, settings: ProjectSettings): CheckDefaultsForm {
  return new FormGroup({
    defaultGrade: new FormControl(defaultGradeFor(standard, settings.defaultGrade), { nonNullable: true }),
    gammaM0: new FormControl<number | null>(settings.gammaM0, ranged(FACTOR_RANGE)),
    gammaM1: new FormControl<number | null>(settings.gammaM1, ranged(FACTOR_RANGE)),
    eta: new FormControl<number | null>(settings.eta, ranged(ETA_RANGE)),
    warningPercent: new FormControl<number | null>(Math.round(settings.warningBand * 100), ranged(WARNING_PERCENT_RANGE)),
  });
}

/** Whether the standard uses the EN partial factors and η (AISC 360 has φv / Ωv per run instead). */
export function usesEnFactors(standard: StandardId): boolean {
  return standardFamily(standard) === 'en';
}

/**
 * The `settings` of the PATCH: the EN factors only for an EN project, so an AISC project's stored values (kept for a
 * later change of code) are not rewritten from fields it does not show. Call only on a valid form.
 */
export function checkDefaultsOf(standard: StandardId, form: CheckDefaultsForm): Partial<ProjectSettings> {
  const value = form.getRawValue();
  const settings: Partial<ProjectSettings> = { defaultGrade: value.defaultGrade, warningBand: value.warningPercent! / 100 };
  if (usesEnFactors(standard)) Object.assign(settings, { gammaM0: value.gammaM0!, gammaM1: value.gammaM1!, eta: value.eta! });
  return settings;
}
