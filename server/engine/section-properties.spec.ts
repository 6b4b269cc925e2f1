import { type ISectionInput } from './section';
import { sectionProperties } from './section-properties';
import { iSection } from './test-sections';
import { expectClose } from './expect-close';

type Point = readonly [number, number];

/**
 * Independent route: the outline as a polygon (root-fillet arcs split into many chords) and the polygon-moment
 * formulas from Green's theorem, A = ½Σ(xᵢyᵢ₊₁ − xᵢ₊₁yᵢ), ∫y dA = ⅙Σ(…)(yᵢ + yᵢ₊₁), ∫y² dA = 1⁄12Σ(…)(yᵢ² + yᵢyᵢ₊₁ + yᵢ₊₁²).
 * Q(y) clips the polygon at the level (Sutherland–Hodgman against one half-plane).
 */
function polygonMoments(points: readonly Point[]): { area: number; first: number; second: number } {
  let area = 0;
  let first = 0;
  let second = 0;
  for (let i = 0; i < points.length; i++) {
    const [x0, y0] = points[i];
    const [x1, y1] = points[(i + 1) % points.length];
    const cross = x0 * y1 - x1 * y0;
    area += cross / 2;
    first += (cross * (y0 + y1)) / 6;
    second += (cross * (y0 * y0 + y0 * y1 + y1 * y1)) / 12;
  }
  return { area, first, second };
}

function clipAbove(points: readonly Point[], level: number): Point[] {
  const out: Point[] = [];
  for (let i = 0; i < points.length; i++) {
    const a = points[i];
    const b = points[(i + 1) % points.length];
    const aIn = a[1] >= level;
    const bIn = b[1] >= level;
    if (aIn) out.push(a);
    if (aIn !== bIn) {
      const t = (level - a[1]) / (b[1] - a[1]);
      out.push([a[0] + t * (b[0] - a[0]), level]);
    }
  }
  return out;
}

function arc(cx: number, cy: number, r: number, from: number, to: number, segments = 4000): Point[] {
  if (r === 0) return [[cx, cy]];
  return Array.from({ length: segments + 1 }, (_, k) => {
    const theta = from + ((to - from) * k) / segments;
    return [cx + r * Math.cos(theta), cy + r * Math.sin(theta)] as Point;
  });
}

/** Counter-clockwise outline of a parallel-flange I-section with root fillets, written out corner by corner. */
function outline(s: ISectionInput): Point[] {
  const d = s.depth_mm;
  const w = s.webThickness_mm / 2;
  const { width_mm: bt, thickness_mm: tt, filletRadius_mm: rt } = s.topFlange;
  const { width_mm: bb, thickness_mm: tb, filletRadius_mm: rb } = s.bottomFlange;
  const pi = Math.PI;
  return [
    [-bb / 2, 0],
    [bb / 2, 0],
    [bb / 2, tb],
    ...arc(w + rb, tb + rb, rb, -pi / 2, -pi),
    ...arc(w + rt, d - tt - rt, rt, pi, pi / 2),
    [bt / 2, d - tt],
    [bt / 2, d],
    [-bt / 2, d],
    [-bt / 2, d - tt],
    ...arc(-w - rt, d - tt - rt, rt, pi / 2, 0),
    ...arc(-w - rb, tb + rb, rb, 0, -pi / 2),
    [-bb / 2, tb],
  ];
}

function polygonProperties(points: readonly Point[]) {
  const m = polygonMoments(points);
  const yNa = m.first / m.area;
  const q = (y: number): number => {
    const above = polygonMoments(clipAbove(points, y));
    return above.first - yNa * above.area;
  };
  return { area: m.area, yNa, iMajor: m.second - m.area * yNa * yNa, q };
}

