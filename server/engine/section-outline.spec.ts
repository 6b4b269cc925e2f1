import { expectClose } from './expect-close';
import { SectionInputError } from './section';
import type { IDimensions, SectionDimensions } from './section-family';
import { FAMILY_SECTIONS as SECTIONS } from './test-family-sections';
import { chordCount, sectionOutline } from './section-outline';
import { normalisePolygon, polygonProperties } from './section-polygon';
import { sectionProperties } from './section-properties';


describe('sectionOutline', () => {
  it.each(SECTIONS.map((d) => [d.family, d] as const))('draws a valid %s outline centred on its bounding box', (_, d) => {
    const outline = sectionOutline(d, 0.05);
    const result = normalisePolygon(outline);
    expect(result.status).toBe('valid');
    const { bounds } = polygonProperties(outline);
    expect(bounds.minY_mm + bounds.maxY_mm).toBeCloseTo(0, 9);
    expect(bounds.minX_mm + bounds.maxX_mm).toBeCloseTo(0, 9);
  });

  it('draws an I with the engine geometry: its area and Iy converge on the exact band integration as chords get finer', () => {
    for (const d of SECTIONS.filter((s): s is IDimensions => s.family === 'I')) {
      const exact = sectionProperties({ ...d, fabrication: 'rolled' });
      const fine = polygonProperties(sectionOutline(d, 1e-4));
      expectClose(fine.area_mm2, exact.area_mm2, 1e-5, 'A');
      expectClose(fine.ix_mm4, exact.iMajor_mm4, 1e-5, 'Iy');
    }
  });

  it('keeps every chord within the tolerance: a circle of radius 100 with 0.1 mm chord error', () => {
    const n = chordCount(100, 2 * Math.PI, 0.1);
    // Chord error of n equal chords is r(1 − cos(π/n)) (common practice, no source).
    expect(100 * (1 - Math.cos(Math.PI / n))).toBeLessThanOrEqual(0.1);
    expect(100 * (1 - Math.cos(Math.PI / (n - 1)))).toBeGreaterThan(0.1);
  });

  it('gives a hollow section A = (area of the outer rounded rectangle) − (inner) (common practice, no source)', () => {
    const [b, h, t, ro, ri] = [100, 200, 8, 16, 8];
    const rounded = (w: number, d: number, r: number) => w * d - (4 - Math.PI) * r * r;
    const p = polygonProperties(sectionOutline({ family: 'box', depth_mm: h, width_mm: b, webThickness_mm: t, flangeThickness_mm: t, outerCornerRadius_mm: ro, innerCornerRadius_mm: ri }, 1e-4));
    expectClose(p.area_mm2, rounded(b, h, ro) - rounded(b - 2 * t, h - 2 * t, ri), 1e-6, 'A');
  });

  it.each<[string, SectionDimensions, RegExp]>([
    ['a web thicker than the channel is wide', { family: 'channel', depth_mm: 100, width_mm: 40, webThickness_mm: 50, flangeThickness_mm: 8, rootRadius_mm: 8 }, /webThickness_mm/],
    ['a tube wall thicker than its radius', { family: 'tube', diameter_mm: 50, wallThickness_mm: 30 }, /wallThickness_mm/],
    ['a negative depth', { family: 'plate', depth_mm: -5, width_mm: 10 }, /depth_mm/],
    ['an other section', { family: 'other', depth_mm: 100, width_mm: 50, description: 'Z-section' }, /no idealised outline/],
  ])('refuses %s with a SectionInputError', (_, d, message) => {
    expect(() => sectionOutline(d, 0.1)).toThrow(SectionInputError);
    expect(() => sectionOutline(d, 0.1)).toThrow(message);
  });
});
