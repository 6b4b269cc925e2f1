import { checkParametersOf, defaultGradeFor, gradesFor, recommendedFields } from './check-parameter-fields';

describe('check parameter fields', () => {
  it('offers the grades of the standard family', () => {
    expect(gradesFor('en1993-1-1')).toEqual(['S235', 'S275', 'S355', 'S420', 'S460']);
    expect(gradesFor('aisc360-22-asd')).toEqual(['A992', 'A36', 'A572-50']);
  });

  it("reads the project's grade as written in its settings, or falls back to the family's usual grade", () => {
    expect(defaultGradeFor('aisc360-22-lrfd', 'A572 Gr 50')).toBe('A572-50');
    expect(defaultGradeFor('en1993-1-1', 'S275')).toBe('S275');
    // S355 and A992, the usual rolled-section grades (common practice, no source).
    expect(defaultGradeFor('en1993-1-1', 'A992')).toBe('S355');
    expect(defaultGradeFor('aisc360-22-lrfd', undefined)).toBe('A992');
  });

  it('starts from the recommended values: γM0 = γM1 = 1.00 (EN 1993-1-1 §6.1 NOTE 2B), η by grade, 90 % warning', () => {
    expect(recommendedFields('en1993-1-1', undefined)).toMatchObject({ gammaM0: 1, gammaM1: 1, eta: null, warningPercent: 90, phiV: null, omegaV: null });
  });

  it("takes the project's national-annex factors; η = 1.20 is the recommended value and stays by grade", () => {
    const settings = { defaultGrade: 'S460', gammaM0: 1.05, gammaM1: 1.1, eta: 1.2, warningBand: 0.85 };
    expect(recommendedFields('en1993-1-1', settings)).toMatchObject({ defaultGrade: 'S460', gammaM0: 1.05, gammaM1: 1.1, eta: null, warningPercent: 85 });
    expect(recommendedFields('en1993-1-1', { ...settings, eta: 1.0 }).eta).toBe(1);
  });

  it('sends each standard only its own parameters (server/checks/check-parameters.ts)', () => {
    const fields = {
      ...recommendedFields('en1993-1-1', undefined),
      phiV: 0.95,
      omegaV: 1.6,
      warningPercent: 95,
      fabricationOverrides: [
        { profile: ' WPG 900 ', fabrication: 'welded' as const },
        { profile: '', fabrication: 'rolled' as const },
      ],
    };
    expect(checkParametersOf('en1993-1-1', fields)).toEqual({
      standard: 'en1993-1-1',
      defaultGrade: 'S355',
      warningRatio: 0.95,
      stiffenerSpacing_mm: null,
      fabricationOverrides: { 'WPG 900': 'welded' },
      gammaM0: 1,
      gammaM1: 1,
      eta: null,
      yieldRule: 'en10025-2',
      endPost: 'non-rigid',
    });
    expect(checkParametersOf('aisc360-22-lrfd', { ...fields, defaultGrade: 'A992' })).toEqual({
      standard: 'aisc360-22-lrfd',
      defaultGrade: 'A992',
      warningRatio: 0.95,
      stiffenerSpacing_mm: null,
      fabricationOverrides: { 'WPG 900': 'welded' },
      phiV: 0.95,
    });
    expect(checkParametersOf('aisc360-22-asd', fields)).toMatchObject({ standard: 'aisc360-22-asd', omegaV: 1.6 });
  });
});