function compareWithPolygon(s: ISectionInput, tolerance: number): void {
  const exact = sectionProperties(s);
  const poly = polygonProperties(outline(s));
  expectClose(exact.area_mm2, poly.area, tolerance, 'A');
  expectClose(exact.neutralAxisFromBottom_mm, poly.yNa, tolerance, 'neutral axis');
  expectClose(exact.iMajor_mm4, poly.iMajor, tolerance, 'I');
  expectClose(exact.qMax_mm3, poly.q(poly.yNa), tolerance, 'Q at the neutral axis');
  for (const y of [0.05, 0.2, 0.35, 0.6, 0.8, 0.97].map((k) => k * s.depth_mm)) {
    expectClose(exact.firstMoment_mm3(y), poly.q(y), tolerance, `Q at y = ${y}`);
  }
  expectClose(exact.qTopJunction_mm3, poly.q(s.depth_mm - s.topFlange.thickness_mm), tolerance, 'Q at the top junction');
  expectClose(exact.qBottomJunction_mm3, poly.q(s.bottomFlange.thickness_mm), tolerance, 'Q at the bottom junction');
}

describe('sectionProperties against an independent polygon integration', () => {
  it.each([
    ['a welded mono-symmetric section of plates (exact polygon, no arcs)', iSection(600, 10, [300, 20, 0], [150, 12, 0]), 1e-12],
    ['a rolled asymmetric section with different root fillets (arcs as 4000 chords each)', iSection(500, 10, [250, 20, 15], [180, 14, 10]), 1e-8],
    ['a doubly symmetric rolled section with IPE 300 dimensions', iSection(300, 7.1, [150, 10.7, 15]), 1e-8],
  ])('matches for %s', (_name, section, tolerance) => {
    compareWithPolygon(section, tolerance);
  });

  it('matches a tapered flange without roundings, outlined as a trapezoid', () => {
    // Thickness tf is measured half-way along the outstand, so the inner face runs from tf + s·c/2 at the web to
    // tf − s·c/2 at the tip, c = (b − tw)/2, s = tan(slope).
    const slope = Math.atan(0.14);
    const s: ISectionInput = {
      depth_mm: 300,
      webThickness_mm: 10.8,
      topFlange: { width_mm: 125, thickness_mm: 16.2, filletRadius_mm: 0, slope_rad: slope },
      bottomFlange: { width_mm: 125, thickness_mm: 16.2, filletRadius_mm: 0, slope_rad: slope },
      fabrication: 'rolled',
    };
    const c = (125 - 10.8) / 2;
    const root = 16.2 + (0.14 * c) / 2;
    const tip = 16.2 - (0.14 * c) / 2;
    const w = 10.8 / 2;
    const pts: Point[] = [
      [-62.5, 0],
      [62.5, 0],
      [62.5, tip],
      [w, root],
      [w, 300 - root],
      [62.5, 300 - tip],
      [62.5, 300],
      [-62.5, 300],
      [-62.5, 300 - tip],
      [-w, 300 - root],
      [-w, root],
      [-62.5, tip],
    ];
    const exact = sectionProperties(s);
    const poly = polygonProperties(pts);
    expectClose(exact.area_mm2, poly.area, 1e-12, 'A');
    expectClose(exact.iMajor_mm4, poly.iMajor, 1e-12, 'I');
    for (const y of [5, 14, 17, 20, 100, 150, 283]) expectClose(exact.firstMoment_mm3(y), poly.q(y), 1e-10, `Q at ${y}`);
    // Measuring the thickness at mid-outstand makes the tapered flange exactly as heavy as a parallel one.
    expectClose(exact.area_mm2, 2 * 125 * 16.2 + (300 - 2 * 16.2) * 10.8, 1e-12, 'mean-thickness area');
  });
});

