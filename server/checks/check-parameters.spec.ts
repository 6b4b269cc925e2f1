import { checkParametersSchema, recommendedParameters } from './check-parameters';

describe('check parameters', () => {
  it('recommends EN 1993-1-1 §6.1 NOTE 2B partial factors (γM0 = γM1 = 1.00) and the η of EN 1993-1-5 §5.1 NOTE 2', () => {
    expect(recommendedParameters('en1993-1-1')).toEqual({
      standard: 'en1993-1-1',
      warningRatio: 0.9,
      stiffenerSpacing_mm: null,
      fabricationOverrides: {},
      defaultGrade: 'S355',
      gammaM0: 1,
      gammaM1: 1,
      eta: null,
      yieldRule: 'en10025-2',
      endPost: 'non-rigid',
    });
  });

  it('leaves φv and Ωv to AISC 360-22 unless the project sets them', () => {
    expect(recommendedParameters('aisc360-22-lrfd')).toMatchObject({ standard: 'aisc360-22-lrfd', phiV: null, defaultGrade: 'A992' });
    expect(recommendedParameters('aisc360-22-asd')).toMatchObject({ standard: 'aisc360-22-asd', omegaV: null, defaultGrade: 'A992' });
  });

  it('accepts national-annex values within range', () => {
    const parsed = checkParametersSchema.parse({ standard: 'en1993-1-1', gammaM0: 1.05, gammaM1: 1.1, eta: 1.0, yieldRule: 'en1993-1-1-table-3.1' });
    expect(parsed).toMatchObject({ gammaM0: 1.05, gammaM1: 1.1, eta: 1.0 });
  });

  it.each([
    [{ standard: 'en1993-1-1', gammaM0: 0.9 }, 'gammaM0'],
    [{ standard: 'en1993-1-1', eta: 1.3 }, 'eta'],
    [{ standard: 'aisc360-22-lrfd', phiV: 1.1 }, 'phiV'],
    [{ standard: 'aisc360-22-asd', omegaV: 0.5 }, 'omegaV'],
    [{ standard: 'aisc360-22-lrfd', warningRatio: 1.5 }, 'warningRatio'],
    [{ standard: 'aisc360-22-lrfd', defaultGrade: 'S999' }, 'defaultGrade'],
    [{ standard: 'aisc360-22-lrfd', fabricationOverrides: { W24X62: 'riveted' } }, 'fabricationOverrides'],
    [{ standard: 'aisc360-22-lrfd', gammaM0: 1 }, 'gammaM0'],
    [{ standard: 'bs5950' }, 'standard'],
  ])('refuses %j', (input, field) => {
    const result = checkParametersSchema.safeParse(input);
    expect(result.success).toBe(false);
    const paths = result.error!.issues.map((issue) => issue.path[0] ?? (issue as { keys?: string[] }).keys?.[0]);
    expect(paths).toContain(field);
  });
});
