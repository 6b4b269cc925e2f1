import { findCatalogueEntry } from '../catalogue/catalogue-lookup';
import { findSection, toSectionInput } from '../catalogue/catalogue';
import { type AiscFamilyParams, type AiscFamilyShear, aiscFamilyShearCapacity, webShearCoefficientCv2 } from './aisc-360-22-families';
import { aiscShearCapacity } from './aisc-360-22';
import { expectClose } from './expect-close';
import { SectionInputError, type Fabrication } from './section';
import type { SectionDimensions } from './section-family';
import { polygonProperties } from './section-polygon';
import { sectionOutline } from './section-outline';
import { sectionProperties } from './section-properties';
import type { ShearAxis } from './shear-axis';
import { fromNewtons, MPA_PER_KSI, toMPa } from './units';

const E = 29000 * MPA_PER_KSI;
const unstiffened: AiscFamilyParams = { e_MPa: E, stiffenerSpacing_mm: null, shearLength_mm: null };
const areaOf = (d: SectionDimensions): number => polygonProperties(sectionOutline(d, 0.01)).area_mm2;

function capacity(d: SectionDimensions, axis: ShearAxis, fy_MPa: number, fabrication: Fabrication = 'rolled', params = unstiffened, method: 'lrfd' | 'asd' = 'lrfd'): AiscFamilyShear {
  const rule = aiscFamilyShearCapacity(d, axis, areaOf(d), fabrication, fy_MPa, method, params);
  if (!rule.applicable) throw new Error(rule.reason);
  return rule.capacity;
}

describe('AISC 360-22 §G2.2 Cv2 (Eq. G2-9 to G2-11 of the specification)', () => {
  // kv = 5, E = 200 000 MPa, Fy = 345 MPa: √(kv·E/Fy) = 53.84.
  const root = Math.sqrt((5 * 200000) / 345);
  it('is 1.0, then 1.10·√(kv·E/Fy)/(h/tw), then 1.51·kv·E/((h/tw)²·Fy)', () => {
    expect(webShearCoefficientCv2(50, 5, 200000, 345)).toBe(1);
    expectClose(webShearCoefficientCv2(65, 5, 200000, 345), (1.1 * root) / 65, 1e-14, 'inelastic');
    expectClose(webShearCoefficientCv2(80, 5, 200000, 345), (1.51 * 5 * 200000) / (80 * 80 * 345), 1e-14, 'elastic');
  });
});

