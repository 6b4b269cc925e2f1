import { expectClose } from './expect-close';
import type { Point2_mm, SectionPolygon } from './section-family';
import { alignToEdges, intervals, normalisePolygon, polygonProperties, transformPolygon, widthAtY_mm } from './section-polygon';

const rectangle = (b: number, h: number, cx = 0, cy = 0): Point2_mm[] => [
  [cx - b / 2, cy - h / 2],
  [cx + b / 2, cy - h / 2],
  [cx + b / 2, cy + h / 2],
  [cx - b / 2, cy + h / 2],
];

function regularPolygon(radius: number, n: number): Point2_mm[] {
  return Array.from({ length: n }, (_, i): Point2_mm => [radius * Math.cos((2 * Math.PI * i) / n), radius * Math.sin((2 * Math.PI * i) / n)]);
}

describe('polygonProperties', () => {
  it('gives a rectangle A = bh, Ix = bh³/12, Iy = hb³/12 about its centroid wherever it lies (common practice, no source)', () => {
    const p = polygonProperties({ outer: rectangle(120, 300, 1000, -500), voids: [] });
    expect(p.area_mm2).toBeCloseTo(120 * 300, 6);
    expect(p.centroid_mm[0]).toBeCloseTo(1000, 9);
    expect(p.centroid_mm[1]).toBeCloseTo(-500, 9);
    expectClose(p.ix_mm4, (120 * 300 ** 3) / 12, 1e-12, 'Ix');
    expectClose(p.iy_mm4, (300 * 120 ** 3) / 12, 1e-12, 'Iy');
    expect(p.ixy_mm4).toBeCloseTo(0, 3);
    expect(p.principalAngle_rad).toBeCloseTo(0, 12);
    expect(p.bounds).toEqual({ minX_mm: 940, maxX_mm: 1060, minY_mm: -650, maxY_mm: -350 });
  });

  it('subtracts a void whatever its orientation: hollow rectangle (BH³ − bh³)/12 (common practice, no source)', () => {
    const expectedIx = (200 * 300 ** 3 - 180 * 276 ** 3) / 12;
    for (const inner of [rectangle(180, 276), rectangle(180, 276).reverse()]) {
      const p = polygonProperties({ outer: rectangle(200, 300), voids: [inner] });
      expect(p.area_mm2).toBeCloseTo(200 * 300 - 180 * 276, 6);
      expectClose(p.ix_mm4, expectedIx, 1e-12, 'Ix');
    }
  });

  it('gives a clockwise outline the same positive properties', () => {
    const p = polygonProperties({ outer: rectangle(50, 80).reverse(), voids: [] });
    expect(p.area_mm2).toBeCloseTo(4000, 9);
    expectClose(p.ix_mm4, (50 * 80 ** 3) / 12, 1e-12, 'Ix');
  });

  it('approaches a circle πd²/4 and πd⁴/64 as the chords get finer (common practice, no source)', () => {
    const d = 200;
    const p = polygonProperties({ outer: regularPolygon(d / 2, 4000), voids: [] });
    expectClose(p.area_mm2, (Math.PI * d ** 2) / 4, 1e-6, 'A');
    expectClose(p.ix_mm4, (Math.PI * d ** 4) / 64, 1e-6, 'Ix');
    expectClose(p.iy_mm4, (Math.PI * d ** 4) / 64, 1e-6, 'Iy');
  });

  it('gives a right triangle A = bh/2, Ix = bh³/36, Ixy = −b²h²/72 about its centroid (common practice, no source)', () => {
    const [b, h] = [60, 90];
    const p = polygonProperties({ outer: [[0, 0], [b, 0], [0, h]], voids: [] });
    expect(p.area_mm2).toBeCloseTo((b * h) / 2, 9);
    expect(p.centroid_mm[0]).toBeCloseTo(b / 3, 9);
    expect(p.centroid_mm[1]).toBeCloseTo(h / 3, 9);
    expectClose(p.ix_mm4, (b * h ** 3) / 36, 1e-12, 'Ix');
    expectClose(p.iy_mm4, (h * b ** 3) / 36, 1e-12, 'Iy');
    expectClose(p.ixy_mm4, -(b * b * h * h) / 72, 1e-12, 'Ixy');
  });

  it('finds the principal axes of a rotated rectangle: the angle and the invariant Imax, Imin', () => {
    const angle = (25 * Math.PI) / 180;
    const turned = transformPolygon({ outer: rectangle(40, 100), voids: [] }, angle, [0, 0]);
    const p = polygonProperties(turned);
    // The long side (depth 100 along y) turned by 25° gives the major axis (the one across it) at 25°.
    expect(p.principalAngle_rad).toBeCloseTo(angle, 10);
    expectClose(p.iMajor_mm4, (40 * 100 ** 3) / 12, 1e-10, 'Imax');
    expectClose(p.iMinor_mm4, (100 * 40 ** 3) / 12, 1e-10, 'Imin');
  });

  it('gives zeros, never NaN, for a loop with no area', () => {
    const p = polygonProperties({ outer: [[0, 0], [10, 0], [20, 0]], voids: [] });
    expect(p.area_mm2).toBe(0);
    expect(p.centroid_mm).toEqual([10, 0]);
    expect(Number.isNaN(p.ix_mm4)).toBe(false);
  });
});

