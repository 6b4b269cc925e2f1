import { defaultSettingsFor } from '../projects/project-settings';
import { runParameters } from './run-parameters';

describe('runParameters', () => {
  it('starts from the project settings, then takes what the engineer gave', () => {
    const settings = { ...defaultSettingsFor('en1993-1-1'), gammaM0: 1.05, warningBand: 0.85, defaultGrade: 'S275' };
    expect(runParameters(settings, 'en1993-1-1', { gammaM1: 1.1 })).toMatchObject({ standard: 'en1993-1-1', gammaM0: 1.05, gammaM1: 1.1, warningRatio: 0.85, defaultGrade: 'S275', eta: null });
    expect(runParameters(settings, 'en1993-1-1', { gammaM0: 1.0, warningRatio: 0.95 })).toMatchObject({ gammaM0: 1.0, warningRatio: 0.95 });
  });

  it('carries η only when the project chose its own, so the recommended 1.00 above S460 still applies', () => {
    expect(runParameters(defaultSettingsFor('en1993-1-1'), 'en1993-1-1', {})).toMatchObject({ eta: null });
    expect(runParameters({ ...defaultSettingsFor('en1993-1-1'), eta: 1.0 }, 'en1993-1-1', {})).toMatchObject({ eta: 1.0 });
  });

  it('reads a grade written as a material name, and leaves EN factors out of AISC runs', () => {
    const settings = { ...defaultSettingsFor('aisc360-22-lrfd'), defaultGrade: 'ASTM A572 Grade 50' };
    const parameters = runParameters(settings, 'aisc360-22-lrfd', {});
    expect(parameters).toMatchObject({ standard: 'aisc360-22-lrfd', defaultGrade: 'A572-50', phiV: null });
    expect(parameters).not.toHaveProperty('gammaM0');
  });

  it('refuses values no code would accept, naming each field under parameters', () => {
    expect(() => runParameters(defaultSettingsFor('aisc360-22-asd'), 'aisc360-22-asd', { omegaV: 0.5, phiV: 0.9 })).toThrow(
      expect.objectContaining({
        code: 'invalid_parameters',
        details: [expect.objectContaining({ location: 'body', field: 'parameters.omegaV' }), expect.objectContaining({ field: 'parameters' })],
      }),
    );
  });
});
