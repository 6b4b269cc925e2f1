/**
 * Bodies the generator writes as faces must be closed shells with outward faces, and enclose the volume of the section
 * swept along the member. Check values: polyhedron volume by the divergence theorem (Σ over triangles of a·(b×c)/6),
 * polygon area by the shoelace formula (general geometry); section areas by the closed-form area of an I with root
 * fillets, A = 2·b·tf + (h − 2·tf)·tw + (4 − π)·r² (common practice, no source), against the EN 10365 table value for
 * HE 360 A, A = 142.8 cm² (from memory).
 */
import type { IDimensions } from '../../server/engine/section-family';
import { REAL_EXPORT_SECTIONS } from './real-export-sections';
import { chordedLoop, type Point2, sectionLoops } from './section-loops';
import { copedMesh, enclosedVolume, loftMesh, type Mesh, prismMesh, triangulate } from './solid-mesh';

const volume_mm3 = (mesh: Mesh): number => enclosedVolume(mesh.points, triangulate(mesh));

/** Every directed edge of every face loop has its reverse in another face: closed and consistently oriented. */
function openEdges(mesh: Mesh): string[] {
  const edges = new Map<string, number>();
  for (const face of mesh.faces) {
    for (const loop of [face.outer, ...face.voids]) {
      loop.forEach((a, i) => {
        const key = `${a}>${loop[(i + 1) % loop.length]}`;
        edges.set(key, (edges.get(key) ?? 0) + 1);
      });
    }
  }
  return [...edges.keys()].filter((key) => {
    const [a, b] = key.split('>');
    return edges.get(`${b}>${a}`) !== 1 || edges.get(key) !== 1;
  });
}

const shoelace_mm2 = (polygon: readonly Point2[]): number =>
  polygon.reduce((sum, p, i) => sum + p[0] * polygon[(i + 1) % polygon.length][1] - polygon[(i + 1) % polygon.length][0] * p[1], 0) / 2;

function polygonsOf(section: Parameters<typeof sectionLoops>[0], chords: number): { outer: Point2[]; voids: Point2[][] } {
  const loops = sectionLoops(section);
  return { outer: chordedLoop(loops.outer, chords), voids: loops.voids.map((loop) => chordedLoop(loop, chords)) };
}

const iArea_mm2 = (d: IDimensions): number =>
  2 * d.topFlange.width_mm * d.topFlange.thickness_mm + (d.depth_mm - 2 * d.topFlange.thickness_mm) * d.webThickness_mm + (4 - Math.PI) * d.topFlange.filletRadius_mm ** 2;

describe('section loops', () => {
  it('give the HE 360 A its table area when the fillets are drawn finely', () => {
    const hea360 = REAL_EXPORT_SECTIONS['brep-i'].expected.dimensions as IDimensions;
    expect(iArea_mm2(hea360) / 100).toBeCloseTo(142.8, 1); // EN 10365, HE 360 A: 142.8 cm² (from memory)
    expect(shoelace_mm2(polygonsOf(hea360, 256).outer)).toBeCloseTo(iArea_mm2(hea360), 0);
  });

  it('run outer loops counter-clockwise and voids clockwise', () => {
    for (const path of ['brep-box', 'outline-rounded-rhs', 'circle-hollow'] as const) {
      const { writing } = REAL_EXPORT_SECTIONS[path];
      if (writing.kind === 'tapered') throw new Error('not a swept section');
      const polygons = polygonsOf(writing.section, 4);
      expect(shoelace_mm2(polygons.outer)).toBeGreaterThan(0);
      expect(shoelace_mm2(polygons.voids[0])).toBeLessThan(0);
    }
  });
});

describe('solid meshes', () => {
  const ipe270 = REAL_EXPORT_SECTIONS['brep-i-coped'].expected.dimensions as IDimensions;

  it('sweep a hollow section into a closed shell of area × length', () => {
    const { writing } = REAL_EXPORT_SECTIONS['brep-box'];
    if (writing.kind !== 'body') throw new Error('not a body path');
    const section = polygonsOf(writing.section, 3);
    const mesh = prismMesh(section, 6000);
    expect(openEdges(mesh)).toEqual([]);
    const area_mm2 = shoelace_mm2(section.outer) + shoelace_mm2(section.voids[0]);
    expect(volume_mm3(mesh)).toBeCloseTo(area_mm2 * 6000, 0);
  });

  it('cope an I-beam end: closed, and the volume lost is the section above the cut over the cope length', () => {
    const outer = polygonsOf(ipe270, 3).outer;
    const cut_mm = ipe270.depth_mm / 2 - 40;
    const mesh = copedMesh(outer, 6000, 120, cut_mm);
    expect(openEdges(mesh)).toEqual([]);
    // The cut lies in the straight web (95 mm up, below h/2 − tf − r = 109.8 mm) and the I is symmetric: the part above
    // it is half the section less the web between the centre line and the cut.
    const above_mm2 = shoelace_mm2(outer) / 2 - cut_mm * ipe270.webThickness_mm;
    expect(volume_mm3(mesh)).toBeCloseTo(shoelace_mm2(outer) * 6000 - above_mm2 * 120, -1);
  });

  it('loft a tapered I between two depths with the mean-depth volume (plane faces, area linear in depth)', () => {
    const deep = polygonsOf({ ...ipe270, depth_mm: 400 }, 3);
    const shallow = polygonsOf(ipe270, 3);
    const mesh = loftMesh(deep, shallow, 5000);
    expect(openEdges(mesh)).toEqual([]);
    expect(volume_mm3(mesh)).toBeCloseTo(((shoelace_mm2(deep.outer) + shoelace_mm2(shallow.outer)) / 2) * 5000, -1);
  });
});
