import { checkParametersSchema, recommendedParameters } from '../checks/check-parameters';
import { dateTimeText, parameterRows, percentText } from './report-format';

function rowsAsObject(rows: { label: string; value: string }[]): Record<string, string> {
  return Object.fromEntries(rows.map((row) => [row.label, row.value]));
}

describe('parameterRows', () => {
  it('lists the EN partial factors, η and the yield rule', () => {
    const rows = rowsAsObject(parameterRows(recommendedParameters('en1993-1-1'), 'UK national annex'));
    expect(rows).toMatchObject({
      Standard: 'EN 1993-1-1 §6.2.6 with EN 1993-1-5 §5',
      'Basis of the factors': 'UK national annex',
      γM0: '1',
      'η (EN 1993-1-5 §5.1)': '1.20 up to fy = 460 MPa, 1.00 above (recommended)',
      'Yield strength by thickness': 'EN 10025-2',
      'Grade where the model names none': 'S355',
    });
  });

  it('says when AISC resistance factors come from the code or from the project', () => {
    expect(rowsAsObject(parameterRows(recommendedParameters('aisc360-22-lrfd'))).φv).toBe('by §G1/§G2.1 (1.00 or 0.90)');
    const asd = checkParametersSchema.parse({ standard: 'aisc360-22-asd', omegaV: 1.67, fabricationOverrides: { 'W24X55': 'welded' } });
    const rows = rowsAsObject(parameterRows(asd));
    expect(rows.Ωv).toBe('1.67 (project value)');
    expect(rows['Fabrication set by the run']).toBe('W24X55: welded');
    expect(rows['Basis of the factors']).toBeUndefined();
  });
});

describe('number and date text', () => {
  it('rounds up to one decimal so a result just over 100 % never reads as 100.0 %', () => {
    expect(percentText(1.0004)).toBe('100.1 %');
    expect(percentText(1)).toBe('100.0 %');
    expect(percentText(0.935)).toBe('93.5 %');
    expect(percentText(0.93471)).toBe('93.5 %');
    expect(percentText(Number.NaN)).toBe('—');
  });

  it('writes date-times in UTC', () => {
    expect(dateTimeText('2026-02-05T10:00:00+01:00')).toBe('2026-02-05 09:00 UTC');
    expect(dateTimeText(undefined)).toBe('—');
  });
});
