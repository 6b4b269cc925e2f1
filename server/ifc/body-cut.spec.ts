/**
 * Cuts of bodies written only as faces, compared with the outline each body was extruded from (server/ifc/body-step.ts
 * writes them; invented members). Polygon area and second moment by the shoelace and polygon-moment formulas (common
 * practice, no source); IPE 300 against EN 10365 (from memory).
 */
import type { Point2_mm, SectionPolygon } from '../engine/section-family';
import { polygonProperties, signedArea_mm2 } from '../engine/section-polygon';
import { type BodyCut, cutMemberBody, type BodyItem } from './body-cut';
import {
  boxOutline,
  channelOutline,
  clipped,
  facetedBrep,
  iOutline,
  mappedItem,
  type Outline2,
  prismBrep,
  prismFaceLoops,
  prismPolygonalFaceSet,
  prismTriangulatedFaceSet,
  productShape,
  StepWriter,
} from './body-step';
import { cross, fromColumns, normalize, type Vec3 } from './matrix4';
import { openModel, type OpenedModel } from './open-model';
import { ShapeReader } from './shape-reader';
import { StepLines } from './step-lines';

/** Area, centroid and second moments about the centroid by the polygon-moment formulas (common practice, no source). */
function properties(outer: readonly Point2_mm[], voids: readonly Point2_mm[][]): { area: number; cx: number; cy: number; ixx: number; iyy: number } {
  const p = polygonProperties({ outer: [...outer], voids: voids.map((v) => [...v]) });
  return { area: p.area_mm2, cx: p.centroid_mm[0], cy: p.centroid_mm[1], ixx: p.ix_mm4, iyy: p.iy_mm4 };
}

const outlineProperties = (o: Outline2): ReturnType<typeof properties> => properties(o.outer, o.voids);
const cutProperties = (p: SectionPolygon): ReturnType<typeof properties> => properties(p.outer, p.voids);

function bounds(loop: readonly (readonly number[])[]): { width: number; depth: number } {
  const xs = loop.map((p) => p[0]);
  const ys = loop.map((p) => p[1]);
  return { width: Math.max(...xs) - Math.min(...xs), depth: Math.max(...ys) - Math.min(...ys) };
}

function expectWithin(actual: number, expected: number, fraction: number): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(Math.abs(expected) * fraction);
}

/** The cut matches the outline: extents within 0.01 %, area and second moments within 0.5 % (the tolerances). */
function expectSameSection(cut: BodyCut, outline: Outline2, scaleToMm = 1): SectionPolygon {
  if (cut.status !== 'cut') throw new Error(`not cut: ${cut.reason}`);
  const source = outlineProperties(outline);
  const actual = cutProperties(cut.polygon);
  const s2 = scaleToMm ** 2;
  expectWithin(bounds(cut.polygon.outer).depth, bounds(outline.outer).depth * scaleToMm, 1e-4);
  expectWithin(bounds(cut.polygon.outer).width, bounds(outline.outer).width * scaleToMm, 1e-4);
  expectWithin(actual.area, source.area * s2, 5e-3);
  expectWithin(actual.ixx, source.ixx * s2 * s2, 5e-3);
  expectWithin(actual.iyy, source.iyy * s2 * s2, 5e-3);
  expect(cut.polygon.voids).toHaveLength(outline.voids.length);
  // Centroid at the frame origin; outer counter-clockwise, voids clockwise.
  expect(Math.abs(actual.cx) + Math.abs(actual.cy)).toBeLessThan(1e-6 * bounds(outline.outer).depth * scaleToMm);
  expect(signedArea_mm2(cut.polygon.outer)).toBeGreaterThan(0);
  for (const v of cut.polygon.voids) expect(signedArea_mm2(v)).toBeLessThan(0);
  return cut.polygon;
}

// IPE 300 (EN 10365, from memory): h 300, b 150, tw 7.1, tf 10.7, r 15 mm; 16 chords per fillet.
const IPE300 = iOutline(300, 150, 7.1, 10.7, 15, 16);
// A parallel-flange channel and a hollow box (invented sizes).
const CHANNEL = channelOutline(200, 80, 6, 11);
const BOX = boxOutline(200, 100, 8);
// The IPE 300 with its top flange and upper web coped away (no fillets at the cope; invented).
const COPED: Outline2 = {
  outer: [
    [-75, -150],
    [75, -150],
    [75, -139.3],
    [3.55, -139.3],
    [3.55, 90],
    [-3.55, 90],
    [-3.55, -139.3],
    [-75, -139.3],
  ],
  voids: [],
};
const END_PLATE = boxOutline(340, 180, 0);
END_PLATE.voids = [];

