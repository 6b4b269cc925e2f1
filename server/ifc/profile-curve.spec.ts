/**
 * Profile curves read from hand-written STEP instances (invented shapes; expected values from closed-form geometry,
 * written beside each check).
 */
import type { Point2_mm } from '../engine/section-family';
import { type CurveLoop, oriented, pathLoop, readClosedPath, signedDoubleArea_mm2 } from './profile-curve';
import { openStepLines, type TestModel } from './test-step-lines';

const MM = { scaleToMm: 1, radiansPerAngleUnit: 1 };

const area_mm2 = (points: readonly Point2_mm[]): number => signedDoubleArea_mm2(points) / 2;

function loopOf(model: TestModel, curveId: number, units = MM, sagitta_mm = 0.01): CurveLoop {
  const path = readClosedPath(model.lines, curveId, units);
  if (!path.ok) throw new Error(path.reason);
  return pathLoop(path.pieces, sagitta_mm);
}

describe('profile curves', () => {
  let model: TestModel;
  afterAll(() => model?.close());
  beforeAll(async () => {
    model = await openStepLines(
      'IFC4',
      `
#1= IFCCARTESIANPOINT((0.,0.));
#2= IFCCARTESIANPOINT((200.,0.));
#3= IFCCARTESIANPOINT((200.,100.));
#4= IFCCARTESIANPOINT((0.,100.));
#5= IFCPOLYLINE((#1,#2,#3,#4,#1));
#6= IFCPOLYLINE((#1,#2,#3,#4));
#10= IFCCARTESIANPOINTLIST2D(((-100.,-50.),(90.,-50.),(97.0710678,-47.0710678),(100.,-40.),(100.,40.),(97.0710678,47.0710678),(90.,50.),(-90.,50.),(-97.0710678,47.0710678),(-100.,40.),(-100.,-40.),(-97.0710678,-47.0710678),(-90.,-50.)),$);
#11= IFCINDEXEDPOLYCURVE(#10,(IFCLINEINDEX((13,1,2)),IFCARCINDEX((2,3,4)),IFCLINEINDEX((4,5)),IFCARCINDEX((5,6,7)),IFCLINEINDEX((7,8)),IFCARCINDEX((8,9,10)),IFCLINEINDEX((10,11)),IFCARCINDEX((11,12,13))),$);
#20= IFCCARTESIANPOINT((10.,20.));
#21= IFCAXIS2PLACEMENT2D(#20,$);
#22= IFCCIRCLE(#21,50.);
#23= IFCDIRECTION((0.,1.));
#24= IFCAXIS2PLACEMENT2D(#20,#23);
#25= IFCELLIPSE(#24,80.,30.);
#30= IFCCARTESIANPOINT((0.2,0.));
#31= IFCCARTESIANPOINT((0.2,0.1));
#44= IFCCARTESIANPOINT((0.,0.1));
#32= IFCPOLYLINE((#1,#30,#31,#44,#1));
#33= IFCPOLYLINE((#1,#2,#3));
#34= IFCCOMPOSITECURVESEGMENT(.CONTINUOUS.,.T.,#33);
#35= IFCCOMPOSITECURVE((#34),.F.);
#37= IFCPOLYLINE((#3,#4,#43));
#43= IFCCARTESIANPOINT((0.,0.5));
#38= IFCCOMPOSITECURVESEGMENT(.CONTINUOUS.,.T.,#37);
#39= IFCCOMPOSITECURVE((#34,#38),.F.);
#40= IFCBSPLINECURVEWITHKNOTS(2,(#1,#2,#3),.UNSPECIFIED.,.F.,.F.,(3,3),(0.,1.),.UNSPECIFIED.);
#41= IFCCOMPOSITECURVESEGMENT(.CONTINUOUS.,.T.,#40);
#42= IFCCOMPOSITECURVE((#34,#41),.F.);
`,
    );
  });

  it('reads a closed polyline rectangle 200 × 100 without repeating the closing point', () => {
    const loop = loopOf(model, 5);
    expect(loop.points).toEqual([[0, 0], [200, 0], [200, 100], [0, 100]]);
    expect(area_mm2(loop.points)).toBe(200 * 100);
    expect(loop.arcs).toEqual([]);
  });

  it('takes a polyline that does not return to its first point as open (the curve of a closed profile must close)', () => {
    expect(readClosedPath(model.lines, 6, MM)).toEqual({ ok: false, reason: 'it is open: a gap of 100 mm between its end and its start, at (0, 100) mm' });
  });

  it('scales model units to millimetres: the same rectangle written in metres', () => {
    const loop = loopOf(model, 32, { scaleToMm: 1000, radiansPerAngleUnit: 1 });
    const expected = [[0, 0], [200, 0], [200, 100], [0, 100]];
    loop.points.forEach((p, i) => expect(p.map((v, k) => v - expected[i][k]).every((d) => Math.abs(d) < 1e-9)).toBe(true));
    expect(loop.points).toHaveLength(4);
  });

  it('reads an IfcIndexedPolyCurve with IfcArcIndex corners: a 200 × 100 rounded rectangle, r = 10', () => {
    const loop = loopOf(model, 11);
    // Closed form: b·h − (4 − π)·r² (common practice, no source).
    const exact = 200 * 100 - (4 - Math.PI) * 10 * 10;
    // Chords inside convex arcs lose at most the segment areas: sagitta 0.01 mm on 4 quarter circles.
    expect(area_mm2(loop.points)).toBeLessThanOrEqual(exact);
    expect(area_mm2(loop.points)).toBeGreaterThan(exact * (1 - 1e-4));
    expect(loop.arcs).toHaveLength(4);
    expect(loop.arcs[0].centre[0]).toBeCloseTo(90, 4);
    expect(loop.arcs[0].centre[1]).toBeCloseTo(-40, 4);
    expect(loop.arcs[0].radius_mm).toBeCloseTo(10, 4);
  });

  it('reads a whole IfcCircle at its Position, every chord within the sagitta', () => {
    const sagitta_mm = 0.05;
    const loop = loopOf(model, 22, MM, sagitta_mm);
    expect(loop.arcs).toEqual([{ centre: [10, 20], radius_mm: 50 }]);
    for (const [x, y] of loop.points) expect(Math.hypot(x - 10, y - 20)).toBeCloseTo(50, 9);
    // Chord of a circle of radius r with sagitta s spans 2·acos(1 − s/r) (common practice, no source).
    const step = (2 * Math.PI) / loop.points.length;
    expect(50 * (1 - Math.cos(step / 2))).toBeLessThanOrEqual(sagitta_mm);
    expect(area_mm2(loop.points)).toBeGreaterThan(0);
  });

  it('reads a whole IfcEllipse turned by its RefDirection: semi-axis 80 along y, 30 along x', () => {
    const loop = loopOf(model, 25);
    const xs = loop.points.map((p) => p[0] - 10);
    const ys = loop.points.map((p) => p[1] - 20);
    expect(Math.max(...ys)).toBeCloseTo(80, 6);
    expect(Math.max(...xs)).toBeLessThanOrEqual(30 + 1e-9);
    expect(Math.max(...xs)).toBeGreaterThan(30 - 0.01);
    // Ellipse area π·a·b (common practice, no source); chords lose less than 0.01 %.
    expect(area_mm2(loop.points) / (Math.PI * 80 * 30)).toBeCloseTo(1, 3);
    expect(loop.arcs).toEqual([]);
  });

  it('gives a plain reason for an open curve (a missing side, a gap of 0.5 mm) and for a curve kind it does not read', () => {
    expect(readClosedPath(model.lines, 35, MM)).toEqual({
      ok: false,
      reason: 'it is open: a gap of 223.607 mm between its end and its start, at (200, 100) mm',
    });
    expect(readClosedPath(model.lines, 39, MM)).toEqual({
      ok: false,
      reason: 'it is open: a gap of 0.5 mm between its end and its start, at (0, 0.5) mm',
    });
    expect(readClosedPath(model.lines, 42, MM)).toEqual({ ok: false, reason: 'it is drawn with IfcBSplineCurveWithKnots, which is not read' });
    expect(readClosedPath(model.lines, 999, MM)).toEqual({ ok: false, reason: 'curve #999 is missing' });
  });

  it('turns a loop to the asked orientation by its signed area', () => {
    const cw: Point2_mm[] = [[0, 0], [0, 1], [1, 1], [1, 0]];
    expect(signedDoubleArea_mm2(cw)).toBe(-2);
    expect(oriented(cw, false)).toBe(cw);
    expect(oriented(cw, true)).toEqual([[1, 0], [1, 1], [0, 1], [0, 0]]);
  });
});
