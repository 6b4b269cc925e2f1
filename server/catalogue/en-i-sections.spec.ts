import { expectClose } from '../engine/expect-close';
import { entryOfSection, findSection } from './catalogue';
import { EN_I_SECTIONS, HD_ROWS, IPN_ROWS } from './en-i-sections';
import { outlineArea_mm2 } from './entry-area';

describe('EN IPN and HD sections', () => {
  it('spot-checks IPN 200 against published values', () => {
    // h 200, b 90, tw 7.5, tf 11.3 mm, A 33.4 cm² (open table named in EN_IPN_SOURCE); r1 7.5, r2 4.5 mm
    // (MagmaWorks.Taxonomy.Profiles IPN200); slope 14 % (DIN 1025-1, from memory).
    const ipn = findSection('IPN 200')!;
    expect(ipn).toMatchObject({ depth_mm: 200, width_mm: 90, webThickness_mm: 7.5, rootRadius_mm: 7.5 });
    // tf is tabulated at b/4 from the edge; half-way along the outstand is tw/4 nearer the tip: 11.3 − 0.14 × 7.5/4.
    expect(ipn.flangeThickness_mm).toBeCloseTo(11.0375, 10);
    expect(ipn.edgeRadius_mm).toBeCloseTo(4.5, 10);
    expect(Math.tan(ipn.flangeSlope_rad!)).toBeCloseTo(0.14, 12);
  });

  it('spot-checks HD 320x300 against the published table', () => {
    // Maker's table (transcription named in EN_HD_SOURCE): h 375, b 313, tw 27, tf 48, r 27 mm, A 382 cm², 300 kg/m.
    expect(findSection('HD 320x300')).toMatchObject({ depth_mm: 375, width_mm: 313, webThickness_mm: 27, flangeThickness_mm: 48, rootRadius_mm: 27 });
  });

  it('rebuilds the tabulated area of every IPN and HD within 1 % from the outline the engine draws', () => {
    const area = new Map<string, number>([...IPN_ROWS.map((r) => [`IPN ${r[0]}`, r[5]] as const), ...HD_ROWS.map((r) => [`HD ${r[0]}`, r[6]] as const)]);
    for (const section of EN_I_SECTIONS) expectClose(outlineArea_mm2(entryOfSection(section).dimensions) / 100, area.get(section.name)!, 0.01, `${section.name} A`);
  });
});
