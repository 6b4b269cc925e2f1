import { governingCheckText } from './governing-check-text';

describe('governingCheckText', () => {
  it('names the axis only where the check does not', () => {
    expect(governingCheckText('minor', 'minor-axis shear')).toBe('minor-axis shear');
    expect(governingCheckText('major', 'shear with bending')).toBe('shear with bending, major axis');
    expect(governingCheckText(null, null)).toBeNull();
  });
});
