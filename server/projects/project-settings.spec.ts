import { defaultSettingsFor, projectSettingsSchema, settingsForStandardChange } from './project-settings';

describe('project settings', () => {
  it('defaults to the recommended EN partial factors and η', () => {
    // γM0 = γM1 = 1.00: EN 1993-1-1 §6.1(1) Note 2B recommended values.
    // η = 1.20: EN 1993-1-5 §5.1(2) Note 2 recommended value up to S460 (from memory).
    expect(defaultSettingsFor('en1993-1-1')).toEqual({ defaultGrade: 'S355', gammaM0: 1.0, gammaM1: 1.0, eta: 1.2, warningBand: 0.9 });
    expect(defaultSettingsFor('aisc360-22-asd').defaultGrade).toBe('A992');
  });

  it('follows the new family\u2019s default grade when the standard family changes', () => {
    const en = defaultSettingsFor('en1993-1-1');
    expect(settingsForStandardChange(en, 'en1993-1-1', 'aisc360-22-lrfd', {}).defaultGrade).toBe('A992');
    expect(settingsForStandardChange(en, 'en1993-1-1', 'aisc360-22-lrfd', { defaultGrade: 'A572 Gr 50' }).defaultGrade).toBe(
      'A572 Gr 50',
    );
    const aisc = { ...defaultSettingsFor('aisc360-22-lrfd'), defaultGrade: 'A36' };
    expect(settingsForStandardChange(aisc, 'aisc360-22-lrfd', 'aisc360-22-asd', { eta: 1.0 })).toEqual({ ...aisc, eta: 1.0 });
  });

  it('rejects factors outside their plausible range', () => {
    const base = defaultSettingsFor('en1993-1-1');
    expect(projectSettingsSchema.safeParse({ ...base, gammaM0: 0.9 }).success).toBe(false);
    expect(projectSettingsSchema.safeParse({ ...base, eta: 1.3 }).success).toBe(false);
    expect(projectSettingsSchema.safeParse({ ...base, warningBand: 1.1 }).success).toBe(false);
  });
});
