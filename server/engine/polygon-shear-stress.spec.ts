import { findSection, toSectionInput } from '../catalogue/catalogue';
import { expectClose } from './expect-close';
import { EngineInputError } from './input-error';
import { polygonAxisSection } from './polygon-axis-section';
import { polygonShearStressAt_MPa, polygonShearStressProfile } from './polygon-shear-stress';
import { SectionInputError } from './section';
import type { IDimensions, SectionDimensions } from './section-family';
import { sectionOutline } from './section-outline';
import { sectionProperties } from './section-properties';
import { shearStressAt_MPa, shearStressProfile } from './shear-stress';
import { iSection } from './test-sections';

const V = 250e3;
const section = (d: SectionDimensions, axis: 'major' | 'minor' = 'major', tol = 0.01) => polygonAxisSection(sectionOutline(d, tol), axis);

describe('solid rectangle (closed forms of mechanics-of-materials texts)', () => {
  // Invented flat bar 300 × 20 mm.
  const plate: SectionDimensions = { family: 'plate', depth_mm: 300, width_mm: 20 };
  it.each(['major', 'minor'] as const)('gives τmax = 1.5·V/A at the neutral axis, load %s', (axis) => {
    const s = section(plate, axis);
    const profile = polygonShearStressProfile(s, V);
    expectClose(profile.tauMax_MPa, (1.5 * V) / 6000, 1e-12, 'τmax');
    expectClose(profile.tauMaxAt_mm, 0, 1e-12, 'at the centroid');
    expect(profile.points[0].tau_MPa).toBe(0);
    expect(profile.points[profile.points.length - 1].tau_MPa).toBe(0);
  });

  it('gives I, Wel = b·h²/6 and Wpl = b·h²/4 about either axis', () => {
    const major = section(plate, 'major');
    expectClose(major.i_mm4, (20 * 300 ** 3) / 12, 1e-12, 'I major');
    expectClose(major.elasticModulus_mm3, (20 * 300 ** 2) / 6, 1e-12, 'Wel major');
    expectClose(major.plasticModulus_mm3, (20 * 300 ** 2) / 4, 1e-9, 'Wpl major');
    const minor = section(plate, 'minor');
    expectClose(minor.i_mm4, (300 * 20 ** 3) / 12, 1e-12, 'I minor');
    expectClose(minor.plasticModulus_mm3, (300 * 20 ** 2) / 4, 1e-9, 'Wpl minor');
  });

  it('follows the parabola τ(s) = 1.5·V/A·(1 − (2s/h)²)', () => {
    const s = section(plate);
    expectClose(polygonShearStressAt_MPa(s, V, 75), 1.5 * (V / 6000) * (1 - 0.25), 1e-12, 'τ at h/4');
  });
});

describe('welded box: two webs share the shear', () => {
  // Invented box 600 × 400, webs 15, flanges 25, square corners: Q and I by hand from the plates.
  const box: SectionDimensions = { family: 'box', depth_mm: 600, width_mm: 400, webThickness_mm: 15, flangeThickness_mm: 25 };
  const [h, b, tw, tf] = [600, 400, 15, 25];
  const I = (b * h ** 3 - (b - 2 * tw) * (h - 2 * tf) ** 3) / 12;
  const qNa = b * tf * (h / 2 - tf / 2) + 2 * tw * ((h / 2 - tf) ** 2) / 2;
  const s = section(box);

  it('gives τ at the neutral axis = V·Q/(I·2t) (common practice, no source)', () => {
    expectClose(s.i_mm4, I, 1e-12, 'I');
    expectClose(s.firstMoment_mm3(0), qNa, 1e-12, 'Q at the axis');
    expectClose(polygonShearStressProfile(s, V).tauMax_MPa, (V * qNa) / (I * 2 * tw), 1e-12, 'τmax');
  });

  it('jumps at the inside face of the flange by the ratio of the cut widths b / 2tw', () => {
    const level = h / 2 - tf;
    expect(s.widthAt_mm(level, 'below')).toBeCloseTo(2 * tw, 12);
    expect(s.widthAt_mm(level, 'above')).toBeCloseTo(b, 12);
    const inWebs = polygonShearStressAt_MPa(s, V, level, 'below');
    const inFlange = polygonShearStressAt_MPa(s, V, level, 'above');
    expectClose(inWebs / inFlange, b / (2 * tw), 1e-12, 'jump');
    const profile = polygonShearStressProfile(s, V);
    const atJunction = profile.points.filter((p) => Math.abs(p.s_mm - level) < 1e-9);
    expect(atJunction.map((p) => p.width_mm)).toEqual([2 * tw, b].map((w) => expect.closeTo(w, 9)));
  });

  it('gives the plastic modulus of the plates about the middle (common practice, no source)', () => {
    expectClose(s.plasticModulus_mm3, b * tf * (h - tf) + 2 * tw * ((h - 2 * tf) ** 2) / 4, 1e-9, 'Wpl');
    expectClose(s.plasticNeutralAxis_mm, 0, 1e-9, 'PNA at the middle');
  });
});

