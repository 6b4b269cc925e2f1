/**
 * Profiles read from hand-written STEP instances: outlines measured from their curves, parametric families read into
 * their dimensions. The shapes are invented except where a published section is named beside its values.
 */
import type { Point2_mm } from '../engine/section-family';
import { signedDoubleArea_mm2 } from './profile-curve';
import { ProfileReader, type ProfileReading } from './profile-reader';
import { openStepLines, type TestModel } from './test-step-lines';

const DEGREE = Math.PI / 180;
const area_mm2 = (points: readonly Point2_mm[]): number => signedDoubleArea_mm2(points) / 2;

function outline(reading: ProfileReading) {
  if (reading.kind !== 'outline') throw new Error(`expected an outline, got ${JSON.stringify(reading)}`);
  return reading.polygon;
}

/**
 * IPE 300 drawn as an outline, centred: h 300, b 150, tw 7.1, tf 10.7, r 15 (EN 10365, dimensions from memory).
 * Its four root fillets are written four ways: trimmed by parameter with the segment reversed (SameSense .F.), by
 * points clockwise, by point and parameter preferring the parameter, and on a circle turned by its RefDirection; one
 * web edge is a trimmed IfcLine.
 */
const IPE_300_OUTLINE = `
#101= IFCCARTESIANPOINT((-75.,-150.));
#102= IFCCARTESIANPOINT((75.,-150.));
#103= IFCCARTESIANPOINT((75.,-139.3));
#104= IFCCARTESIANPOINT((18.55,-139.3));
#105= IFCCARTESIANPOINT((3.55,-124.3));
#106= IFCCARTESIANPOINT((3.55,124.3));
#107= IFCCARTESIANPOINT((18.55,139.3));
#108= IFCCARTESIANPOINT((75.,139.3));
#109= IFCCARTESIANPOINT((75.,150.));
#110= IFCCARTESIANPOINT((-75.,150.));
#111= IFCCARTESIANPOINT((-75.,139.3));
#112= IFCCARTESIANPOINT((-18.55,139.3));
#113= IFCCARTESIANPOINT((-3.55,124.3));
#114= IFCCARTESIANPOINT((-3.55,-124.3));
#115= IFCCARTESIANPOINT((-18.55,-139.3));
#116= IFCCARTESIANPOINT((-75.,-139.3));
#120= IFCPOLYLINE((#101,#102,#103,#104));
#121= IFCCOMPOSITECURVESEGMENT(.CONTINUOUS.,.T.,#120);
#122= IFCCARTESIANPOINT((18.55,-124.3));
#123= IFCAXIS2PLACEMENT2D(#122,$);
#124= IFCCIRCLE(#123,15.);
#125= IFCTRIMMEDCURVE(#124,(IFCPARAMETERVALUE(180.)),(IFCPARAMETERVALUE(270.)),.T.,.PARAMETER.);
#126= IFCCOMPOSITECURVESEGMENT(.CONTINUOUS.,.F.,#125);
#127= IFCPOLYLINE((#105,#106));
#128= IFCCOMPOSITECURVESEGMENT(.CONTINUOUS.,.T.,#127);
#129= IFCCARTESIANPOINT((18.55,124.3));
#130= IFCAXIS2PLACEMENT2D(#129,$);
#131= IFCCIRCLE(#130,15.);
#132= IFCTRIMMEDCURVE(#131,(#106),(#107),.F.,.CARTESIAN.);
#133= IFCCOMPOSITECURVESEGMENT(.CONTINUOUS.,.T.,#132);
#134= IFCPOLYLINE((#107,#108,#109,#110,#111,#112));
#135= IFCCOMPOSITECURVESEGMENT(.CONTINUOUS.,.T.,#134);
#136= IFCCARTESIANPOINT((-18.55,124.3));
#137= IFCAXIS2PLACEMENT2D(#136,$);
#138= IFCCIRCLE(#137,15.);
#139= IFCTRIMMEDCURVE(#138,(#112,IFCPARAMETERVALUE(90.)),(#113,IFCPARAMETERVALUE(0.)),.F.,.PARAMETER.);
#140= IFCCOMPOSITECURVESEGMENT(.CONTINUOUS.,.T.,#139);
#141= IFCDIRECTION((0.,-1.));
#142= IFCVECTOR(#141,1.);
#143= IFCLINE(#113,#142);
#144= IFCTRIMMEDCURVE(#143,(IFCPARAMETERVALUE(0.)),(IFCPARAMETERVALUE(248.6)),.T.,.PARAMETER.);
#145= IFCCOMPOSITECURVESEGMENT(.CONTINUOUS.,.T.,#144);
#146= IFCCARTESIANPOINT((-18.55,-124.3));
#147= IFCDIRECTION((0.,1.));
#148= IFCAXIS2PLACEMENT2D(#146,#147);
#149= IFCCIRCLE(#148,15.);
#150= IFCTRIMMEDCURVE(#149,(IFCPARAMETERVALUE(270.)),(IFCPARAMETERVALUE(180.)),.F.,.PARAMETER.);
#151= IFCCOMPOSITECURVESEGMENT(.CONTINUOUS.,.T.,#150);
#152= IFCPOLYLINE((#115,#116,#101));
#153= IFCCOMPOSITECURVESEGMENT(.CONTINUOUS.,.T.,#152);
#154= IFCCOMPOSITECURVE((#121,#126,#128,#133,#135,#140,#145,#151,#153),.F.);
#155= IFCARBITRARYCLOSEDPROFILEDEF(.AREA.,'IPE 300 outline',#154);
#156= IFCMIRROREDPROFILEDEF(.AREA.,$,#155,*,'mirrored');
`;

