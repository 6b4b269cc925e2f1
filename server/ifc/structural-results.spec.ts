/**
 * Forces read from IFC structural analysis models. The models are the generator's invented frames with an invented
 * analysis model added (test/generator/analysis-model-writer.ts); the checks rest on outside rules:
 * - buildingSMART IFC 4.3.2.0, IfcStructuralCurveMember / IfcStructuralItem (§7.10.3): local x along the edge, z after
 *   Axis, y completing a right-handed set; IfcStructuralLoadConfiguration (§8.19.3.10): stations are lengths along
 *   the curve, within it; IfcStructuralLoadSingleForce attribute order ForceX…MomentZ (web-ifc's ifc-schema.d.ts).
 * - SI prefixes (BIPM SI Brochure, 9th edition, Table 7): kilo = 10³, milli = 10⁻³.
 * - Simply supported span under a uniform load w: V = wL/2 at a support, M = wL²/8 at mid-span (beam diagram in the
 *   AISC Steel Construction Manual, Table 3-23 case 1; from memory).
 * The invented forces themselves are demo data: the tests show they come back unchanged, in the right units and axes.
 */
import { frameLayout } from '../../test/generator/frame-layout';
import { generateFrame } from '../../test/generator/generate-frame';
import { addAnalysisModel, type AnalysisDefect, type AnalysisModel, type AnalysisModelOptions } from '../../test/generator/analysis-model-writer';
import { cross } from './matrix4';
import { openStepLines } from './test-step-lines';
import { linkByCoordinates, type PhysicalMemberAxis, readStructuralResults, type StructuralForceRow, type StructuralResults, StructuralResultsError, structuralResultsOf } from './structural-results';

const MEMBERS = 40;

function analysisModel(unit: AnalysisModelOptions['unit'], defect?: AnalysisDefect, schema: 'IFC4' | 'IFC4X3' = 'IFC4'): AnalysisModel {
  return addAnalysisModel(generateFrame({ members: MEMBERS, unit, schema }), frameLayout(MEMBERS), { schema, unit, defect });
}

const bytes = (text: string) => new TextEncoder().encode(text);
const read = (ifc: string, options?: Parameters<typeof readStructuralResults>[1]) => readStructuralResults(bytes(ifc), options);

/** The CSV's rows in N, N·mm and mm (its headers say kN, kNm and mm). */
function csvRows(csv: string): Map<string, number[]> {
  const [header, ...lines] = csv.trim().split('\n');
  expect(header).toBe('member,combination,station [mm],shear [kN],Vy [kN],My [kNm],Mz [kNm],N [kN]');
  const rows = new Map<string, number[]>();
  for (const line of lines) {
    const [member, combination, station, vz, vy, my, mz, n] = line.split(',');
    rows.set(`${member}|${combination}|${Number(station)}`, [Number(vz) * 1e3, Number(vy) * 1e3, Number(my) * 1e6, Number(mz) * 1e6, Number(n) * 1e3]);
  }
  return rows;
}

const keyOf = (row: StructuralForceRow) => `${row.memberKey}|${row.combination}|${Number(row.station_mm.toFixed(6))}`;
const valuesOf = (row: StructuralForceRow) => [row.shear_N!, row.minorShear_N!, row.majorMoment_Nmm!, row.minorMoment_Nmm!, row.axial_N!];

function expectClose(actual: number, expected: number, relative = 1e-9): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(relative * Math.max(1, Math.abs(expected)));
}

function expectRowsEqualCsv(results: StructuralResults, csv: string): void {
  const expected = csvRows(csv);
  expect(results.rows).toHaveLength(expected.size);
  for (const row of results.rows) {
    const want = expected.get(keyOf(row));
    expect(want).toBeDefined();
    valuesOf(row).forEach((value, i) => expectClose(value, want![i]));
  }
}