/** A right-handed frame whose z is `w` and whose y is the part of +Z at right angles to it (what the cut calls v). */
function memberAxes(w: Vec3): [Vec3, Vec3, Vec3] {
  const z = normalize(w)!;
  const y = normalize([-z[0] * z[2], -z[1] * z[2], 1 - z[2] * z[2]])!;
  return [cross(y, z), y, z];
}
const SKEWED = memberAxes([Math.cos(Math.PI / 6), Math.sin(Math.PI / 6), 0]);
const BRACE = memberAxes([1, 1, 1]);
const translated = (z: number): ReturnType<typeof fromColumns> => fromColumns([1, 0, 0], [0, 1, 0], [0, 0, 1], [0, 0, z]);

describe('cutMemberBody', () => {
  let opened: OpenedModel;
  let lines: StepLines;
  let shapes: ShapeReader;
  const ids: Record<string, number> = {};

  beforeAll(async () => {
    const w = new StepWriter();
    ids.ipeBrep = productShape(w, [prismBrep(w, IPE300, 4000)]);
    ids.ipeBrepAgain = productShape(w, [prismBrep(w, IPE300, 4000)]);
    ids.ipeBrepLonger = productShape(w, [prismBrep(w, IPE300, 4100)]);
    ids.channelBrep = productShape(w, [prismBrep(w, CHANNEL, 3000)]);
    ids.boxBrep = productShape(w, [prismBrep(w, BOX, 2500)]);
    ids.ipePolygonal = productShape(w, [prismPolygonalFaceSet(w, IPE300, 4000)]);
    ids.boxPolygonal = productShape(w, [prismPolygonalFaceSet(w, BOX, 2500)]);
    ids.channelTriangulated = productShape(w, [prismTriangulatedFaceSet(w, CHANNEL, 3000)]);
    ids.skewedMapped = productShape(w, [mappedItem(w, [prismBrep(w, IPE300, 5000)], SKEWED, [12000, -3000, 4500])]);
    ids.braceMappedTriangulated = productShape(w, [mappedItem(w, [prismTriangulatedFaceSet(w, CHANNEL, 4000)], BRACE, [500, 500, 0])]);
    ids.bracePlaced = productShape(w, [prismBrep(w, BOX, 4000, { place: fromColumns(...BRACE, [-200, 300, 3600]) })]);
    ids.copedWithPlate = productShape(w, [
      facetedBrep(w, [
        ...prismFaceLoops(COPED, 500),
        ...prismFaceLoops(IPE300, 1500, { place: translated(500) }),
        ...prismFaceLoops(END_PLATE, 20, { place: translated(2000) }),
      ]),
    ]);
    // Two boxes end to end, meeting at mid-length: their end faces lie on the 50 % station's plane.
    ids.splitAtMiddle = productShape(w, [
      facetedBrep(w, [...prismFaceLoops(BOX, 1000), ...prismFaceLoops(BOX, 1000, { place: translated(1000) })]),
    ]);
    ids.mitredEnd = productShape(w, [clipped(w, prismBrep(w, IPE300, 3000), [0, 0, 2900], [0, 0.3, 1])]);
    ids.clippedAlong = productShape(w, [clipped(w, prismBrep(w, IPE300, 3000), [0, 140, 0], [0, 1, 0])]);
    ids.openShell = productShape(w, [facetedBrep(w, prismFaceLoops(CHANNEL, 3000).slice(0, -1), true)]);
    ids.twoSolids = productShape(w, [
      facetedBrep(w, [...prismFaceLoops(BOX, 3000), ...prismFaceLoops(BOX, 3000, { place: fromColumns([1, 0, 0], [0, 1, 0], [0, 0, 1], [300, 0, 0]) })]),
    ]);
    ids.tapered = productShape(w, [prismBrep(w, IPE300, 3000, { topScale: 0.7 })]);
    ids.flat = productShape(w, [prismBrep(w, CHANNEL, 0)]);
    ids.stub = productShape(w, [prismBrep(w, BOX, 250)]);
    opened = await openModel(w.file());
    lines = new StepLines(opened.api, opened.modelId, opened.text);
    shapes = new ShapeReader(lines, 1);
  });
  afterAll(() => opened.close());

  const items = (name: string): BodyItem[] => shapes.read(ids[name]).bodyItems;

  it.each([
    ['an IPE 300 faceted brep', 'ipeBrep', IPE300],
    ['a channel faceted brep', 'channelBrep', CHANNEL],
    ['a box faceted brep with its void', 'boxBrep', BOX],
    ['an IPE 300 polygonal face set', 'ipePolygonal', IPE300],
    ['a box polygonal face set with voids in its caps', 'boxPolygonal', BOX],
    ['a channel triangulated face set read through PnIndex', 'channelTriangulated', CHANNEL],
  ])('cuts %s into the outline it was extruded from', (_, name, outline) => {
    const cut = cutMemberBody(lines, items(name), { scaleToMm: 1 });
    expectSameSection(cut, outline);
    expect(cut).toMatchObject({ stations: [0.2, 0.35, 0.5, 0.65, 0.8] });
  });

  it('cuts a body equal to one already cut only once: the second member gets the same cut, a longer one its own', () => {
    const first = cutMemberBody(lines, items('ipeBrep'), { scaleToMm: 1 });
    const again = cutMemberBody(lines, items('ipeBrepAgain'), { scaleToMm: 1 });
    const longer = cutMemberBody(lines, items('ipeBrepLonger'), { scaleToMm: 1 });
    const scaled = cutMemberBody(lines, items('ipeBrepAgain'), { scaleToMm: 2 });
    expect(again).toBe(first);
    expect(longer).not.toBe(first);
    expect(longer).toMatchObject({ status: 'cut', axis: { length: 4100 } });
    expectSameSection(longer, IPE300);
    expectSameSection(scaled, IPE300, 2);
  });

  it('gives IPE 300 its table area and second moments (EN 10365, from memory: A 53.81 cm², Iy 8356 cm⁴, Iz 603.8 cm⁴)', () => {
    const cut = cutMemberBody(lines, items('ipeBrep'), { scaleToMm: 1 });
    if (cut.status !== 'cut') throw new Error(cut.reason);
    const p = cutProperties(cut.polygon);
    expectWithin(p.area / 100, 53.81, 5e-3);
    expectWithin(p.ixx / 1e4, 8356, 5e-3);
    expectWithin(p.iyy / 1e4, 603.8, 5e-3);
  });

  it('keeps every corner of the outline, and adds none', () => {
    const cut = cutMemberBody(lines, items('ipeBrep'), { scaleToMm: 1 });
    const polygon = expectSameSection(cut, IPE300);
    expect(polygon.outer).toHaveLength(IPE300.outer.length);
    for (const [x, y] of IPE300.outer) {
      expect(polygon.outer.some(([u, v]) => Math.hypot(u - x, v - y) < 1e-6)).toBe(true);
    }
  });

  it('measures the axis along the body through the centroid, element coordinates', () => {
    const cut = cutMemberBody(lines, items('channelBrep'), { scaleToMm: 1 });
    if (cut.status !== 'cut') throw new Error(cut.reason);
    const c = outlineProperties(CHANNEL);
    expect(cut.axis.length).toBeCloseTo(3000, 6);
    expect(cut.frame.w).toEqual([0, 0, 1]);
    // Along +Z the member is vertical: v is the element's +Y, u = v × w is +X.
    expect(cut.frame.v[1]).toBeCloseTo(1, 12);
    expect(cut.frame.u[0]).toBeCloseTo(1, 12);
    cut.axis.start.forEach((value, k) => expect(value).toBeCloseTo([c.cx, c.cy, 0][k], 6));
    cut.axis.end.forEach((value, k) => expect(value).toBeCloseTo([c.cx, c.cy, 3000][k], 6));
    expect(cut.ifcType).toBe('IfcFacetedBrep');
  });

  it('scales model units to millimetres', () => {
    expectSameSection(cutMemberBody(lines, items('boxBrep'), { scaleToMm: 1000 }), BOX, 1000);
  });

  it.each([
    ['a horizontal member skewed in plan, placed by a mapped item', 'skewedMapped', IPE300, SKEWED, 5000],
    ['a sloping brace of triangles, placed by a mapped item', 'braceMappedTriangulated', CHANNEL, BRACE, 4000],
    ['a sloping brace written in place', 'bracePlaced', BOX, BRACE, 4000],
  ])('cuts %s, finding its axis from the body alone', (_, name, outline, axes, length) => {
    const cut = cutMemberBody(lines, items(name), { scaleToMm: 1 });
    expectSameSection(cut, outline);
    if (cut.status !== 'cut') return;
    expect(cut.axis.length).toBeCloseTo(length, 6);
    // The body's direction has no sense of its own; both found axes are the member's, up to sign.
    expect(Math.abs(cut.frame.w.reduce((sum, c, k) => sum + c * axes[2][k], 0))).toBeCloseTo(1, 12);
    cut.frame.v.forEach((c, k) => expect(c).toBeCloseTo(axes[1][k], 12));
  });

  it('takes the member axis when given, and measures the body along it', () => {
    const [x, y, z] = SKEWED;
    const start: Vec3 = [12000, -3000, 4500];
    const end: Vec3 = [start[0] + 5000 * z[0], start[1] + 5000 * z[1], start[2]];
    const cut = cutMemberBody(lines, items('skewedMapped'), { scaleToMm: 1, axis: { start, end } });
    expectSameSection(cut, IPE300);
    if (cut.status !== 'cut') return;
    cut.frame.w.forEach((c, k) => expect(c).toBeCloseTo(z[k], 12));
    cut.frame.u.forEach((c, k) => expect(c).toBeCloseTo(x[k], 12));
    cut.frame.v.forEach((c, k) => expect(c).toBeCloseTo(y[k], 12));
    // The IPE is doubly symmetric: its centroid is the profile origin, on the axis.
    cut.axis.start.forEach((c, k) => expect(c).toBeCloseTo(start[k], 6));
    cut.axis.end.forEach((c, k) => expect(c).toBeCloseTo(end[k], 6));
  });

  it('orients a column along the element Z by the element +Y, axis given', () => {
    const cut = cutMemberBody(lines, items('boxBrep'), { scaleToMm: 1, axis: { start: [0, 0, 0], end: [0, 0, 2500] } });
    const polygon = expectSameSection(cut, BOX);
    // The box is 100 wide along x and 200 deep along y.
    expect(bounds(polygon.outer)).toEqual({ width: 100, depth: 200 });
  });

  it('keeps the section the middle stations share, past a coped end and an end plate', () => {
    const cut = cutMemberBody(lines, items('copedWithPlate'), { scaleToMm: 1 });
    expectSameSection(cut, IPE300);
    expect(cut).toMatchObject({ status: 'cut', stations: [0.35, 0.5, 0.65, 0.8], axis: { length: 2020 } });
  });

  it('moves a plane off the vertices lying on it (two bodies meeting at a station)', () => {
    const cut = cutMemberBody(lines, items('splitAtMiddle'), { scaleToMm: 1 });
    expectSameSection(cut, BOX);
    expect(cut).toMatchObject({ stations: [0.2, 0.35, 0.5, 0.65, 0.8], axis: { length: 2000 } });
  });

  it('cuts through a clipped end that the stations do not reach', () => {
    const cut = cutMemberBody(lines, items('mitredEnd'), { scaleToMm: 1 });
    expectSameSection(cut, IPE300);
    expect(cut).toMatchObject({ stations: [0.2, 0.35, 0.5, 0.65, 0.8], ifcType: 'IfcFacetedBrep' });
  });

  it.each([
    // notOneSection: the geometry shows it is not one member's section, so no name may stand in for it.
    ['a clipping along the whole length', 'clippedAlong', /gives no section: a clipping of the body removes material there/, false],
    ['an open shell', 'openShell', /the cut does not close: the body is an open surface/, false],
    ['two solids in one body', 'twoSolids', /the cut gives 2 separate pieces/, true],
    ['a tapered body', 'tapered', /^The section varies along the member\.$/, true],
    ['a flat body', 'flat', /^Its body \(IfcFacetedBrep\) is flat: it has no thickness across the member\.$/, false],
    ['a stub shorter than 1.5 times its depth, without an axis', 'stub', /too short for its axis to be found: 250 long, 200 across/, false],
  ])('refuses %s with a reason', (_, name, reason, notOneSection) => {
    const cut = cutMemberBody(lines, items(name), { scaleToMm: 1 });
    expect(cut).toEqual({ status: 'failed', reason: expect.stringMatching(reason), ...(notOneSection ? { notOneSection: true } : {}) });
    expect(JSON.stringify(cut)).not.toMatch(/NaN|undefined|Infinity/);
  });

  it('refuses a zero-length body with an axis, an empty item list and a body it cannot read', () => {
    expect(cutMemberBody(lines, items('flat'), { scaleToMm: 1, axis: { start: [0, 0, 0], end: [0, 0, 1000] } })).toEqual({
      status: 'failed',
      reason: 'Its body (IfcFacetedBrep) has no length along the member.',
    });
    expect(cutMemberBody(lines, items('flat'), { scaleToMm: 1, axis: { start: [1, 2, 3], end: [1, 2, 3] } })).toEqual({ status: 'failed', reason: 'Its Axis has no length.' });
    expect(cutMemberBody(lines, [], { scaleToMm: 1 })).toEqual({ status: 'failed', reason: 'The member has no body to cut.' });
    expect(cutMemberBody(lines, [{ itemId: 12, type: 0, transform: undefined }], { scaleToMm: 1 })).toEqual({
      status: 'failed',
      reason: 'Its body is IfcCartesianPoint, which is not read as faces.',
    });
  });
});

