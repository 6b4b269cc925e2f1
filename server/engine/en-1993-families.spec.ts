import { findCatalogueEntry } from '../catalogue/catalogue-lookup';
import { findSection, toSectionInput } from '../catalogue/catalogue';
import { expectClose } from './expect-close';
import { type EnFamilyShear, enFamilyShearCapacity } from './en-1993-families';
import { enShearCapacity } from './en-1993';
import type { Fabrication } from './section';
import type { SectionDimensions } from './section-family';
import { polygonProperties } from './section-polygon';
import { sectionOutline } from './section-outline';
import { sectionProperties } from './section-properties';
import type { ShearAxis } from './shear-axis';

const SQRT3 = Math.sqrt(3);
const recommended = { gammaM0: 1, gammaM1: 1, eta: 1.2, endPost: 'non-rigid' as const, stiffenerSpacing_mm: null };
const areaOf = (d: SectionDimensions): number => polygonProperties(sectionOutline(d, 0.01)).area_mm2;
const dimensionsOf = (name: string): SectionDimensions => findCatalogueEntry(name)!.entry.dimensions;

function capacity(d: SectionDimensions, axis: ShearAxis, fabrication: Fabrication = 'rolled', fy = 355, params = recommended): EnFamilyShear {
  const rule = enFamilyShearCapacity(d, axis, areaOf(d), fabrication, fy, params);
  if (!rule.applicable) throw new Error(rule.reason);
  return rule.capacity;
}

describe('EN 1993-1-1 §6.2.6(3) shear areas of hollow sections', () => {
  it('gives a CHS Av = 2A/π (closed form of the clause) and Vpl,Rd = Av·fy/√3', () => {
    const d = dimensionsOf('CHS 168.3x6.3 EN 10210');
    const c = capacity(d, 'major');
    const exactArea = Math.PI * (84.15 ** 2 - 77.85 ** 2);
    expectClose(c.av_mm2, (2 * exactArea) / Math.PI, 1e-4, 'Av against the exact annulus');
    // EN 10210-2 lists A = 32.1 cm² for 168.3 × 6.3 (as transcribed in the catalogue).
    expectClose(c.av_mm2, (2 * 3210) / Math.PI, 5e-3, 'Av against the table area');
    expectClose(c.vplRd_N, (c.av_mm2 * 355) / SQRT3, 1e-14, 'Vpl,Rd');
    expect(capacity(d, 'minor').av_mm2).toBeCloseTo(c.av_mm2, 6);
    expect(c.webs).toBeNull();
  });

  it('gives a rolled square hollow section Av = A·h/(b + h) = A/2 on either axis', () => {
    const d = dimensionsOf('SHS 100x100x6.3 EN 10210');
    // EN 10210-2 lists A = 23.2 cm² for 100 × 100 × 6.3 (as transcribed in the catalogue).
    expectClose(capacity(d, 'major').av_mm2, 2320 / 2, 0.01, 'Av against the table area');
    expectClose(capacity(d, 'major').av_mm2, areaOf(d) / 2, 1e-12, 'Av = A/2');
    expectClose(capacity(d, 'minor').av_mm2, areaOf(d) / 2, 1e-12, 'Av = A/2, minor');
  });

  it('splits a rectangular hollow section by its sides: A·h/(b + h) and A·b/(b + h)', () => {
    const d: SectionDimensions = { family: 'box', depth_mm: 200, width_mm: 100, webThickness_mm: 8, flangeThickness_mm: 8, outerCornerRadius_mm: 16, innerCornerRadius_mm: 8 };
    expectClose(capacity(d, 'major').av_mm2, (areaOf(d) * 200) / 300, 1e-12, 'load parallel to the depth');
    expectClose(capacity(d, 'minor').av_mm2, (areaOf(d) * 100) / 300, 1e-12, 'load parallel to the width');
  });

  it('takes a welded box as plates: η·Σ(hw·tw) parallel to the webs, A − Σ(hw·tw) parallel to the flanges', () => {
    const d: SectionDimensions = { family: 'box', depth_mm: 600, width_mm: 400, webThickness_mm: 15, flangeThickness_mm: 25 };
    const A = 600 * 400 - 370 * 550;
    expectClose(capacity(d, 'major', 'welded').av_mm2, 1.2 * 2 * 550 * 15, 1e-12, 'Av major');
    expectClose(capacity(d, 'minor', 'welded').av_mm2, A - 2 * 550 * 15, 1e-12, 'Av minor');
  });

  it('checks both slender webs of a box for shear buckling (EN 1993-1-5 §5, non-rigid end post)', () => {
    // Invented box girder: webs 1440 × 8 (hw/t = 180 > 72ε/η), fy 355: λw = 1440/(86.4 × 8 × 0.8136), χw = 0.83/λw.
    const d: SectionDimensions = { family: 'box', depth_mm: 1500, width_mm: 600, webThickness_mm: 8, flangeThickness_mm: 30 };
    const c = capacity(d, 'major', 'welded');
    const lambda = 1440 / (86.4 * 8 * Math.sqrt(235 / 355));
    expect(c.bucklingChecked).toBe(true);
    expectClose(c.vbwRd_N!, (2 * (0.83 / lambda) * 355 * 1440 * 8) / SQRT3, 1e-12, 'Vbw,Rd of two webs');
    expect(c.vRd_N).toBe(c.vbRd_N);
    expect(c.webBucklingGoverns).toBe(true);
  });
});