async function refusal(ifc: string): Promise<StructuralResultsError> {
  const error = await read(ifc).then(
    () => undefined,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(StructuralResultsError);
  return error as StructuralResultsError;
}

describe.each(['mm', 'm'] as const)('an analysis model in %s', (unit) => {
  let model: AnalysisModel;
  let results: StructuralResults;
  beforeAll(async () => {
    model = analysisModel(unit);
    results = await read(model.ifc);
  });

  it('gives the CSV of the same forces, row for row, in N and N·mm', () => {
    expectRowsEqualCsv(results, model.csv);
  });

  it('reads the project units: forces in N or kN, moments in N·mm or kN·m, lengths in mm or m (SI prefixes)', () => {
    const kilo = unit === 'm';
    expect(results.units).toEqual({
      lengthScaleToMm: kilo ? 1000 : 1,
      newtonsPerForceUnit: kilo ? 1000 : 1,
      newtonMillimetresPerMomentUnit: kilo ? 1e6 : 1,
    });
  });

  it('names one result group per load combination, with the load group it results from', () => {
    expect(results.groups.map((g) => [g.combination, g.loadGroup?.name, g.loadGroup?.kind, g.memberCount])).toEqual([
      ['ULS-A dead + imposed', 'Dead and imposed', 'LOAD_COMBINATION', results.members.length],
      ['ULS-B dead + wind', 'Dead and wind', 'LOAD_COMBINATION', results.members.length],
    ]);
  });

  it('places three stations per member and combination, from the start vertex to the member length', () => {
    for (const member of results.members) {
      const stations = results.rows.filter((r) => r.end1_mm === member.start_mm && r.combination === 'ULS-A dead + imposed').map((r) => r.station_mm);
      expect(stations).toEqual([0, member.length_mm / 2, member.length_mm]);
    }
  });
});

describe('analysis members and their physical members', () => {
  let model: AnalysisModel;
  let results: StructuralResults;
  beforeAll(async () => {
    model = analysisModel('mm');
    results = await read(model.ifc);
  });

  it('links by IfcRelAssignsToProduct where the export says so, else by coordinates, each to the member the generator meant', () => {
    const meant = new Map(model.forces.map((f) => [f.globalId, f.link]));
    expect(results.members).toHaveLength(meant.size);
    for (const member of results.members) {
      expect(member.link.by).not.toBe('none');
      if (member.link.by === 'none') continue;
      expect(meant.get(member.link.globalId)).toBe(member.link.by);
    }
    expect(results.members.filter((m) => m.link.by === 'coordinates').length).toBeGreaterThan(0);
    expect(results.members.filter((m) => m.link.by === 'assignment').length).toBeGreaterThan(results.members.length / 2);
  });

  it('keys an analysis member that nothing links by its own GlobalId, with the reason', async () => {
    const alone = await read(model.ifc, { physicalMembers: [] });
    const unlinked = alone.members.filter((m) => m.link.by === 'none');
    expect(unlinked).toHaveLength(results.members.filter((m) => m.link.by === 'coordinates').length);
    for (const member of unlinked) {
      expect(member.link).toEqual({ by: 'none', reason: expect.stringContaining('IfcRelAssignsToProduct') });
      expect(alone.rows.filter((r) => r.memberKey === member.globalId)).toHaveLength(6);
    }
  });

  it('finds a member split at a node on its beam, reversed, and refuses one that is equally near two axes', () => {
    const beam: PhysicalMemberAxis = { globalId: 'beam', start_mm: [0, 0, 4000], end_mm: [6000, 0, 4000] };
    expect(linkByCoordinates({ start_mm: [6000, 0, 4000], end_mm: [3000, 0, 4010] }, [beam], 50)).toEqual({
      by: 'coordinates',
      globalId: 'beam',
      distance_mm: 10,
      reversed: true,
      startAlong_mm: 6000,
    });
    const twin = { ...beam, globalId: 'twin' };
    expect(linkByCoordinates({ start_mm: [0, 0, 4000], end_mm: [6000, 0, 4000] }, [beam, twin], 50)).toMatchObject({ by: 'none' });
    expect(linkByCoordinates({ start_mm: [0, 0, 4000], end_mm: [6000, 0, 4400] }, [beam], 50)).toMatchObject({ by: 'none', reason: expect.stringContaining('50 mm') });
  });
});

describe('axes and signs (IFC 4.3 §7.10.3: x along the edge, z after Axis, y = z × x)', () => {
  let model: AnalysisModel;
  let results: StructuralResults;
  beforeAll(async () => {
    model = analysisModel('mm');
    results = await read(model.ifc);
  });

  it('gives right-handed local axes: a column runs up, a beam along its span with z up', () => {
    const column = results.members.find((m) => m.name === 'A-C1')!;
    expect(column.axes.x).toEqual([0, 0, 1]);
    const beam = results.members.find((m) => m.end_mm[1] === m.start_mm[1] && m.end_mm[2] === m.start_mm[2])!;
    expect(beam.axes.x).toEqual([1, 0, 0]);
    expect(beam.axes.z).toEqual([0, 0, 1]);
    for (const { axes } of results.members) cross(axes.x, axes.y).forEach((v, i) => expectClose(v, axes.z[i]));
  });

  it('keeps signs as written: shear wL/2 at the start and −wL/2 at the end, moment wL²/8 at mid-span, compression negative', () => {
    const beam = results.members.find((m) => m.name?.startsWith('A-B'))!;
    const rows = results.rows.filter((r) => r.end1_mm === beam.start_mm && r.combination === 'ULS-A dead + imposed');
    const L = beam.length_mm;
    // The generator's uniform load for this beam, read back from the support shear.
    const w = (2 * rows[0].shear_N!) / L;
    expect(w).toBeGreaterThan(0);
    expectClose(rows[2].shear_N!, (-w * L) / 2);
    expectClose(rows[1].majorMoment_Nmm!, (w * L * L) / 8);
    expectClose(rows[0].majorMoment_Nmm!, 0);
    const column = results.rows.find((r) => r.combination === 'ULS-A dead + imposed' && r.end2_mm[2] - r.end1_mm[2] > 0 && r.end1_mm[0] === r.end2_mm[0])!;
    expect(column.axial_N).toBeLessThan(0);
  });

  it('turns GLOBAL_COORDS values into the member axes (a beam along global y: local y is −X)', async () => {
    const global = await read(model.ifc.replace(/\.LOCAL_COORDS\./g, '.GLOBAL_COORDS.'));
    const local = results;
    const beamY = local.members.find((m) => m.axes.x[1] === 1)!;
    expect(beamY.axes.y.map((v) => v + 0)).toEqual([-1, 0, 0]);
    const at = (r: StructuralResults) => r.rows.find((row) => row.end1_mm[0] === beamY.start_mm[0] && row.end1_mm[1] === beamY.start_mm[1] && row.end1_mm[2] === beamY.start_mm[2] && row.end2_mm[1] !== row.end1_mm[1])!;
    const written = at(local);
    const turned = at(global);
    // Written ForceX (N) is now global X = −local y; written ForceY (Vy) is global Y = local x.
    expectClose(turned.minorShear_N!, -written.axial_N!);
    expectClose(turned.axial_N!, written.minorShear_N!);
    expectClose(turned.shear_N!, written.shear_N!);
  });
});

describe('IFC4X3', () => {
  it('reads the same model written in IFC4X3 (IfcDerivedUnit with its Name attribute)', async () => {
    const model = analysisModel('m', undefined, 'IFC4X3');
    expectRowsEqualCsv(await read(model.ifc), model.csv);
  });
});

describe('bad input: refused with the entity named, nothing returned', () => {
  it('an IFC with analysis members but no results', async () => {
    const error = await refusal(analysisModel('mm', 'no-results').ifc);
    expect(error.code).toBe('no-results');
    expect(error.message).toMatch(/holds \d+ analysis members \(IfcStructuralCurveMember\) but no results/);
  });

  it('a result group with no members', async () => {
    const error = await refusal(analysisModel('mm', 'empty-result-group').ifc);
    expect(error.code).toBe('empty-result-group');
    expect(error.message).toMatch(/^IfcStructuralResultGroup #\d+ 'ULS-B dead \+ wind' \(GlobalId \S+\) holds no forces on any analysis member/);
  });

  it('a member with a station beyond its length', async () => {
    const error = await refusal(analysisModel('m', 'station-beyond-end').ifc);
    expect(error.code).toBe('station-outside-member');
    expect(error.message).toMatch(/IfcStructuralCurveReaction #\d+ \(GlobalId \S+\) on IfcStructuralCurveMember #\d+ 'A-C1' .* gives forces at 4050 mm, outside the member's length of 4000 mm\./);
  });

  it('a model without analysis members', async () => {
    expect((await refusal(generateFrame({ members: 12 }))).code).toBe('no-analysis-members');
  });

  it('forces without a force unit, and moments without a moment unit', async () => {
    const ifc = analysisModel('mm').ifc;
    const withoutUnit = (kind: 'FORCEUNIT' | 'TORQUEUNIT') => {
      const id = new RegExp(`^(#\\d+)= IFC(?:SI|DERIVED)UNIT\\([^;]*\\.${kind}\\.`, 'm').exec(ifc)![1];
      return ifc.replace(new RegExp(`(IFCUNITASSIGNMENT\\(\\([^)]*),${id}\\b`), '$1');
    };
    expect((await refusal(withoutUnit('FORCEUNIT'))).message).toContain('no force unit (its IfcUnitAssignment has no FORCEUNIT)');
    expect((await refusal(withoutUnit('TORQUEUNIT'))).message).toContain('no moment unit');
  });

  it('distributed loads (IfcStructuralLoadLinearForce) in place of internal forces', async () => {
    const ifc = analysisModel('mm').ifc.replace(/IFCSTRUCTURALLOADSINGLEFORCE\(/g, 'IFCSTRUCTURALLOADLINEARFORCE(');
    const error = await refusal(ifc);
    expect(error.code).toBe('not-internal-forces');
    expect(error.message).toContain('holds IfcStructuralLoadLinearForce values, not internal forces');
  });
});

describe('point reactions on a member', () => {
  const POINT_X = '__X__';
  // A hand-written 5 m member along x with one point reaction at 2 m (schema attribute orders from ifc-schema.d.ts).
  const data = `
#1= IFCSIUNIT(*,.LENGTHUNIT.,.MILLI.,.METRE.);
#2= IFCSIUNIT(*,.FORCEUNIT.,.KILO.,.NEWTON.);
#3= IFCSIUNIT(*,.LENGTHUNIT.,$,.METRE.);
#4= IFCDERIVEDUNITELEMENT(#2,1);
#5= IFCDERIVEDUNITELEMENT(#3,1);
#6= IFCDERIVEDUNIT((#4,#5),.TORQUEUNIT.,$);
#7= IFCUNITASSIGNMENT((#1,#2,#6));
#8= IFCCARTESIANPOINT((0.,0.,0.));
#9= IFCAXIS2PLACEMENT3D(#8,$,$);
#10= IFCGEOMETRICREPRESENTATIONCONTEXT($,'Model',3,1.E-05,#9,$);
#11= IFCPROJECT('0P1roject000000000000A',$,'Point test',$,$,$,$,(#10),#7);
#12= IFCLOCALPLACEMENT($,#9);
#13= IFCCARTESIANPOINT((1000.,0.,0.));
#14= IFCCARTESIANPOINT((6000.,0.,0.));
#15= IFCVERTEXPOINT(#13);
#16= IFCVERTEXPOINT(#14);
#17= IFCEDGE(#15,#16);
#18= IFCTOPOLOGYREPRESENTATION(#10,'Reference','Edge',(#17));
#19= IFCPRODUCTDEFINITIONSHAPE($,$,(#18));
#20= IFCDIRECTION((0.,0.,1.));
#21= IFCSTRUCTURALCURVEMEMBER('0P1oint000000000000001',$,'A-1',$,$,#12,#19,.RIGID_JOINED_MEMBER.,#20);
#22= IFCCARTESIANPOINT((${POINT_X},0.,0.));
#23= IFCVERTEXPOINT(#22);
#24= IFCTOPOLOGYREPRESENTATION(#10,'Reference','Vertex',(#23));
#25= IFCPRODUCTDEFINITIONSHAPE($,$,(#24));
#26= IFCSTRUCTURALLOADSINGLEFORCE($,0.,1.5,-42.,0.,12.5,0.);
#27= IFCSTRUCTURALPOINTREACTION('0P1oint000000000000002',$,$,$,$,#12,#25,#26,.LOCAL_COORDS.);
#28= IFCRELCONNECTSSTRUCTURALACTIVITY('0P1oint000000000000003',$,$,$,#21,#27);
#29= IFCSTRUCTURALRESULTGROUP('0P1oint000000000000004',$,'SLS 1',$,$,.FIRST_ORDER_THEORY.,$,.T.);
#30= IFCRELASSIGNSTOGROUP('0P1oint000000000000005',$,$,$,(#27),$,#29);
`;

  it('are placed at the projection of their vertex on the member edge', async () => {
    const model = await openStepLines('IFC4', data.replace(POINT_X, '3000.'));
    try {
      const results = structuralResultsOf(model.lines, { physicalMembers: [] });
      expect(results.rows).toHaveLength(1);
      expect(results.rows[0]).toMatchObject({ combination: 'SLS 1', station_mm: 2000, shear_N: -42_000, minorShear_N: 1_500, majorMoment_Nmm: 12.5e6, axial_N: 0 });
    } finally {
      model.close();
    }
  });

  it('are refused when their vertex is off the member', async () => {
    const model = await openStepLines('IFC4', data.replace(POINT_X, '7000.'));
    try {
      expect(() => structuralResultsOf(model.lines, { physicalMembers: [] })).toThrow(/gives forces at 6000 mm, outside the member's length of 5000 mm/);
    } finally {
      model.close();
    }
  });
});
