import { changeText, fieldLabel } from './change-text';

describe('changeText', () => {
  it('writes each changed field with its unit', () => {
    expect(changeText({ field: 'section', from: 'IPE 300', to: 'IPE 270' })).toBe('IPE 300 → IPE 270');
    expect(changeText({ field: 'grade', from: 'S275', to: null })).toBe('S275 → none');
    expect(changeText({ field: 'length', from: 6000, to: 6250.5 })).toBe('6,000 mm → 6,250.5 mm');
    expect(
      changeText({ field: 'position', from: { start_mm: [0, 0, 4000], end_mm: [6000, 0, 4000] }, to: { start_mm: [0, 0, 4100], end_mm: [6000, 0, 4100] } }),
    ).toBe('from (0, 0, 4,000) → (6,000, 0, 4,000) mm to (0, 0, 4,100) → (6,000, 0, 4,100) mm');
    expect(fieldLabel('fabrication')).toBe('Fabrication');
  });
});