describe('EN 1993-1-1 §6.2.6(3) shear areas of channels and tees', () => {
  it('gives a rolled channel A − 2b·tf + (tw + r)·tf, UPE 200 (dimensions from the catalogue, by hand)', () => {
    const d = dimensionsOf('UPE 200');
    const A = areaOf(d);
    expectClose(capacity(d, 'major').av_mm2, A - 2 * 80 * 11 + (6 + 13) * 11, 1e-12, 'Av UPE 200');
    // §6.2.6(3)(e) parallel to the flanges: A − hw·tw.
    expectClose(capacity(d, 'minor').av_mm2, A - (200 - 22) * 6, 1e-12, 'Av,y UPE 200');
    expect(capacity(d, 'major').webs).toEqual({ count: 1, hw_mm: 178, t_mm: 6 });
  });

  it('gives a rolled tee 0.9·(A − b·tf) (AC:2009, from memory) and a welded tee tw·(h − tf/2)', () => {
    const d: SectionDimensions = { family: 'tee', depth_mm: 150, width_mm: 200, webThickness_mm: 9, flangeThickness_mm: 15, rootRadius_mm: 18 };
    expectClose(capacity(d, 'major').av_mm2, 0.9 * (areaOf(d) - 200 * 15), 1e-12, 'rolled tee');
    const welded: SectionDimensions = { ...d, rootRadius_mm: 0 };
    expectClose(capacity(welded, 'major', 'welded').av_mm2, 9 * (150 - 7.5), 1e-12, 'welded tee');
  });
});

describe('I-sections', () => {
  it.each(['IPE 300', 'HEB 500', 'IPN 400'])('keep the I-section engine values for %s loaded parallel to the web', (name) => {
    const input = toSectionInput(findSection(name)!);
    const expected = enShearCapacity(sectionProperties(input), 355, recommended);
    const c = capacity({ family: 'I', ...input }, 'major', input.fabrication);
    expect(c.vRd_N).toBe(expected.vRd_N);
    expect(c.av_mm2).toBe(expected.av_mm2);
    expect(c.trace).toEqual(expected.trace);
  });

  it('gives A − hw·tw parallel to the flanges (§6.2.6(3)(e)), IPE 300 by hand from its table dimensions', () => {
    const input = toSectionInput(findSection('IPE 300')!);
    const props = sectionProperties(input);
    expectClose(capacity({ family: 'I', ...input }, 'minor').av_mm2, props.area_mm2 - (300 - 2 * 10.7) * 7.1, 1e-12, 'Av,y');
  });
});

describe('no rule, no guess', () => {
  it.each<[string, SectionDimensions, ShearAxis, Fabrication]>([
    ['an angle', { family: 'angle', depth_mm: 120, width_mm: 80, thickness_mm: 10, rootRadius_mm: 11 }, 'major', 'rolled'],
    ['a flat bar', { family: 'plate', depth_mm: 300, width_mm: 20 }, 'major', 'rolled'],
    ['a tee loaded parallel to its flange', { family: 'tee', depth_mm: 150, width_mm: 200, webThickness_mm: 9, flangeThickness_mm: 15, rootRadius_mm: 18 }, 'minor', 'rolled'],
    ['a welded channel loaded parallel to its web', { family: 'channel', depth_mm: 250, width_mm: 90, webThickness_mm: 8, flangeThickness_mm: 15, rootRadius_mm: 0 }, 'major', 'welded'],
  ])('gives a plain reason for %s', (_, d, axis, fabrication) => {
    const rule = enFamilyShearCapacity(d, axis, areaOf(d), fabrication, 355, recommended);
    expect(rule.applicable).toBe(false);
    if (!rule.applicable) expect(rule.reason).toMatch(/^no shear rule in EN 1993-1-1 §6\.2\.6\(3\)/);
  });
});
