/**
 * Body items read as faces: the brep, surface-model and face-set forms of ISO 16739 (IFC4 attribute orders as
 * web-ifc's ifc-schema.d.ts spells them), on invented bodies written in the spec.
 */
import { type BodyFaces, readBodyFaces } from './body-faces';
import { cutMemberBody } from './body-cut';
import { boxOutline, type Outline2, prismFaceLoops, prismPolygonalFaceSet, prismTriangulatedFaceSet, StepWriter, stepFaces } from './body-step';
import { fromColumns } from './matrix4';
import { openModel, type OpenedModel } from './open-model';
import { StepLines } from './step-lines';

/** Corners of a 100 × 50 × 1000 block, and its faces as corner loops (outward). */
const CORNERS = [
  [0, 0, 0],
  [100, 0, 0],
  [100, 50, 0],
  [0, 50, 0],
  [0, 0, 1000],
  [100, 0, 1000],
  [100, 50, 1000],
  [0, 50, 1000],
];
const BLOCK_FACES = [
  [3, 2, 1, 0],
  [4, 5, 6, 7],
  [0, 1, 5, 4],
  [1, 2, 6, 5],
  [2, 3, 7, 6],
  [3, 0, 4, 7],
];

/**
 * The block as an IfcAdvancedBrep: planar IfcAdvancedFace bounded by IfcEdgeLoop of IfcOrientedEdge over IfcEdgeCurve,
 * each edge stored once from its lower to its higher corner, so half the oriented edges run against it.
 * `surface` and `edgeCurve` replace the plane of the first face and the geometry of the first edge.
 */
