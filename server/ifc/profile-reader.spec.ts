/**
 * Profiles read from hand-written STEP instances: outlines measured from their curves, parametric families read into
 * their dimensions. The shapes are invented except where a published section is named beside its values.
 */
import type { Point2_mm } from '../engine/section-family';
import { signedDoubleArea_mm2 } from './profile-curve';
import { type ParametricReading, ProfileReader, type ProfileReading } from './profile-reader';
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

/**
 * Parametric profiles, IFC4 attribute order (buildingSMART IFC4 entity definitions, as spelt by web-ifc's
 * ifc-schema.d.ts): ProfileType, ProfileName, Position, then each family's parameters.
 */
const PARAMETRIC_IFC4 = `
#1= IFCCARTESIANPOINT((0.,0.));
#2= IFCAXIS2PLACEMENT2D(#1,$);
#301= IFCUSHAPEPROFILEDEF(.AREA.,'UPN 200',#2,200.,75.,8.5,11.5,11.5,6.,4.574);
#302= IFCTSHAPEPROFILEDEF(.AREA.,'tee',$,150.,200.,9.,14.,12.,3.,2.,$,$);
#303= IFCLSHAPEPROFILEDEF(.AREA.,'L 100x100x10',#2,100.,$,10.,12.,6.,$);
#304= IFCCSHAPEPROFILEDEF(.AREA.,'lipped',#2,200.,75.,2.5,20.,2.5);
#305= IFCZSHAPEPROFILEDEF(.AREA.,'zed',#2,200.,80.,3.,3.,$,$);
#306= IFCRECTANGLEHOLLOWPROFILEDEF(.AREA.,'RHS 200x100x8',#2,100.,200.,8.,8.,16.);
#307= IFCCIRCLEHOLLOWPROFILEDEF(.AREA.,'CHS 168.3x8',#2,84.15,8.);
#308= IFCRECTANGLEPROFILEDEF(.AREA.,'FL 300x20',#2,300.,20.);
#309= IFCCIRCLEPROFILEDEF(.AREA.,'RD 50',#2,25.);
#310= IFCUSHAPEPROFILEDEF(.AREA.,'no web',#2,200.,75.,$,11.5,$,$,$);
#311= IFCRECTANGLEHOLLOWPROFILEDEF(.AREA.,'too thick',#2,100.,200.,60.,$,$);
#312= IFCMIRROREDPROFILEDEF(.AREA.,'UPN 200 mirrored',#301,*,$);
#313= IFCDIRECTION((1.,0.));
#314= IFCDIRECTION((0.,1.));
#315= IFCCARTESIANTRANSFORMATIONOPERATOR2D(#313,#314,#1,2.);
#316= IFCDERIVEDPROFILEDEF(.AREA.,'L doubled',#303,#315,$);
#320= IFCCARTESIANPOINT((0.,290.));
#321= IFCAXIS2PLACEMENT2D(#320,$);
#322= IFCCARTESIANPOINT((0.,-290.));
#323= IFCAXIS2PLACEMENT2D(#322,$);
#324= IFCRECTANGLEPROFILEDEF(.AREA.,'top flange',#321,300.,20.);
#325= IFCRECTANGLEPROFILEDEF(.AREA.,'bottom flange',#323,300.,20.);
#326= IFCAXIS2PLACEMENT2D(#1,#314);
#327= IFCRECTANGLEPROFILEDEF(.AREA.,'web',#326,560.,10.);
#328= IFCCOMPOSITEPROFILEDEF(.AREA.,'PL-GIRDER-1',(#324,#325,#327),$);
#330= IFCCARTESIANPOINT((-95.,0.));
#331= IFCAXIS2PLACEMENT2D(#330,$);
#332= IFCCARTESIANPOINT((95.,0.));
#333= IFCAXIS2PLACEMENT2D(#332,$);
#334= IFCRECTANGLEPROFILEDEF(.AREA.,'left web',#331,10.,160.);
#335= IFCRECTANGLEPROFILEDEF(.AREA.,'right web',#333,10.,160.);
#336= IFCCARTESIANPOINT((0.,90.));
#337= IFCAXIS2PLACEMENT2D(#336,$);
#338= IFCCARTESIANPOINT((0.,-90.));
#339= IFCAXIS2PLACEMENT2D(#338,$);
#340= IFCRECTANGLEPROFILEDEF(.AREA.,'top',#337,200.,20.);
#341= IFCRECTANGLEPROFILEDEF(.AREA.,'bottom',#339,200.,20.);
#342= IFCCOMPOSITEPROFILEDEF(.AREA.,'BOX-1',(#334,#335,#340,#341),$);
#343= IFCCOMPOSITEPROFILEDEF(.AREA.,'two plates',(#334,#335),$);
#344= IFCCOMPOSITEPROFILEDEF(.AREA.,'angles back to back',(#303,#303),$);
#345= IFCCOMPOSITEPROFILEDEF(.AREA.,$,(#307),'single');
`;

