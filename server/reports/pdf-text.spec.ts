import { textRuns } from './pdf-text';

describe('textRuns', () => {
  it('switches to the Greek face only for Greek letters', () => {
    expect(textRuns('τmax at γM0 = 1.0')).toEqual([
      { text: 'τ', greek: true },
      { text: 'max at ', greek: false },
      { text: 'γ', greek: true },
      { text: 'M0 = 1.0', greek: false },
    ]);
  });

  it('spells out signs no embedded font carries', () => {
    expect(textRuns('h/tw ≤ 2.24·√(E/Fy)').map((run) => run.text).join('')).toBe('h/tw <= 2.24·sqrt(E/Fy)');
    expect(textRuns('fy/(√3·γM0)').map((run) => run.text).join('')).toBe('fy/(sqrt(3)·γM0)');
    expect(textRuns('31·ε·√kτ/η').map((run) => run.text).join('')).toBe('31·ε·sqrt(kτ)/η');
    expect(textRuns('mm⁴').map((run) => run.text).join('')).toBe('mm^4');
  });

  it('keeps latin punctuation and units, and marks anything else with a question mark', () => {
    expect(textRuns('5 × 10² mm² — ok · §6.2.6 − 1')).toEqual([{ text: '5 × 10² mm² — ok · §6.2.6 − 1', greek: false }]);
    expect(textRuns('漢')).toEqual([{ text: '?', greek: false }]);
  });
});
