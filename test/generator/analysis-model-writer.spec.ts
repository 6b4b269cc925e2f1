/**
 * The analysis model the generator adds, opened with web-ifc: each entity in the attribute order of the IFC schema
 * (web-ifc's typed reads name the attributes), one curve member per beam and column, one result group per load
 * combination, three stations per member, and a CSV of the same forces. The forces are invented demo data.
 */
import { IFCBEAM, IFCCOLUMN, IFCMEMBER, IFCRELASSIGNSTOPRODUCT, IFCSTRUCTURALCURVEMEMBER, IFCSTRUCTURALRESULTGROUP, type IfcAPI } from 'web-ifc';
import { openModel } from '../../server/ifc/open-model';
import { addAnalysisModel, ANALYSIS_COMBINATIONS, type AnalysisModel } from './analysis-model-writer';
import { frameLayout } from './frame-layout';
import { generateFrame } from './generate-frame';

const MEMBERS = 30;

describe('an analysis model beside a generated frame', () => {
  const layout = frameLayout(MEMBERS);
  let model: AnalysisModel;
  let api: IfcAPI;
  let modelId: number;
  let close: () => void;
  beforeAll(async () => {
    model = addAnalysisModel(generateFrame({ members: MEMBERS, unit: 'm' }), layout, { schema: 'IFC4', unit: 'm' });
    const opened = await openModel(new TextEncoder().encode(model.ifc));
    ({ api, modelId, close } = opened);
  });
  afterAll(() => close());

  const ids = (type: number, subtypes = false): number[] => {
    const vector = api.GetLineIDsWithType(modelId, type, subtypes);
    return Array.from({ length: vector.size() }, (_, i) => vector.get(i));
  };

  it('writes one analysis member per beam and column, none for braces', () => {
    const physical = layout.slots.filter((s) => s.role !== 'brace').length;
    expect(ids(IFCSTRUCTURALCURVEMEMBER)).toHaveLength(physical);
    expect(ids(IFCBEAM, true).length + ids(IFCCOLUMN, true).length).toBe(physical);
    expect(ids(IFCMEMBER, true).length).toBe(layout.slots.length - physical);
  });

  it('assigns most analysis members to their physical member and leaves every seventh to its coordinates', () => {
    const members = ids(IFCSTRUCTURALCURVEMEMBER);
    const assignments = ids(IFCRELASSIGNSTOPRODUCT).map((id) => api.GetLine(modelId, id));
    expect(assignments).toHaveLength(members.length - Math.floor(members.length / 7));
    const products = new Set([...ids(IFCBEAM, true), ...ids(IFCCOLUMN, true)]);
    for (const assignment of assignments) {
      expect(products.has(assignment.RelatingProduct.value)).toBe(true);
      expect(members).toContain(assignment.RelatedObjects[0].value);
    }
  });

  it('names the attributes of the schema: Axis on the member, ResultForLoadGroup on the result group', () => {
    const member = api.GetLine(modelId, ids(IFCSTRUCTURALCURVEMEMBER)[0]);
    expect(member.PredefinedType.value).toBe('RIGID_JOINED_MEMBER');
    expect(api.GetLine(modelId, member.Axis.value).DirectionRatios.map((r: { value: number }) => r.value)).toEqual([1, 0, 0]);
    const groups = ids(IFCSTRUCTURALRESULTGROUP).map((id) => api.GetLine(modelId, id));
    expect(groups.map((g) => g.Name.value)).toEqual(ANALYSIS_COMBINATIONS.map((c) => c.name));
    expect(groups.map((g) => api.GetLine(modelId, g.ResultForLoadGroup.value).Name.value)).toEqual(ANALYSIS_COMBINATIONS.map((c) => c.loadGroup));
  });

  it('gives every GlobalId once', () => {
    const globalIds = [...model.ifc.matchAll(/^#\d+= IFC\w+\('([0-9A-Za-z_$]{22})'/gm)].map((m) => m[1]);
    expect(new Set(globalIds).size).toBe(globalIds.length);
  });

  it('writes the same forces as CSV: a row per member, combination and station', () => {
    const rows = model.csv.trim().split('\n');
    expect(rows[0]).toBe('member,combination,station [mm],shear [kN],Vy [kN],My [kNm],Mz [kNm],N [kN]');
    expect(rows).toHaveLength(1 + ids(IFCSTRUCTURALCURVEMEMBER).length * ANALYSIS_COMBINATIONS.length * 3);
    expect(model.forces).toHaveLength(rows.length - 1);
  });
});