function advancedBlock(w: StepWriter, surface?: string, edgeCurve?: string): number {
  const points = CORNERS.map((c) => w.add(`IFCCARTESIANPOINT((${c.map((v) => `${v}.`).join(',')}))`));
  const vertices = points.map((p) => w.add(`IFCVERTEXPOINT(#${p})`));
  const edges = new Map<string, number>();
  const edge = (a: number, b: number): string => {
    const [low, high] = a < b ? [a, b] : [b, a];
    const key = `${low}-${high}`;
    if (!edges.has(key)) {
      const geometry = edges.size === 0 && edgeCurve ? w.add(edgeCurve) : w.add(`IFCPOLYLINE((#${points[low]},#${points[high]}))`);
      edges.set(key, w.add(`IFCEDGECURVE(#${vertices[low]},#${vertices[high]},#${geometry},.T.)`));
    }
    return `#${w.add(`IFCORIENTEDEDGE(*,*,#${edges.get(key)},${a < b ? '.T.' : '.F.'})`)}`;
  };
  const faces = BLOCK_FACES.map((loop, f) => {
    const oriented = loop.map((a, i) => edge(a, loop[(i + 1) % loop.length]));
    const bound = w.add(`IFCFACEOUTERBOUND(#${w.add(`IFCEDGELOOP((${oriented.join(',')}))`)},.T.)`);
    const plane = f === 0 && surface ? w.add(surface) : w.add('IFCPLANE(#11)');
    return `#${w.add(`IFCADVANCEDFACE((#${bound}),#${plane},.T.)`)}`;
  });
  return w.add(`IFCADVANCEDBREP(#${w.add(`IFCCLOSEDSHELL((${faces.join(',')}))`)})`);
}

/** The corner loops of a read face set, as lists of [x, y, z]. */
function faceLoops(faces: BodyFaces): number[][][][] {
  const out: number[][][][] = [];
  for (let f = 0; f + 1 < faces.faceStarts.length; f++) {
    const loops: number[][][] = [];
    for (let l = faces.faceStarts[f]; l < faces.faceStarts[f + 1]; l++) {
      const loop: number[][] = [];
      for (let k = faces.loopStarts[l]; k < faces.loopStarts[l + 1]; k++) {
        const v = 3 * faces.loopVertices[k];
        loop.push([faces.positions[v], faces.positions[v + 1], faces.positions[v + 2]]);
      }
      loops.push(loop);
    }
    out.push(loops);
  }
  return out;
}

const rectangle = (depth: number, width: number): Outline2 => {
  const outline = boxOutline(depth, width, 1);
  return { outer: outline.outer, voids: [] };
};

describe('readBodyFaces', () => {
  let opened: OpenedModel;
  let lines: StepLines;
  const ids: Record<string, number> = {};
  const box = boxOutline(200, 100, 10);

  beforeAll(async () => {
    const w = new StepWriter();
    ids.advanced = advancedBlock(w);
    ids.advancedCurvedFace = advancedBlock(w, 'IFCCYLINDRICALSURFACE(#11,25.)');
    ids.advancedCurvedEdge = advancedBlock(w, undefined, 'IFCCIRCLE(#11,25.)');
    ids.polygonal = prismPolygonalFaceSet(w, box, 1000);
    ids.triangulated = prismTriangulatedFaceSet(w, box, 1000);
    const sides = stepFaces(w, prismFaceLoops(box, 1000)).map((f) => `#${f}`);
    ids.faceBased = w.add(`IFCFACEBASEDSURFACEMODEL((#${w.add(`IFCCONNECTEDFACESET((${sides.join(',')}))`)}))`);
    ids.union = w.add(`IFCBOOLEANRESULT(.UNION.,#${ids.polygonal},#${ids.triangulated})`);
    ids.differenceOfSolid = w.add(`IFCBOOLEANRESULT(.DIFFERENCE.,#${ids.polygonal},#${ids.triangulated})`);
    // A 200 × 100 block of 1000 with a closed 100 × 40 cavity from 100 to 900 (IfcFacetedBrepWithVoids: Outer, Voids).
    const solid = (outline: Outline2, length: number, z: number): string =>
      `#${w.add(`IFCCLOSEDSHELL((${stepFaces(w, prismFaceLoops(outline, length, { place: fromColumns([1, 0, 0], [0, 1, 0], [0, 0, 1], [0, 0, z]) })).map((f) => `#${f}`).join(',')}))`)}`;
    ids.withVoids = w.add(`IFCFACETEDBREPWITHVOIDS(${solid(rectangle(100, 200), 1000, 0)},(${solid(rectangle(40, 100), 800, 100)}))`);
    ids.badIndex = w.add(`IFCTRIANGULATEDFACESET(#${w.add('IFCCARTESIANPOINTLIST3D(((0.,0.,0.),(1.,0.,0.),(0.,1.,0.)))')},$,.T.,((1,2,4)),$)`);
    opened = await openModel(w.file());
    lines = new StepLines(opened.api, opened.modelId, opened.text);
  });
  afterAll(() => opened.close());

  it('reads the planar faces of an IfcAdvancedBrep through oriented edges, each loop in its own order', () => {
    const reading = readBodyFaces(lines, ids.advanced, undefined);
    if (reading.status !== 'read') throw new Error(reading.reason);
    expect(reading.ifcType).toBe('IfcAdvancedBrep');
    expect(faceLoops(reading.faces)).toEqual(BLOCK_FACES.map((loop) => [loop.map((c) => CORNERS[c])]));
  });

  it('cuts an IfcAdvancedBrep with planar faces into its rectangle', () => {
    const cut = cutMemberBody(lines, [{ itemId: ids.advanced, type: 0, transform: undefined }], { scaleToMm: 1 });
    if (cut.status !== 'cut') throw new Error(cut.reason);
    expect(cut.polygon.voids).toEqual([]);
    expect(cut.polygon.outer.map(([x, y]) => [Math.abs(x), Math.abs(y)])).toEqual(Array(4).fill([50, 25]));
  });

  it('cuts an IfcFacetedBrepWithVoids through its cavity: the cavity is a void of the section', () => {
    const cut = cutMemberBody(lines, [{ itemId: ids.withVoids, type: 0, transform: undefined }], { scaleToMm: 1 });
    if (cut.status !== 'cut') throw new Error(cut.reason);
    expect(cut.ifcType).toBe('IfcFacetedBrepWithVoids');
    expect(cut.polygon.voids).toHaveLength(1);
    // 200 × 100 less 100 × 40 (the frame's u is x, v is y for a member along z).
    expect(cut.polygon.voids[0].map(([x, y]) => [Math.abs(x), Math.abs(y)])).toEqual(Array(4).fill([50, 20]));
  });

  it('applies the mapping transform to every point', () => {
    const reading = readBodyFaces(lines, ids.advanced, fromColumns([0, 1, 0], [-1, 0, 0], [0, 0, 1], [10, 20, 30]));
    if (reading.status !== 'read') throw new Error(reading.reason);
    // (x, y, z) → (10 − y, 20 + x, 30 + z)
    expect(faceLoops(reading.faces)[0][0]).toEqual([3, 2, 1, 0].map((c) => [10 - CORNERS[c][1], 20 + CORNERS[c][0], 30 + CORNERS[c][2]]));
  });

  it('reads a body that several mappings place once, and moves its points for each mapping', () => {
    const turned = fromColumns([0, 1, 0], [-1, 0, 0], [0, 0, 1], [10, 20, 30]);
    const shifted = fromColumns([1, 0, 0], [0, 1, 0], [0, 0, 1], [-5, 0, 7]);
    const first = readBodyFaces(lines, ids.advanced, turned);
    const second = readBodyFaces(lines, ids.advanced, shifted);
    const again = readBodyFaces(lines, ids.advanced, turned);
    if (first.status !== 'read' || second.status !== 'read' || again.status !== 'read') throw new Error('not read');
    expect(second.faces.loopVertices).toBe(first.faces.loopVertices);
    expect(faceLoops(second.faces)[0][0]).toEqual([3, 2, 1, 0].map((c) => [CORNERS[c][0] - 5, CORNERS[c][1], CORNERS[c][2] + 7]));
    expect(faceLoops(again.faces)).toEqual(faceLoops(first.faces));
  });

  it('reads a polygonal face set with voids in its caps and a triangulated set through PnIndex', () => {
    const polygonal = readBodyFaces(lines, ids.polygonal, undefined);
    const triangulated = readBodyFaces(lines, ids.triangulated, undefined);
    if (polygonal.status !== 'read' || triangulated.status !== 'read') throw new Error('not read');
    // Two caps of two loops each, and one quad per outline edge (4 outer, 4 inner).
    expect(faceLoops(polygonal.faces).map((f) => f.length)).toEqual([2, 2, ...Array(8).fill(1)]);
    expect(faceLoops(polygonal.faces)[2]).toEqual([[[-50, -100, 0], [50, -100, 0], [50, -100, 1000], [-50, -100, 1000]]]);
    // Fans of two triangles per cap (outer loop only), and two per side quad.
    const triangles = faceLoops(triangulated.faces);
    expect(triangles).toHaveLength(4 + 16);
    expect(triangles[4]).toEqual([[[-50, -100, 0], [50, -100, 0], [50, -100, 1000]]]);
  });

  it('reads an IfcFaceBasedSurfaceModel of connected face sets: both caps with their holes, and the sides', () => {
    const reading = readBodyFaces(lines, ids.faceBased, undefined);
    if (reading.status !== 'read') throw new Error(reading.reason);
    expect(reading.ifcType).toBe('IfcFaceBasedSurfaceModel');
    expect(faceLoops(reading.faces).map((f) => f.length)).toEqual([2, 2, ...Array(8).fill(1)]);
  });

  it.each([
    ['a curved face', 'advancedCurvedFace', 'Its body (IfcAdvancedBrep) cannot be read as faces: it has curved faces (IfcCylindricalSurface).'],
    ['a curved edge', 'advancedCurvedEdge', 'Its body (IfcAdvancedBrep) cannot be read as faces: it has curved edges (IfcCircle).'],
    ['a boolean union', 'union', 'Its body (IfcBooleanResult) cannot be read as faces: it is a boolean union.'],
    [
      'a difference with a solid',
      'differenceOfSolid',
      'Its body (IfcBooleanResult) cannot be read as faces: it subtracts IfcTriangulatedFaceSet, whose extent is not read.',
    ],
    ['an index beyond the point list', 'badIndex', 'Its body (IfcTriangulatedFaceSet) cannot be read as faces: a face refers to a coordinate index beyond the point list.'],
  ])('gives a plain reason for %s', (_, name, reason) => {
    expect(readBodyFaces(lines, ids[name], undefined)).toEqual({ status: 'failed', reason });
  });
});

