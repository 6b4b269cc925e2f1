/**
 * Cuts of bodies written only as faces, compared with the outline each body was extruded from (server/ifc/body-step.ts
 * writes them; invented members). Polygon area and second moment by the shoelace and polygon-moment formulas (common
 * practice, no source); IPE 300 against EN 10365 (from memory).
 */
import type { SectionPolygon } from '../engine/section-family';
import { type BodyCut, cutMemberBody, type BodyItem } from './body-cut';
import {
  boxOutline,
  channelOutline,
  iOutline,
  type Outline2,
  prismBrep,
  prismPolygonalFaceSet,
  prismTriangulatedFaceSet,
  productShape,
  StepWriter,
} from './body-step';
import { openModel, type OpenedModel } from './open-model';
import { ShapeReader } from './shape-reader';
import { StepLines } from './step-lines';

/** Area, centroid and second moments about the centroid of loops (outer CCW, voids CW): polygon-moment formulas (common practice, no source). */
function polygonProperties(loops: readonly (readonly (readonly number[])[])[]): { area: number; cx: number; cy: number; ixx: number; iyy: number } {
  let [a, sx, sy, sxx, syy] = [0, 0, 0, 0, 0];
  for (const loop of loops) {
    for (let i = 0, j = loop.length - 1; i < loop.length; j = i++) {
      const [x0, y0] = loop[j];
      const [x1, y1] = loop[i];
      const c = x0 * y1 - x1 * y0;
      a += c / 2;
      sx += ((x0 + x1) * c) / 6;
      sy += ((y0 + y1) * c) / 6;
      sxx += ((y0 * y0 + y0 * y1 + y1 * y1) * c) / 12;
      syy += ((x0 * x0 + x0 * x1 + x1 * x1) * c) / 12;
    }
  }
  const [cx, cy] = [sx / a, sy / a];
  return { area: a, cx, cy, ixx: sxx - a * cy * cy, iyy: syy - a * cx * cx };
}

const outlineProperties = (o: Outline2): ReturnType<typeof polygonProperties> => polygonProperties([o.outer, ...o.voids]);
const cutProperties = (p: SectionPolygon): ReturnType<typeof polygonProperties> => polygonProperties([p.outer, ...p.voids]);

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
  expect(polygonProperties([cut.polygon.outer]).area).toBeGreaterThan(0);
  for (const v of cut.polygon.voids) expect(polygonProperties([v]).area).toBeLessThan(0);
  return cut.polygon;
}

// IPE 300 (EN 10365, from memory): h 300, b 150, tw 7.1, tf 10.7, r 15 mm; 16 chords per fillet.
const IPE300 = iOutline(300, 150, 7.1, 10.7, 15, 16);
// A parallel-flange channel and a hollow box (invented sizes).
const CHANNEL = channelOutline(200, 80, 6, 11);
const BOX = boxOutline(200, 100, 8);

describe('cutMemberBody', () => {
  let opened: OpenedModel;
  let lines: StepLines;
  let shapes: ShapeReader;
  const ids: Record<string, number> = {};

  beforeAll(async () => {
    const w = new StepWriter();
    ids.ipeBrep = productShape(w, [prismBrep(w, IPE300, 4000)]);
    ids.channelBrep = productShape(w, [prismBrep(w, CHANNEL, 3000)]);
    ids.boxBrep = productShape(w, [prismBrep(w, BOX, 2500)]);
    ids.ipePolygonal = productShape(w, [prismPolygonalFaceSet(w, IPE300, 4000)]);
    ids.boxPolygonal = productShape(w, [prismPolygonalFaceSet(w, BOX, 2500)]);
    ids.channelTriangulated = productShape(w, [prismTriangulatedFaceSet(w, CHANNEL, 3000)]);
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
});