describe('normalisePolygon', () => {
  it('turns the outer loop counter-clockwise and voids clockwise, dropping repeated and collinear points', () => {
    const outer: Point2_mm[] = [[0, 0], [0, 10], [0, 10], [10, 10], [10, 5], [10, 0], [5, 0], [0, 0]];
    const result = normalisePolygon({ outer, voids: [rectangle(2, 2, 5, 5)] });
    if (result.status !== 'valid') throw new Error(result.reason);
    expect(result.polygon.outer).toHaveLength(4);
    expect(polygonProperties({ outer: result.polygon.outer, voids: [] }).area_mm2).toBeCloseTo(100, 9);
    const [v] = result.polygon.voids;
    let twice = 0;
    v.forEach((p, i) => (twice += p[0] * v[(i + 1) % v.length][1] - v[(i + 1) % v.length][0] * p[1]));
    expect(twice).toBeLessThan(0);
  });

  it.each<[string, SectionPolygon, RegExp]>([
    ['fewer than three points', { outer: [[0, 0], [1, 1]], voids: [] }, /fewer than 3 distinct corners/],
    ['no area (all on one line)', { outer: [[0, 0], [5, 0], [10, 0], [3, 0]], voids: [] }, /fewer than 3 distinct corners/],
    ['a bow tie', { outer: [[0, 0], [10, 10], [10, 0], [0, 10]], voids: [] }, /crosses itself/],
    ['a void outside', { outer: rectangle(10, 10), voids: [rectangle(2, 2, 20, 0)] }, /lies outside its outline/],
    ['a void crossing the outline', { outer: rectangle(10, 10), voids: [rectangle(4, 4, 5, 0)] }, /cross or touch/],
    ['a void inside a void', { outer: rectangle(10, 10), voids: [rectangle(6, 6), rectangle(2, 2)] }, /inside opening 1/],
    ['a point that is not a number', { outer: [[0, 0], [1, Number.NaN], [0, 1]], voids: [] }, /not numbers/],
  ])('refuses %s with a plain reason', (_, polygon, reason) => {
    const result = normalisePolygon(polygon);
    expect(result.status).toBe('invalid');
    if (result.status === 'invalid') expect(result.reason).toMatch(reason);
  });
});

describe('alignToEdges', () => {
  it('turns a rectangle cut at 30° back onto the axes and centres its bounding box', () => {
    const angle = Math.PI / 6;
    const cut = transformPolygon({ outer: rectangle(100, 200), voids: [] }, angle, [-40, -70]);
    const aligned = alignToEdges(cut);
    expect(aligned.rotation_rad).toBeCloseTo(-angle, 12);
    const xs = aligned.polygon.outer.map(([x]) => x);
    const ys = aligned.polygon.outer.map(([, y]) => y);
    expect(Math.max(...xs)).toBeCloseTo(50, 9);
    expect(Math.min(...ys)).toBeCloseTo(-100, 9);
    // Back in the input's coordinates the centre is where the rectangle's centre went.
    const back = transformPolygon({ outer: [[0, 0]], voids: [] }, 0, [-aligned.centre_mm[0], -aligned.centre_mm[1]]);
    const expected = transformPolygon({ outer: [[0, 0]], voids: [] }, angle, [-40, -70]);
    expect(back.outer[0][0]).toBeCloseTo(expected.outer[0][0], 9);
    expect(back.outer[0][1]).toBeCloseTo(expected.outer[0][1], 9);
  });

  it('is not tilted by sloped faces that come in mirrored pairs', () => {
    const tapered: Point2_mm[] = [[-50, -100], [50, -100], [50, -90], [5, -80], [5, 80], [50, 90], [50, 100], [-50, 100], [-50, 90], [-5, 80], [-5, -80], [-50, -90]];
    expect(alignToEdges({ outer: tapered, voids: [] }).rotation_rad).toBe(0);
  });
});

describe('intervals and widthAtY_mm', () => {
  const hollow: SectionPolygon = { outer: rectangle(100, 100), voids: [rectangle(80, 80).reverse()] };

  it('gives the two walls of a hollow rectangle', () => {
    expect(intervals(hollow, 'y', 0)).toEqual([[-50, -40], [40, 50]]);
    expect(intervals(hollow, 'x', 45)).toEqual([[-50, 50]]);
    expect(widthAtY_mm(hollow, 0)).toBeCloseTo(20, 12);
    expect(widthAtY_mm(hollow, 45)).toBeCloseTo(100, 12);
    expect(widthAtY_mm(hollow, 60)).toBe(0);
  });
});
