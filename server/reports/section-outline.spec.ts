import { findSection, toSectionInput } from '../catalogue/catalogue';
import { sectionProperties } from '../engine/section-properties';
import { PT_PER_MM, drawingScale, niceTicks, sectionOutline_mm } from './section-outline';

function shoelaceArea_mm2(points: { x_mm: number; y_mm: number }[]): number {
  let twice = 0;
  points.forEach((p, i) => {
    const q = points[(i + 1) % points.length];
    twice += p.x_mm * q.y_mm - q.x_mm * p.y_mm;
  });
  return Math.abs(twice) / 2;
}

describe('sectionOutline_mm', () => {
  const ipe300 = toSectionInput(findSection('IPE 300')!);
  const props = sectionProperties(ipe300);
  const outline = sectionOutline_mm(props);

  it('encloses the published area of an IPE 300', () => {
    // IPE 300: A = 53.81 cm² (EN 10365 dimensions, open section tables; see reference-notes). The outline replaces
    // each fillet arc by 12 chords, which loses well under 0.1 % of the area.
    expect(Math.abs(shoelaceArea_mm2(outline) - 5381) / 5381).toBeLessThan(0.002);
  });

  it('spans the full depth and flange width, symmetric about the web axis', () => {
    const xs = outline.map((p) => p.x_mm);
    const ys = outline.map((p) => p.y_mm);
    expect(Math.min(...ys)).toBe(0);
    expect(Math.max(...ys)).toBeCloseTo(300, 9);
    expect(Math.max(...xs)).toBeCloseTo(75, 9);
    expect(Math.min(...xs)).toBeCloseTo(-75, 9);
    const webPoint = outline.find((p) => Math.abs(p.y_mm - 150) < 1e-9 && p.x_mm > 0);
    expect(webPoint?.x_mm).toBeCloseTo(7.1 / 2, 9);
  });
});

describe('drawingScale', () => {
  it('picks the largest standard scale that fits', () => {
    // 300 mm at 1:5 is 170 pt (72 pt per inch, 25.4 mm per inch).
    expect((300 * PT_PER_MM) / 5).toBeCloseTo(170.08, 2);
    expect(drawingScale(150, 300, 140, 220)).toBe(5);
    expect(drawingScale(150, 300, 140, 160)).toBe(10);
    expect(drawingScale(350, 1000, 140, 220)).toBe(20);
    expect(drawingScale(5000, 50000, 10, 10)).toBe(100);
  });
});

describe('niceTicks', () => {
  it('steps by 1, 2 or 5 times a power of ten up to the maximum', () => {
    expect(niceTicks(273, 4)).toEqual([0, 100, 200, 300]);
    expect(niceTicks(0.9, 5)).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
    expect(niceTicks(0)).toEqual([0]);
  });
});
