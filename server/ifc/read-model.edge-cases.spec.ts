/**
 * test/fixtures/ifc/edge-cases.ifc: hand-written IFC4 constructs that the generated frames do not use (invented
 * data; expected values worked out from the file, written beside each check).
 */
import * as path from 'node:path';
import { MM_PER_FT } from '../engine/units';
import { type MemberRecord, type ModelReadResult, requireIProfile } from './model-read-result';
import { readModel } from './read-model';

const FIXTURE = path.resolve(__dirname, '../../test/fixtures/ifc/edge-cases.ifc');

describe('edge-cases.ifc', () => {
  let result: ModelReadResult;
  const member = (name: string): MemberRecord => result.members.find((m) => m.name === name)!;
  beforeAll(async () => {
    result = await readModel(FIXTURE);
  });

  it('resolves a foot declared as 12 inches of 0.0254 m each to 304.8 mm', () => {
    expect(result.model).toMatchObject({ lengthUnit: 'foot', lengthScaleToMm: MM_PER_FT });
  });

  it('measures an IfcIndexedPolyCurve arc: a quarter circle of 10 ft is 5π ft long', () => {
    const beam = member('B-arc');
    expect(beam.length_mm).toBeCloseTo(5 * Math.PI * MM_PER_FT, 6);
    expect(beam.flags).toContain('curved');
    expect(beam.axis).toEqual({ start_mm: [10 * MM_PER_FT, 0, 0], end_mm: [0, 10 * MM_PER_FT, 0] });
  });

  it('resolves a bare IfcProfileDef by its name through the catalogue (IPE 300, EN 10365: 300 × 150 × 7.1 × 10.7, r 15)', () => {
    expect(member('B-arc').profile).toMatchObject({
      name: 'IPE 300',
      family: 'I', source: 'catalogue',
      ifcType: 'IfcProfileDef',
      fabrication: 'rolled',
      depth_mm: 300,
      webThickness_mm: 7.1,
      topFlange: { width_mm: 150, thickness_mm: 10.7, filletRadius_mm: 15 },
    });
    // IPE 300 tables: A = 53.81 cm², Iy = 8356 cm⁴ (reference-notes: dimensions EN 10365, A and Iy from open section tables).
    expect(member('B-arc').section!.area_mm2 / 100).toBeCloseTo(53.81, 1);
    expect(member('B-arc').section!.iMajor_mm4 / 1e4).toBeCloseTo(8356, -1);
  });

  it('turns an asymmetric profile upside down through IfcDerivedProfileDef and sums a composite axis (5 ft + 7 ft)', () => {
    const column = member('C-mirrored');
    expect(column.profile).toMatchObject({ ifcType: 'IfcAsymmetricIShapeProfileDef', fabrication: 'welded' });
    // #217 bottom 1.25 × 0.1 ft, top 1 × 0.08 ft; the operator's Axis2 (0,−1) swaps them.
    expect(requireIProfile(column.profile).topFlange.width_mm).toBeCloseTo(1.25 * MM_PER_FT, 9);
    expect(requireIProfile(column.profile).topFlange.thickness_mm).toBeCloseTo(0.1 * MM_PER_FT, 9);
    expect(requireIProfile(column.profile).bottomFlange.width_mm).toBeCloseTo(1 * MM_PER_FT, 9);
    expect(requireIProfile(column.profile).depth_mm).toBeCloseTo(3 * MM_PER_FT, 9);
    expect(column.flags).toContain('derived-profile');
    expect(column.length_mm).toBeCloseTo(12 * MM_PER_FT, 9);
  });

  it('reads a grade from a constituent set and an old EN name: Fe 510 is S355 (EN 10025 designations)', () => {
    // 0.1 ft = 30.48 mm flanges: EN 10025-2 gives S355 345 MPa for 16 < t ≤ 40 mm (server/engine/grades.ts).
    expect(member('C-mirrored').material).toEqual({ name: 'Fe 510', grade: 'S355', fy_MPa: 345, assumed: false });
  });

  it('flags a faceted-brep member whose body is too short to have an axis and that names no section', () => {
    expect(member('M-brep')).toMatchObject({
      status: 'flagged',
      reason: expect.stringContaining('its body gives no section (Its body (IfcFacetedBrep) is too short for its axis to be found'),
      flags: expect.arrayContaining(['geometry-unread', 'profile-not-in-catalogue']),
    });
  });

  it('finds a section named only in a property set when the profile gives neither dimensions nor a name', () => {
    // IPE 300 from the built-in EN 10365 table (server/catalogue/en-sections.ts: h 300, tw 7.1 — from memory).
    expect(member('P-pset')).toMatchObject({ status: 'ok', profile: { name: 'IPE 300', source: 'catalogue', depth_mm: 300, webThickness_mm: 7.1 } });
  });

  it('takes section, material and predefined type from the type, and the storey through the assembly', () => {
    const beam = member('B-assembly');
    expect(beam).toMatchObject({ status: 'ok', storey: 'Mezzanine', predefinedType: 'LINTEL' });
    expect(beam.profile).toMatchObject({ name: 'IPE200', family: 'I', source: 'ifc-profile', fabrication: 'rolled' });
    expect(requireIProfile(beam.profile).depth_mm).toBeCloseTo(200, 9);
    // ASTM A36: Fy = 36 ksi (AISC Manual Table 2-4) = 248.2 MPa.
    expect(beam.material).toMatchObject({ name: 'ASTM A36', grade: 'A36', assumed: false });
    expect(beam.material!.fy_MPa).toBeCloseTo(248.2, 1);
    expect(beam.length_mm).toBeCloseTo(8 * MM_PER_FT, 9);
    expect(beam.axis!.start_mm[1]).toBeCloseTo(5 * MM_PER_FT, 9);
  });

  it('names the storey by its LongName when its Name is empty', () => {
    expect(new Set(result.members.map((m) => m.storey))).toEqual(new Set(['Mezzanine']));
  });
});