describe('sectionProperties closed forms', () => {
  const plates = iSection(400, 8, [200, 15, 0]);

  it('gives the three-rectangle I-section results (any mechanics-of-materials text)', () => {
    // I = [b·d³ − (b − tw)·hw³]/12, Q(NA) = b·tf·(d − tf)/2 + tw·hw²/8, with hw = d − 2tf.
    const p = sectionProperties(plates);
    const hw = 370;
    expectClose(p.area_mm2, 2 * 200 * 15 + hw * 8, 1e-14, 'A');
    expectClose(p.iMajor_mm4, (200 * 400 ** 3 - 192 * hw ** 3) / 12, 1e-13, 'I');
    expectClose(p.qMax_mm3, (200 * 15 * 385) / 2 + (8 * hw * hw) / 8, 1e-13, 'Q(NA)');
    expectClose(p.qTopJunction_mm3, (200 * 15 * 385) / 2, 1e-13, 'Q at junction');
    expect(p.neutralAxisFromBottom_mm).toBeCloseTo(200, 10);
    expect(p.clearWebDepth_mm).toBe(hw);
    expect(p.avEn_mm2).toBe(hw * 8);
    expect(p.awAisc_mm2).toBe(3200);
    // Plastic modulus of the same plates: 2·[b·tf·(d − tf)/2] + tw·hw²/4.
    expectClose(p.plasticModulusMajor_mm3, 200 * 15 * 385 + (8 * hw * hw) / 4, 1e-10, 'Wpl');
  });

  it('removes (1 − π/4)·r² for each rounded flange toe', () => {
    const base = sectionProperties(plates);
    const rounded = sectionProperties({ ...plates, topFlange: { ...plates.topFlange, edgeRadius_mm: 6 } });
    expectClose(base.area_mm2 - rounded.area_mm2, 2 * (1 - Math.PI / 4) * 36, 1e-10, 'area of two toe roundings');
  });

  it('adds (1 − π/4)·r² for each root fillet', () => {
    const base = sectionProperties(plates);
    const filleted = sectionProperties({
      ...plates,
      fabrication: 'rolled',
      topFlange: { ...plates.topFlange, filletRadius_mm: 20 },
      bottomFlange: { ...plates.bottomFlange, filletRadius_mm: 20 },
    });
    expectClose(filleted.area_mm2 - base.area_mm2, 4 * (1 - Math.PI / 4) * 400, 1e-12, 'area of four fillets');
    expect(filleted.webDepthLessFillets_mm).toBeCloseTo(400 - 2 * 15 - 2 * 20, 10);
  });

  it('reports widths on both sides of a junction and zero outside the section', () => {
    const p = sectionProperties({ ...plates, fabrication: 'rolled', topFlange: { ...plates.topFlange, filletRadius_mm: 20 } });
    expect(p.widthAt_mm(385, 'below')).toBeCloseTo(8 + 40, 10);
    expect(p.widthAt_mm(385, 'above')).toBe(200);
    expect(p.widthAt_mm(365)).toBeCloseTo(8, 10);
    expect(p.widthAt_mm(-1)).toBe(0);
    expect(p.widthAt_mm(401)).toBe(0);
    expect(p.firstMoment_mm3(0)).toBe(0);
    expect(p.firstMoment_mm3(400)).toBe(0);
  });
});

describe('sectionProperties against a published section table', () => {
  it('reproduces IPE 300', () => {
    // EN 10365 dimensions h 300, b 150, tw 7.1, tf 10.7, r 15; A = 53.81 cm², Iy = 8356 cm⁴ as printed in open EN
    // section tables (ArcelorMittal "Sections and Merchant Bars"); Wpl,y = 628.4 cm³ and Avz = 25.68 cm² from memory.
    const p = sectionProperties(iSection(300, 7.1, [150, 10.7, 15]));
    expectClose(p.area_mm2 / 100, 53.81, 5e-4, 'A (cm²)');
    expectClose(p.iMajor_mm4 / 1e4, 8356, 5e-4, 'Iy (cm⁴)');
    expectClose(p.plasticModulusMajor_mm3 / 1e3, 628.4, 5e-4, 'Wpl,y (cm³)');
    expectClose(p.avEn_mm2 / 100, 25.68, 5e-4, 'Avz (cm²)');
  });
});
