/**
 * The buildingSMART IFC4 specification examples (CC BY 4.0, test/fixtures/ifc/buildingsmart/SOURCE.md): every
 * member and its profile come out with the dimensions written in the files.
 */
import { type Node, WebIO } from '@gltf-transform/core';
import { buildingSmartSample } from '../../test/fixtures/ifc/buildingsmart-samples';
import type { MemberRecord, ModelReadResult } from './model-read-result';
import { readModel } from './read-model';

/** #203 IFCISHAPEPROFILEDEF(.AREA.,'IPE200',$,100.0,200.0,5.6,8.5,12.0,$,$), shared by all three files (SOURCE.md). */
const IPE200_FROM_FILE = {
  name: 'IPE200',
  family: 'I', source: 'ifc-profile',
  ifcType: 'IfcIShapeProfileDef',
  fabrication: 'rolled',
  depth_mm: 200,
  webThickness_mm: 5.6,
  topFlange: { width_mm: 100, thickness_mm: 8.5, filletRadius_mm: 12 },
  bottomFlange: { width_mm: 100, thickness_mm: 8.5, filletRadius_mm: 12 },
};

async function read(file: string): Promise<ModelReadResult> {
  return readModel(buildingSmartSample(file));
}

async function glbNodes(result: ModelReadResult): Promise<Node[]> {
  const document = await new WebIO().readBinary(result.glb!);
  return document.getRoot().listNodes();
}

function byName(members: MemberRecord[], name: string): MemberRecord {
  const member = members.find((m) => m.name === name);
  if (!member) throw new Error(`no member named ${name}`);
  return member;
}

describe('buildingSMART sample beam-varying-cardinal-points.ifc', () => {
  let result: ModelReadResult;
  beforeAll(async () => {
    result = await read('beam-varying-cardinal-points.ifc');
  });

  it('reads the model facts', () => {
    expect(result.model).toMatchObject({ schema: 'IFC4', lengthUnit: 'millimetre', lengthScaleToMm: 1, fileName: 'beam-varying-cardinal-points.ifc' });
    expect(result.model.counts).toMatchObject({ members: 4, ok: 4, notApplicable: 0, flagged: 0 });
  });

  it('finds the four IfcBeamStandardCase of SOURCE.md, each IPE200, S355JR, 1000 mm, JOIST from its type', () => {
    expect(result.members.map((m) => m.name).sort()).toEqual(['BotLeft', 'BotMid', 'TopMid', 'TopRight']);
    for (const member of result.members) {
      expect(member).toMatchObject({ ifcClass: 'IfcBeamStandardCase', status: 'ok', predefinedType: 'JOIST', profile: IPE200_FROM_FILE, flags: [] });
      expect(member.material).toEqual({ name: 'S355JR', grade: 'S355', fy_MPa: 355, assumed: false });
      expect(member.length_mm).toBeCloseTo(1000, 9);
    }
  });

  it('gives the section properties of IPE 200', () => {
    const { section } = result.members[0];
    // IPE 200 tables (EN 10365 dimensions): A = 28.48 cm², Iy = 1943 cm⁴ — from memory of the usual section tables.
    expect(section!.area_mm2 / 100).toBeCloseTo(28.48, 1);
    expect(section!.iMajor_mm4 / 1e4).toBeCloseTo(1943, -1);
    expect(section!.neutralAxisFromBottom_mm).toBeCloseTo(100, 9);
  });

  it('writes one glb node per beam, named by GlobalId', async () => {
    const nodes = await glbNodes(result);
    expect(nodes.map((n) => n.getName()).sort()).toEqual(result.members.map((m) => m.globalId).sort());
    const topMid = nodes.find((n) => n.getName() === byName(result.members, 'TopMid').globalId)!;
    expect(topMid.getExtras()).toEqual({ globalId: topMid.getName(), expressId: byName(result.members, 'TopMid').expressId, ifcClass: 'IfcBeamStandardCase', context: false });
  });
});

describe('buildingSMART sample beam-varying-extrusion-paths.ifc', () => {
  let result: ModelReadResult;
  beforeAll(async () => {
    result = await read('beam-varying-extrusion-paths.ifc');
  });

  it('reads the straight extrusion: 1000 mm along model Y (its Axis polyline placed by #212)', () => {
    const beam = byName(result.members, 'Extrusion');
    expect(beam).toMatchObject({ status: 'ok', profile: IPE200_FROM_FILE, flags: [] });
    expect(beam.length_mm).toBeCloseTo(1000, 9);
    expect(beam.axis!.start_mm).toEqual([0, 0, 0]);
    beam.axis!.end_mm.forEach((v, i) => expect(v).toBeCloseTo([0, 1000, 0][i], 6));
  });

  it('measures the curved beam along its arc: radius 1300 mm × 0.789582239399523 rad (#236, #243 and #245)', () => {
    const beam = byName(result.members, 'Revolution');
    expect(beam).toMatchObject({ status: 'ok', profile: IPE200_FROM_FILE, flags: ['curved'] });
    expect(beam.length_mm).toBeCloseTo(1300 * 0.789582239399523, 6);
  });

  it('has geometry for both beams from web-ifc', async () => {
    const nodes = await glbNodes(result);
    expect(nodes).toHaveLength(2);
    expect(result.members.every((m) => !m.flags.includes('geometry-built') && !m.flags.includes('no-geometry'))).toBe(true);
  });
});

describe('buildingSMART sample column-extruded-solid.ifc', () => {
  let result: ModelReadResult;
  beforeAll(async () => {
    result = await read('column-extruded-solid.ifc');
  });

  it('reads the one unnamed IfcColumnStandardCase: IPE200, vertical, 2000 mm, COLUMN from its type', () => {
    expect(result.members).toHaveLength(1);
    const [column] = result.members;
    expect(column).toMatchObject({ ifcClass: 'IfcColumnStandardCase', name: null, status: 'ok', predefinedType: 'COLUMN', profile: IPE200_FROM_FILE });
    expect(column.length_mm).toBeCloseTo(2000, 9);
    expect(column.axis!.end_mm[2] - column.axis!.start_mm[2]).toBeCloseTo(2000, 9);
  });

  it('puts the column upright in the glb: IFC Z becomes glTF Y, in metres', async () => {
    const [node] = await glbNodes(result);
    const position = node.getMesh()!.listPrimitives()[0].getAttribute('POSITION')!;
    const min = position.getMin([]);
    const max = position.getMax([]);
    expect(max[1] - min[1]).toBeCloseTo(2, 3);
    // IPE 200 seen from above: 100 mm wide, 200 mm deep.
    expect([max[0] - min[0], max[2] - min[2]].sort()).toEqual([expect.closeTo(0.1, 3), expect.closeTo(0.2, 3)]);
  });
});