describe('circular hollow section', () => {
  // Invented Ø 168.3 × 6.3 tube. Thick-walled closed forms: I = π(R⁴ − r⁴)/4, Q(0) = 2(R³ − r³)/3, Wpl = (D³ − d³)/6.
  const [D, t] = [168.3, 6.3];
  const R = D / 2;
  const r = R - t;
  const s = section({ family: 'tube', diameter_mm: D, wallThickness_mm: t }, 'major', 1e-4);

  it('gives τmax = V·Q/(I·2t) at the neutral axis, within the chord error', () => {
    const I = (Math.PI * (R ** 4 - r ** 4)) / 4;
    const Q = (2 * (R ** 3 - r ** 3)) / 3;
    expectClose(s.i_mm4, I, 1e-5, 'I');
    const profile = polygonShearStressProfile(s, V);
    expectClose(profile.tauMax_MPa, (V * Q) / (I * 2 * t), 1e-4, 'τmax');
    expect(Math.abs(profile.tauMaxAt_mm)).toBeLessThan(0.5); // the chords put the sampled peak a hair off the axis
  });

  it('gives the same on the minor axis and Wpl = (D³ − d³)/6', () => {
    const minor = section({ family: 'tube', diameter_mm: D, wallThickness_mm: t }, 'minor', 1e-4);
    expectClose(minor.i_mm4, s.i_mm4, 1e-6, 'I minor');
    expectClose(s.plasticModulus_mm3, (D ** 3 - (D - 2 * t) ** 3) / 6, 1e-5, 'Wpl');
  });
});

describe('the I-section path agrees with shear-stress.ts', () => {
  it('matches a welded girder of three plates exactly, level by level and at both sides of the junctions', () => {
    // Invented mono-symmetric girder: the polygon of three plates is exact.
    const input = iSection(900, 12, [300, 20, 0], [400, 25, 0]);
    const dims: IDimensions = { family: 'I', depth_mm: 900, webThickness_mm: 12, topFlange: input.topFlange, bottomFlange: input.bottomFlange };
    const props = sectionProperties(input);
    const s = section(dims);
    const offset = -450; // the outline is centred on its depth, the band integration measures from the underside
    expectClose(s.neutralAxis_mm - offset, props.neutralAxisFromBottom_mm, 1e-12, 'neutral axis');
    expectClose(s.i_mm4, props.iMajor_mm4, 1e-12, 'I');
    expectClose(s.plasticModulus_mm3, props.plasticModulusMajor_mm3, 1e-9, 'Wpl');
    expectClose(s.plasticNeutralAxis_mm - offset, props.plasticNeutralAxisFromBottom_mm, 1e-9, 'PNA');
    for (const y of [10, 25, 100, 300, props.neutralAxisFromBottom_mm, 600, 879, 880, 890]) {
      for (const side of ['below', 'above'] as const) {
        expectClose(polygonShearStressAt_MPa(s, V, y + offset, side), shearStressAt_MPa(props, V, y, side), 1e-9, `τ at ${y} ${side}`);
      }
    }
    expectClose(polygonShearStressProfile(s, V).tauMax_MPa, shearStressProfile(props, V).tauMax_MPa, 1e-12, 'τmax');
  });

  it.each(['HEB 300', 'IPE 400', 'IPN 300'])('matches the rolled %s within the chord error of its fillets', (name) => {
    const input = toSectionInput(findSection(name)!);
    const props = sectionProperties(input);
    const s = section({ family: 'I', ...input }, 'major', 1e-3);
    expectClose(polygonShearStressProfile(s, V).tauMax_MPa, shearStressProfile(props, V).tauMax_MPa, 1e-4, 'τmax');
    expectClose(s.plasticModulus_mm3, props.plasticModulusMajor_mm3, 1e-4, 'Wpl');
  });

  it('gives the minor-axis I and Wpl of the plates: 2·tf·b³/12 + hw·tw³/12, 2·tf·b²/4 + hw·tw²/4', () => {
    const dims: IDimensions = { family: 'I', depth_mm: 500, webThickness_mm: 9, topFlange: { width_mm: 220, thickness_mm: 16, filletRadius_mm: 0 }, bottomFlange: { width_mm: 220, thickness_mm: 16, filletRadius_mm: 0 } };
    const s = section(dims, 'minor');
    expectClose(s.i_mm4, (2 * 16 * 220 ** 3) / 12 + (468 * 9 ** 3) / 12, 1e-12, 'Iz');
    expectClose(s.plasticModulus_mm3, (2 * 16 * 220 ** 2) / 4 + (468 * 9 ** 2) / 4, 1e-9, 'Wpl,z');
    // Load parallel to the flanges: at the web the cut crosses both flanges and the web.
    expect(s.widthAt_mm(0)).toBeCloseTo(2 * 16 + 468, 9);
  });
});

describe('limits of the formula and bad input', () => {
  it('says when the bending axis is not principal (an angle), where V·Q/(I·b) is only an estimate', () => {
    const angle: SectionDimensions = { family: 'angle', depth_mm: 120, width_mm: 80, thickness_mm: 10, rootRadius_mm: 11 };
    expect(section(angle).principal).toBe(false);
    expect(section({ family: 'tee', depth_mm: 150, width_mm: 200, webThickness_mm: 9, flangeThickness_mm: 15, rootRadius_mm: 18 }).principal).toBe(true);
  });

  it('refuses an outline that crosses itself with its reason, and a shear that is not a number', () => {
    const bow = { outer: [[0, 0], [10, 10], [10, 0], [0, 10]] as [number, number][], voids: [] };
    expect(() => polygonAxisSection(bow, 'major')).toThrow(SectionInputError);
    expect(() => polygonAxisSection(bow, 'major')).toThrow(/not a simple closed shape/);
    const s = section({ family: 'plate', depth_mm: 100, width_mm: 10 });
    expect(() => polygonShearStressProfile(s, Number.NaN)).toThrow(EngineInputError);
  });
});
