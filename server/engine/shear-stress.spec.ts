import { findSection, toSectionInput } from '../catalogue/catalogue';
import { EngineInputError } from './input-error';
import { sectionProperties } from './section-properties';
import { shearStressAt_MPa, shearStressProfile } from './shear-stress';
import { expectClose } from './expect-close';
import { iSection } from './test-sections';

// Invented welded girder of three plates.
const plates = iSection(500, 9, [220, 16, 0]);

describe('shearStressProfile for an I-section of three rectangles', () => {
  const V = 300e3;
  const props = sectionProperties(plates);
  const profile = shearStressProfile(props, V);
  const d = 500;
  const hw = 468;
  const b = 220;
  const tw = 9;
  const I = (b * d ** 3 - (b - tw) * hw ** 3) / 12;

  it('matches the closed-form τmax and τmin of mechanics-of-materials texts', () => {
    // τmax = V/(8·I·tw)·[b·(d² − hw²) + tw·hw²] at the neutral axis; τmin = V·b/(8·I·tw)·(d² − hw²) in the web at
    // the junction (the standard results for a doubly symmetric I of three rectangles).
    expectClose(profile.tauMax_MPa, (V / (8 * I * tw)) * (b * (d * d - hw * hw) + tw * hw * hw), 1e-12, 'τmax');
    expectClose(profile.tauMaxAt_mm, 250, 1e-12, 'level of τmax');
    expectClose(profile.topJunction.webSide_MPa, ((V * b) / (8 * I * tw)) * (d * d - hw * hw), 1e-12, 'τmin');
    expectClose(profile.bottomJunction.webSide_MPa, profile.topJunction.webSide_MPa, 1e-12, 'symmetry');
  });

  it('jumps at the junction by the ratio of the widths (Q is continuous there)', () => {
    expectClose(profile.topJunction.flangeSide_MPa, (profile.topJunction.webSide_MPa * tw) / b, 1e-12, 'flange side');
    expect(profile.topJunction.webSideWidth_mm).toBe(tw);
    expect(profile.topJunction.flangeSideWidth_mm).toBe(b);
    const atJunction = profile.points.filter((p) => Math.abs(p.y_mm - 484) < 1e-9);
    expect(atJunction.map((p) => p.width_mm)).toEqual([tw, b]); // web value first, then flange: a vertical step
  });

  it('samples the whole depth, zero at the extreme fibres, in ascending order', () => {
    expect(profile.points[0].y_mm).toBe(0);
    expect(profile.points[profile.points.length - 1].y_mm).toBe(500);
    expect(profile.points[0].tau_MPa).toBe(0);
    expect(profile.points[profile.points.length - 1].tau_MPa).toBe(0);
    for (let i = 1; i < profile.points.length; i++) expect(profile.points[i].y_mm).toBeGreaterThanOrEqual(profile.points[i - 1].y_mm);
  });

  it('gives the web averages V/(hw·tw) and V/(d·tw) and their ratios to τmax', () => {
    expectClose(profile.webAverageClear_MPa, V / (hw * tw), 1e-14, 'V/(hw·tw)');
    expectClose(profile.webAverageFullDepth_MPa, V / (d * tw), 1e-14, 'V/(d·tw)');
    expectClose(profile.clearAverageToMax, profile.webAverageClear_MPa / profile.tauMax_MPa, 1e-14, 'ratio');
  });

  it('depends on the magnitude of the shear only', () => {
    expect(shearStressProfile(props, -V).tauMax_MPa).toBe(profile.tauMax_MPa);
    expect(shearStressAt_MPa(props, -V, 250)).toBe(profile.tauMax_MPa);
  });

  it('rejects a shear that is not a finite number, naming it', () => {
    expect(() => shearStressProfile(props, Number.NaN)).toThrow(EngineInputError);
    expect(() => shearStressProfile(props, Number.POSITIVE_INFINITY)).toThrow(/shear_N/);
  });
});

describe('web-average rule of thumb (common practice, no source)', () => {
  // "For typical wide-flange beams V/A_web over the clear web is within about 10 % of VQ/It at the neutral axis."
  it.each([
    'IPE 200',
    'IPE 300',
    'IPE 400',
    'IPE 600',
    'HEA 300',
    'HEB 500',
    'W14X22',
    'W16X26',
    'W18X35',
    'W18X50',
    'W27X84',
    'W30X90',
    'W33X118',
    'W36X135',
    'W36X150',
    'W44X230',
  ])('holds within 10 % for %s', (name) => {
    const profile = shearStressProfile(sectionProperties(toSectionInput(findSection(name)!)), 100e3);
    expect(Math.abs(profile.clearAverageToMax - 1)).toBeLessThanOrEqual(0.1);
  });

  it.each(['W12X14', 'W21X44', 'W24X55', 'W24X62', 'W40X149'])('is only "about" right for the thin-flanged %s (10–12 % low)', (name) => {
    // Where the flanges are thin the web carries more of the shear and the average falls just past 10 % below the
    // peak: the reason the rule is shown beside the code check and never used as one.
    const ratio = shearStressProfile(sectionProperties(toSectionInput(findSection(name)!)), 100e3).clearAverageToMax;
    expect(ratio).toBeLessThan(0.9);
    expect(ratio).toBeGreaterThan(0.88);
  });

  it('fails for a narrow-flange girder, where the web carries the shear like a rectangle', () => {
    // Invented counter-case: 80 mm flanges on a 600 mm web; a rectangle alone would give 1/1.5 = 0.67.
    const narrow = iSection(600, 10, [80, 10, 0]);
    const profile = shearStressProfile(sectionProperties(narrow), 100e3);
    expect(profile.clearAverageToMax).toBeLessThan(0.85);
    expect(profile.clearAverageToMax).toBeGreaterThan(2 / 3);
  });
});

describe('shearStressProfile for a rolled section', () => {
  it('follows the fillet: the stress eases from the web value to the flange value', () => {
    const props = sectionProperties(toSectionInput(findSection('HEB 300')!));
    const profile = shearStressProfile(props, 500e3);
    const junction = profile.topJunction;
    expect(junction.webSideWidth_mm).toBeCloseTo(11 + 2 * 27, 10); // tw + 2r just under the flange
    expect(junction.flangeSideWidth_mm).toBe(300);
    // In the plain web just below the fillet the width is tw again and the stress higher.
    const belowFillet = shearStressAt_MPa(props, 500e3, 300 - 19 - 27 - 1);
    expect(belowFillet).toBeGreaterThan(junction.webSide_MPa);
  });
});
