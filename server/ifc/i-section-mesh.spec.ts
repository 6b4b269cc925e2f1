import { findSection, toSectionInput } from '../catalogue/catalogue';
import { sectionProperties } from '../engine/section-properties';
import { extrudedMesh, iSectionOutline, outlineWithCap, type Point2, triangulate } from './i-section-mesh';

function shoelace(points: readonly Point2[]): number {
  let twice = 0;
  points.forEach(([x0, y0], i) => {
    const [x1, y1] = points[(i + 1) % points.length];
    twice += x0 * y1 - x1 * y0;
  });
  return twice / 2;
}

const welded = {
  depth_mm: 900,
  webThickness_mm: 12,
  topFlange: { width_mm: 300, thickness_mm: 20, filletRadius_mm: 0 },
  bottomFlange: { width_mm: 400, thickness_mm: 25, filletRadius_mm: 0 },
};

describe('iSectionOutline', () => {
  it('is the plate girder exactly: 300 × 20 + 400 × 25 + 855 × 12 mm² (common practice, no source: sum of the plates)', () => {
    const outline = iSectionOutline(welded);
    expect(outline).toHaveLength(12);
    expect(shoelace(outline)).toBeCloseTo(300 * 20 + 400 * 25 + 855 * 12, 9);
  });

  it('follows a rolled section within 1 % of its exact area (chords across the concave fillets add a little)', () => {
    const heb300 = toSectionInput(findSection('HEB 300')!);
    const outline = iSectionOutline(heb300);
    const exact = sectionProperties(heb300).area_mm2;
    expect(shoelace(outline)).toBeGreaterThan(exact);
    expect(shoelace(outline) / exact).toBeLessThan(1.01);
  });

  it('is centred on its bounding box, as IFC places parameterised profiles', () => {
    const ys = iSectionOutline(welded).map(([, y]) => y);
    expect(Math.min(...ys)).toBe(-450);
    expect(Math.max(...ys)).toBe(450);
  });
});

describe('triangulate and extrudedMesh', () => {
  const outline = iSectionOutline(toSectionInput(findSection('IPE 300')!));

  it('covers the outline exactly with counter-clockwise triangles', () => {
    const triangles = triangulate(outline);
    let area = 0;
    for (let t = 0; t < triangles.length; t += 3) {
      const a = shoelace([outline[triangles[t]], outline[triangles[t + 1]], outline[triangles[t + 2]]]);
      expect(a).toBeGreaterThan(0);
      area += a;
    }
    expect(area).toBeCloseTo(shoelace(outline), 6);
  });

  it('encloses area × length with outward faces (divergence theorem)', () => {
    const { vertices, indices } = extrudedMesh(outlineWithCap(outline), [0, 0, 1], 6000);
    let volume = 0;
    for (let t = 0; t < indices.length; t += 3) {
      const [a, b, c] = [indices[t], indices[t + 1], indices[t + 2]].map((i) => [vertices[i * 6], vertices[i * 6 + 1], vertices[i * 6 + 2]]);
      volume += (a[0] * (b[1] * c[2] - b[2] * c[1]) - a[1] * (b[0] * c[2] - b[2] * c[0]) + a[2] * (b[0] * c[1] - b[1] * c[0])) / 6;
    }
    expect(volume / (shoelace(outline) * 6000)).toBeCloseTo(1, 5);
  });
});