describe('AISC 360-22 Chapter G by family, hand calculations from the clauses with tabulated dimensions', () => {
  it('G2.1 channel C12X20.7 in A36: φvVn = 0.90 × 0.6 × 36 × 12.0 × 0.282 = 65.8 kips (Cv1 = 1)', () => {
    const c = capacity(findCatalogueEntry('C12X20.7')!.entry.dimensions, 'major', toMPa(36, 'ksi'));
    expectClose(fromNewtons(c.available_N, 'kip'), 0.9 * 0.6 * 36 * 12.0 * 0.282, 1e-9, 'φvVn');
    expect(c.section).toBe('G2.1(b)');
    const asd = capacity(findCatalogueEntry('C12X20.7')!.entry.dimensions, 'major', toMPa(36, 'ksi'), 'rolled', unstiffened, 'asd');
    expectClose(fromNewtons(asd.available_N, 'kip'), (0.6 * 36 * 12.0 * 0.282) / 1.67, 1e-9, 'Vn/Ωv');
  });

  it('G4 rectangular HSS6X4X3/8 (t_des = 0.349 in, inside radius t): h = 6 − 2t − 2t, Aw = 2ht, Fy = 50 ksi', () => {
    const c = capacity(findCatalogueEntry('HSS6X4X3/8')!.entry.dimensions, 'major', toMPa(50, 'ksi'));
    const h = 6 - 4 * 0.349;
    expectClose(fromNewtons(c.available_N, 'kip'), 0.9 * 0.6 * 50 * 2 * h * 0.349, 1e-9, 'φvVn major');
    const minor = capacity(findCatalogueEntry('HSS6X4X3/8')!.entry.dimensions, 'minor', toMPa(50, 'ksi'));
    expectClose(fromNewtons(minor.available_N, 'kip'), 0.9 * 0.6 * 50 * 2 * (4 - 4 * 0.349) * 0.349, 1e-9, 'φvVn minor');
  });

  it('G4 takes h = D − 3t when the corner radius is not known, and the clear distance for a welded box', () => {
    const rolled: SectionDimensions = { family: 'box', depth_mm: 300, width_mm: 200, webThickness_mm: 10, flangeThickness_mm: 10 };
    expectClose(capacity(rolled, 'major', 345).vn_N, 0.6 * 345 * 2 * 270 * 10, 1e-12, 'D − 3t');
    expectClose(capacity(rolled, 'major', 345, 'welded').vn_N, 0.6 * 345 * 2 * 280 * 10, 1e-12, 'clear distance');
  });

  it('G4 uses kv = 5 and Cv2 for a slender welded box web', () => {
    const box: SectionDimensions = { family: 'box', depth_mm: 1500, width_mm: 600, webThickness_mm: 8, flangeThickness_mm: 30 };
    const c = capacity(box, 'major', 345, 'welded');
    expectClose(c.vn_N, 0.6 * 345 * 2 * 1440 * 8 * webShearCoefficientCv2(180, 5, E, 345), 1e-12, 'Vn');
    expect(c.webBucklingGoverns).toBe(true);
  });

  it('G5 round HSS: Fcr capped at 0.6·Fy for a stocky tube, and the length term only when Lv is given', () => {
    const stocky = capacity({ family: 'tube', diameter_mm: 168.3, wallThickness_mm: 6.3 }, 'major', 345);
    expectClose(stocky.vn_N, 0.6 * 345 * (areaOf({ family: 'tube', diameter_mm: 168.3, wallThickness_mm: 6.3 }) / 2), 1e-12, 'Vn = 0.6·Fy·Ag/2');
    // Invented thin tube D/t = 200: G5-2b = 0.78·E/200^1.5 governs without Lv; with Lv = 1000 mm, G5-2a exceeds 0.6·Fy.
    const thin: SectionDimensions = { family: 'tube', diameter_mm: 600, wallThickness_mm: 3 };
    const half = areaOf(thin) / 2;
    expectClose(capacity(thin, 'major', 345).vn_N, ((0.78 * E) / 200 ** 1.5) * half, 1e-12, 'Vn without Lv');
    expectClose(capacity(thin, 'major', 345, 'rolled', { ...unstiffened, shearLength_mm: 1000 }).vn_N, 0.6 * 345 * half, 1e-12, 'Vn with Lv');
    const longer = capacity(thin, 'major', 345, 'rolled', { ...unstiffened, shearLength_mm: 20000 }).vn_N;
    expectClose(longer, ((1.6 * E) / (Math.sqrt(20000 / 600) * 200 ** 1.25)) * half, 1e-12, 'Vn by G5-2a');
  });

  it('G6 weak-axis shear of an I-shape: Σ 0.6·Fy·bf·tf over both flanges, φv = 0.90', () => {
    const input = toSectionInput(findSection('W18X35')!);
    const c = capacity({ family: 'I', ...input }, 'minor', 345);
    const flange = input.topFlange.width_mm * input.topFlange.thickness_mm;
    expectClose(c.available_N, 0.9 * 0.6 * 345 * 2 * flange, 1e-12, 'φvVn');
    expect(c.section).toBe('G6');
  });

  it('G3 single angle leg and tee stem: 0.6·Fy·b·t·Cv2 with kv = 1.2', () => {
    const angle: SectionDimensions = { family: 'angle', depth_mm: 120, width_mm: 80, thickness_mm: 10, rootRadius_mm: 11 };
    expectClose(capacity(angle, 'major', 250).vn_N, 0.6 * 250 * 120 * 10, 1e-12, 'vertical leg');
    expectClose(capacity(angle, 'minor', 250).vn_N, 0.6 * 250 * 80 * 10, 1e-12, 'horizontal leg');
    const tee: SectionDimensions = { family: 'tee', depth_mm: 300, width_mm: 200, webThickness_mm: 6, flangeThickness_mm: 15, rootRadius_mm: 12 };
    expectClose(capacity(tee, 'major', 345).vn_N, 0.6 * 345 * 300 * 6 * webShearCoefficientCv2(50, 1.2, E, 345), 1e-12, 'tee stem');
  });

  it.each(['W18X35', 'W44X230'])('keeps the I-section engine values for %s loaded parallel to the web', (name) => {
    const input = toSectionInput(findSection(name)!);
    const expected = aiscShearCapacity(sectionProperties(input), 345, 'lrfd', unstiffened);
    const c = capacity({ family: 'I', ...input }, 'major', 345, input.fabrication);
    expect(c.available_N).toBe(expected.available_N);
    expect(c.trace).toEqual(expected.trace);
  });
});

describe('no rule, no guess; bad boxes refused', () => {
  it('gives a plain reason for a flat bar', () => {
    const rule = aiscFamilyShearCapacity({ family: 'plate', depth_mm: 300, width_mm: 20 }, 'major', 6000, 'rolled', 345, 'lrfd', unstiffened);
    expect(rule).toEqual({ applicable: false, reason: 'no shear rule in AISC 360-22 Chapter G for this family (plate or flat bar)' });
  });

  it('refuses a hollow section whose corner radii leave its webs no flat width', () => {
    const d: SectionDimensions = { family: 'box', depth_mm: 100, width_mm: 100, webThickness_mm: 5, flangeThickness_mm: 5, outerCornerRadius_mm: 50, innerCornerRadius_mm: 45 };
    expect(() => aiscFamilyShearCapacity(d, 'major', 1000, 'rolled', 345, 'lrfd', unstiffened)).toThrow(SectionInputError);
    expect(() => aiscFamilyShearCapacity(d, 'major', 1000, 'rolled', 345, 'lrfd', unstiffened)).toThrow(/innerCornerRadius_mm.*no flat width/);
  });
});