/** IFC2X3: the same families with CentreOfGravity attributes written at the end (IFC2X3 entity definitions). */
const PARAMETRIC_IFC2X3 = `
#1= IFCCARTESIANPOINT((0.,0.));
#2= IFCAXIS2PLACEMENT2D(#1,$);
#401= IFCUSHAPEPROFILEDEF(.AREA.,'UPN 200',#2,0.2,0.075,0.0085,0.0115,0.0115,0.006,4.574,0.0201);
#402= IFCLSHAPEPROFILEDEF(.AREA.,'L 150x90x10',#2,0.15,0.09,0.01,0.012,0.006,$,0.0204,0.0503);
#403= IFCTSHAPEPROFILEDEF(.AREA.,'tee',#2,0.15,0.2,0.009,0.014,0.012,$,$,$,$,0.03);
#404= IFCCSHAPEPROFILEDEF(.AREA.,'lipped',#2,0.2,0.075,0.0025,0.02,0.0025,0.02);
`;

describe('ProfileReader parametric profiles', () => {
  let model: TestModel;
  let reader: ProfileReader;
  beforeAll(async () => {
    model = await openStepLines('IFC4', PARAMETRIC_IFC4);
    reader = new ProfileReader(model.lines, false, 1, DEGREE);
  });
  afterAll(() => model?.close());

  const dimensions = (id: number) => {
    const reading = reader.read(id);
    if (reading.kind !== 'parametric') throw new Error(`expected a parametric profile, got ${JSON.stringify(reading)}`);
    return reading.dimensions;
  };

  it('reads IfcUShapeProfileDef as a channel: UPN 200, 200 × 75 × 8.5 × 11.5, r 11.5 / 6, slope 8 % (EN 10365, from memory)', () => {
    expect(reader.read(301)).toMatchObject({ kind: 'parametric', ifcType: 'IfcUShapeProfileDef', name: 'UPN 200', flags: [] });
    const d = dimensions(301);
    expect(d).toMatchObject({ family: 'channel', depth_mm: 200, width_mm: 75, webThickness_mm: 8.5, flangeThickness_mm: 11.5, rootRadius_mm: 11.5, edgeRadius_mm: 6 });
    // 8 % slope = atan(0.08) = 4.574° (common practice, no source).
    expect(d.family === 'channel' && d.slope_rad).toBeCloseTo(Math.atan(0.08), 5);
  });

  it('reads IfcTShapeProfileDef as a tee (invented values), with an absent Position (optional in IFC4)', () => {
    expect(dimensions(302)).toEqual({
      family: 'tee',
      depth_mm: 150,
      width_mm: 200,
      webThickness_mm: 9,
      flangeThickness_mm: 14,
      rootRadius_mm: 12,
      flangeEdgeRadius_mm: 3,
      webEdgeRadius_mm: 2,
    });
  });

  it('reads IfcLShapeProfileDef as an angle, the width taken as the depth when absent: L 100 × 100 × 10, r 12 / 6 (EN 10056-1, from memory)', () => {
    expect(dimensions(303)).toEqual({ family: 'angle', depth_mm: 100, width_mm: 100, thickness_mm: 10, rootRadius_mm: 12, edgeRadius_mm: 6 });
  });

  it('reads IfcCShapeProfileDef as a lipped channel (invented cold-formed values)', () => {
    expect(dimensions(304)).toEqual({ family: 'channel', depth_mm: 200, width_mm: 75, webThickness_mm: 2.5, flangeThickness_mm: 2.5, rootRadius_mm: 2.5, lip_mm: 20 });
  });

  it('reads IfcZShapeProfileDef as other: a Z-section whose two flanges share the web thickness', () => {
    expect(dimensions(305)).toEqual({ family: 'other', depth_mm: 200, width_mm: 2 * 80 - 3, description: 'Z-section' });
  });

  it('reads hollow sections: RHS 200 × 100 × 8, corners 16 / 8 (EN 10219-2 cold-formed radii 2t / t, from memory); CHS 168.3 × 8', () => {
    expect(dimensions(306)).toEqual({
      family: 'box',
      depth_mm: 200,
      width_mm: 100,
      webThickness_mm: 8,
      flangeThickness_mm: 8,
      outerCornerRadius_mm: 16,
      innerCornerRadius_mm: 8,
    });
    expect(dimensions(307)).toEqual({ family: 'tube', diameter_mm: 168.3, wallThickness_mm: 8 });
  });

  it('reads a rectangle as a plate and a circle as a solid round', () => {
    expect(dimensions(308)).toEqual({ family: 'plate', depth_mm: 20, width_mm: 300 });
    expect(dimensions(309)).toEqual({ family: 'other', depth_mm: 50, width_mm: 50, description: 'solid round' });
  });

  it('names missing required attributes and impossible values', () => {
    expect(reader.read(310)).toEqual({ kind: 'unreadable', ifcType: 'IfcUShapeProfileDef', name: 'no web', reason: "its profile 'no web' has no WebThickness" });
    expect(reader.read(311)).toMatchObject({
      kind: 'unreadable',
      reason: "its profile 'too thick' cannot be built: twice the WallThickness 120 mm is not less than the smaller of XDim and YDim 100 mm",
    });
  });

  it('keeps a mirrored channel a channel and scales a derived angle', () => {
    expect(reader.read(312)).toMatchObject({ kind: 'parametric', name: 'UPN 200 mirrored', dimensions: dimensions(301), flags: ['derived-profile'] });
    expect(dimensions(316)).toEqual({ family: 'angle', depth_mm: 200, width_mm: 200, thickness_mm: 20, rootRadius_mm: 24, edgeRadius_mm: 12 });
  });

  it('combines the three plates of a welded I into one outline (invented 600 × 300 girder, web 10, flanges 20)', () => {
    const reading = reader.read(328);
    expect(reading).toMatchObject({ kind: 'outline', ifcType: 'IfcCompositeProfileDef', name: 'PL-GIRDER-1' });
    const polygon = outline(reading);
    expect(polygon.outer).toHaveLength(12);
    expect(area_mm2(polygon.outer)).toBeCloseTo(2 * 300 * 20 + 560 * 10, 9);
    expect(polygon.voids).toEqual([]);
  });

  it('combines four plates of a box into an outline with a void, and refuses parts that do not make one outline', () => {
    const polygon = outline(reader.read(342));
    expect(area_mm2(polygon.outer)).toBeCloseTo(200 * 200, 9);
    expect(polygon.voids).toHaveLength(1);
    expect(area_mm2(polygon.voids[0])).toBeCloseTo(-180 * 160, 9);
    expect(reader.read(343)).toMatchObject({ kind: 'unreadable', reason: "its profile 'two plates' is a built-up section of 2 profiles: its parts make 2 separate pieces, not one" });
    expect(reader.read(344)).toMatchObject({
      kind: 'unreadable',
      reason: "its profile 'angles back to back' is a built-up section of 2 profiles, which is read only when its parts are rectangles square to its axes",
    });
    expect(reader.read(345)).toMatchObject({ kind: 'parametric', name: 'CHS 168.3x8', dimensions: { family: 'tube' } });
  });

  it('reads IFC2X3 parametric profiles in metres, their CentreOfGravity attributes left aside', async () => {
    const old = await openStepLines('IFC2X3', PARAMETRIC_IFC2X3);
    try {
      const oldReader = new ProfileReader(old.lines, true, 1000, DEGREE);
      const read = (id: number) => (oldReader.read(id) as ParametricReading).dimensions as unknown as Record<string, number>;
      expect(read(401)).toMatchObject({ family: 'channel', depth_mm: 200, width_mm: 75 });
      expect(read(401).webThickness_mm).toBeCloseTo(8.5, 9);
      expect(read(402)).toMatchObject({ family: 'angle', depth_mm: 150, width_mm: 90, thickness_mm: 10, rootRadius_mm: 12, edgeRadius_mm: 6 });
      expect(read(403)).toMatchObject({ family: 'tee', depth_mm: 150, width_mm: 200, flangeThickness_mm: 14 });
      expect(read(404)).toMatchObject({ family: 'channel', lip_mm: 20, rootRadius_mm: 2.5 });
    } finally {
      old.close();
    }
  });
});
