/**
 * The parameters a new run uses: the project's stored defaults (grade, partial factors, warning band), then what the
 * engineer gave, validated per standard with every other field at its recommended value.
 */
import type { Standard } from '../engine/check';
import { gradeFromMaterialName, isGradeId } from '../engine/grades';
import { type FieldIssue, ValidationError } from '../http/errors';
import { defaultSettingsFor, type ProjectSettings } from '../projects/project-settings';
import { type CheckParameters, checkParametersSchema } from './check-parameters';

export function runParameters(settings: ProjectSettings, standard: Standard, given: Record<string, unknown>): CheckParameters {
  const result = checkParametersSchema.safeParse({ ...projectDefaults(settings, standard), ...given, standard });
  if (result.success) return result.data;
  const details: FieldIssue[] = result.error.issues.map((issue) => ({
    location: 'body',
    field: ['parameters', ...issue.path.map(String)].join('.'),
    message: issue.message,
  }));
  throw new ValidationError(`The check parameters are not usable: ${details.map((d) => `${d.field}: ${d.message}`).join('; ')}.`, {
    code: 'invalid_parameters',
    details,
  });
}

function projectDefaults(settings: ProjectSettings, standard: Standard): Record<string, unknown> {
  const grade = isGradeId(settings.defaultGrade) ? settings.defaultGrade : gradeFromMaterialName(settings.defaultGrade);
  const shared = { warningRatio: settings.warningBand, ...(grade && { defaultGrade: grade }) };
  if (standard !== 'en1993-1-1') return shared;
  // η is carried only when the project chose its own: the stored default (1.20) would also apply above S460, where
  // EN 1993-1-5 §5.1 NOTE 2 recommends 1.00, and the run's own default (null) follows that rule.
  const ownEta = settings.eta !== defaultSettingsFor(standard).eta;
  return { ...shared, gammaM0: settings.gammaM0, gammaM1: settings.gammaM1, ...(ownEta && { eta: settings.eta }) };
}
