import { OVER_CAPACITY_COLOUR, rgbHexToCss, utilisationColour } from '../../viewer/utilisation-colours';
import { utilisationBarLook } from './utilisation-bar';

describe('utilisationBarLook', () => {
  it('uses the 3D view’s colour for the same ratio, so table and model agree', () => {
    expect(utilisationBarLook(0.45).colour).toBe(rgbHexToCss(utilisationColour(0.45)));
    expect(utilisationBarLook(1.02).colour).toBe(rgbHexToCss(OVER_CAPACITY_COLOUR));
  });

  it('rounds the percentage up and fills the track from 100 %', () => {
    // 1.0004 must not read as a pass-looking 100.0 % (server/reports/report-format.ts).
    expect(utilisationBarLook(1.0004)).toMatchObject({ text: '100.1 %', widthPercent: 100, over: true });
    expect(utilisationBarLook(0.5)).toMatchObject({ text: '50.0 %', widthPercent: 50, over: false });
  });

  it('draws nothing for a member that was not checked', () => {
    expect(utilisationBarLook(null)).toMatchObject({ text: '—', widthPercent: 0, over: false });
  });
});
