import { prepareCapacity, utilisationOf } from '../engine/check';
import { EngineInputError } from '../engine/input-error';
import { sectionsInSeries, toSectionInput } from './catalogue';
import { lightestPassingSection } from './section-selection';

describe('lightestPassingSection', () => {
  it('returns the first section of the series, lightest first, that passes', () => {
    const shear_N = 700e3;
    const pick = lightestPassingSection({ series: 'IPE', shear_N, material: { grade: 'S355' }, standard: 'en1993-1-1' })!;
    expect(pick.utilisation).toBeLessThanOrEqual(1);
    const series = sectionsInSeries('IPE');
    const index = series.indexOf(pick.section);
    const lighter = series[index - 1];
    expect(utilisationOf(prepareCapacity(toSectionInput(lighter), { grade: 'S355' }, 'en1993-1-1'), shear_N)).toBeGreaterThan(1);
  });

  it('works for a W group under AISC and honours a target utilisation', () => {
    const relaxed = lightestPassingSection({ series: 'W18', shear_N: 800e3, material: { grade: 'A992' }, standard: 'aisc360-22-lrfd' })!;
    const strict = lightestPassingSection({ series: 'W18', shear_N: 800e3, material: { grade: 'A992' }, standard: 'aisc360-22-lrfd', targetUtilisation: 0.7 })!;
    expect(strict.utilisation).toBeLessThanOrEqual(0.7);
    expect(sectionsInSeries('W18').indexOf(strict.section)).toBeGreaterThanOrEqual(sectionsInSeries('W18').indexOf(relaxed.section));
  });

  it('returns null when even the heaviest section fails', () => {
    expect(lightestPassingSection({ series: 'IPE', shear_N: 1e8, material: { grade: 'S235' }, standard: 'en1993-1-1' })).toBeNull();
  });

  it('skips sections whose plates are beyond the grade table instead of failing', () => {
    // W14X873 flanges are 140 mm thick: EN 1993-1-1 Table 3.1 stops at 80 mm.
    const pick = lightestPassingSection({ series: 'W14', shear_N: 5e6, material: { grade: 'S355' }, standard: 'en1993-1-1', params: { yieldRule: 'en1993-1-1-table-3.1' } });
    expect(pick === null || pick.section.flangeThickness_mm <= 80).toBe(true);
  });

  it('rejects an unknown series or a bad demand, naming the field', () => {
    expect(() => lightestPassingSection({ series: 'UB', shear_N: 1, material: { grade: 'S355' }, standard: 'en1993-1-1' })).toThrow(EngineInputError);
    expect(() => lightestPassingSection({ series: 'IPE', shear_N: Number.NaN, material: { grade: 'S355' }, standard: 'en1993-1-1' })).toThrow(/shear_N/);
    expect(() => lightestPassingSection({ series: 'IPE', shear_N: 1, material: { grade: 'S355' }, standard: 'en1993-1-1', targetUtilisation: 0 })).toThrow(/targetUtilisation/);
  });
});