/** A 200 × 100 box with a 180 × 80 void (invented), the outer loop written clockwise and the void counter-clockwise. */
const BOX_WITH_VOID = `
#201= IFCCARTESIANPOINT((-100.,-50.));
#202= IFCCARTESIANPOINT((-100.,50.));
#203= IFCCARTESIANPOINT((100.,50.));
#204= IFCCARTESIANPOINT((100.,-50.));
#205= IFCPOLYLINE((#201,#202,#203,#204,#201));
#206= IFCCARTESIANPOINT((-90.,-40.));
#207= IFCCARTESIANPOINT((90.,-40.));
#208= IFCCARTESIANPOINT((90.,40.));
#209= IFCCARTESIANPOINT((-90.,40.));
#210= IFCPOLYLINE((#206,#207,#208,#209,#206));
#211= IFCARBITRARYPROFILEDEFWITHVOIDS(.AREA.,'box 200x100x10',#205,(#210));
#212= IFCPOLYLINE((#201,#202,#203,#204));
#213= IFCARBITRARYCLOSEDPROFILEDEF(.AREA.,'HEA 300',#212);
#214= IFCARBITRARYPROFILEDEFWITHVOIDS(.AREA.,'open void',#205,(#212));
`;

describe('ProfileReader outlines', () => {
  let model: TestModel;
  let reader: ProfileReader;
  beforeAll(async () => {
    model = await openStepLines('IFC4', IPE_300_OUTLINE + BOX_WITH_VOID);
    reader = new ProfileReader(model.lines, false, 1, DEGREE);
  });
  afterAll(() => model?.close());

  it('measures a composite-curve IPE 300 with four root fillets: area equals the closed form within 0.05 %', () => {
    const polygon = outline(reader.read(155));
    // A = 2·b·tf + (h − 2·tf)·tw + (4 − π)·r² (closed form for a rolled I; common practice, no source) = 5381.2 mm²;
    // EN 10365 tables give 53.81 cm² (from memory).
    const closedForm = 2 * 150 * 10.7 + (300 - 2 * 10.7) * 7.1 + (4 - Math.PI) * 15 * 15;
    expect(Math.abs(area_mm2(polygon.outer) / closedForm - 1)).toBeLessThan(5e-4);
    expect(polygon.voids).toEqual([]);
    const xs = polygon.outer.map((p) => p[0]);
    const ys = polygon.outer.map((p) => p[1]);
    expect([Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)]).toEqual([-75, 75, -150, 150]);
    expect(polygon.arcs).toHaveLength(4);
    for (const arc of polygon.arcs!) expect(arc.radius_mm).toBeCloseTo(15, 9);
    expect(polygon.arcs!.map((a) => a.centre.map((v) => Math.round(v * 100) / 100))).toEqual(
      expect.arrayContaining([[18.55, -124.3], [18.55, 124.3], [-18.55, 124.3], [-18.55, -124.3]]),
    );
    // Every fillet point lies on its circle and inside the corner it rounds (chords never leave the web–flange corner).
    for (const [x, y] of polygon.outer) expect(Math.abs(x) >= 3.55 - 1e-9 || Math.abs(y) >= 124.3 - 1e-9).toBe(true);
  });

  it('mirrors an outline about its y axis and keeps the outer loop counter-clockwise', () => {
    const reading = reader.read(156);
    expect(reading).toMatchObject({ kind: 'outline', name: 'mirrored', flags: ['derived-profile'] });
    const polygon = outline(reading);
    expect(area_mm2(polygon.outer)).toBeCloseTo(area_mm2(outline(reader.read(155)).outer), 6);
    expect(polygon.arcs!.map((a) => a.centre[0])).toEqual(outline(reader.read(155)).arcs!.map((a) => -a.centre[0]));
  });

  it('reads a box with a void: outer counter-clockwise, void clockwise, area 200·100 − 180·80', () => {
    const polygon = outline(reader.read(211));
    expect(area_mm2(polygon.outer)).toBe(20000);
    expect(polygon.voids).toHaveLength(1);
    expect(area_mm2(polygon.voids[0])).toBe(-14400);
    expect(polygon.arcs).toBeUndefined();
  });

  it('reads coordinates in metres into millimetres', async () => {
    const metres = await openStepLines('IFC2X3', BOX_WITH_VOID.replace(/\(\((-?\d+)\.,(-?\d+)\.\)\)/g, (_, x, y) => `((${x / 1000},${y / 1000}))`));
    try {
      const polygon = outline(new ProfileReader(metres.lines, true, 1000, DEGREE).read(211));
      expect(area_mm2(polygon.outer)).toBeCloseTo(20000, 6);
      expect(area_mm2(polygon.voids[0])).toBeCloseTo(-14400, 6);
    } finally {
      metres.close();
    }
  });

  it('keeps an outline whose curve is open for its name, with the reason', () => {
    expect(reader.read(213)).toEqual({
      kind: 'name-only',
      ifcType: 'IfcArbitraryClosedProfileDef',
      name: 'HEA 300',
      flags: [],
      reason: "the outer curve #212 of its outline 'HEA 300' cannot be measured: it is open: a gap of 200 mm between its end and its start, at (100, -50) mm",
    });
    expect(reader.read(214)).toMatchObject({ kind: 'name-only', reason: expect.stringMatching(/^the inner curve #212 of its outline 'open void'/) });
  });
});
