import type { RunFlag } from '../../../server/checks/check-run-compute';

/** Short words for the flags a run stores on a member, as the table's chips show them. */
export const FLAG_LABELS: Readonly<Record<RunFlag, string>> = {
  'web-buckling-governs': 'web buckling',
  'web-proportion-limit': 'slender web',
  'elastic-check-exceeded': 'elastic check exceeded',
  'yield-strength-given': 'fy given',
  'assumed-grade': 'grade assumed',
  'catalogue-section': 'catalogue section',
  'no-material': 'no material',
  'no-representation': 'no geometry',
  'no-axis': 'no axis',
  'no-geometry': 'no geometry',
  'geometry-built': 'geometry rebuilt',
  'invalid-profile': 'invalid profile',
  'profile-not-in-catalogue': 'profile unknown',
  'no-profile': 'no profile',
  'derived-profile': 'derived profile',
  tapered: 'tapered',
  'top-flange-assumed': 'top flange assumed',
  curved: 'curved',
  'several-profiles': 'several profiles',
  'name-and-geometry-differ': 'name and geometry differ',
  'section-unrecognised': 'section not recognised',
  'geometry-unread': 'body not measured',
  'zero-length': 'no length',
  'tension-field-not-counted': 'tension field not counted',
  'flexure-checked-separately': 'flexure checked separately',
  'shear-length-not-given': 'no shear length given',
  'whole-section-reduced-for-shear': 'whole section reduced for shear',
  'no-results': 'no results',
  'fabrication-overridden': 'fabrication set by run',
  'resistance-factor-overridden': 'factor overridden',
  'several-result-keys': 'several result keys',
  'moment-without-shear': 'moment without its shear',
  'moment-peak-elsewhere': 'largest moment elsewhere',
};

/** The label of a flag; a flag this client does not know yet is shown by its code. */
export function flagLabel(flag: string): string {
  return (FLAG_LABELS as Readonly<Record<string, string>>)[flag] ?? flag.replace(/-/g, ' ');
}
