/**
 * IFC 4.3 members whose section varies along them (test/fixtures/ifc/sectioned-solids.ifc, hand-written, invented):
 * every cross section is kept with where it sits, and the member takes the smallest — never a deeper one. Positions
 * follow IfcAxis2PlacementLinear's distance along the directrix (IFC 4.3 ADD2 schema).
 */
import * as path from 'node:path';
import { type MemberRecord, type ModelReadResult, requireIProfile } from './model-read-result';
import { readModel } from './read-model';

const FILE = path.resolve(__dirname, '../../test/fixtures/ifc/sectioned-solids.ifc');

describe('sectioned-solids.ifc', () => {
  let result: ModelReadResult;
  beforeAll(async () => {
    result = await readModel(FILE, { glb: 'none' });
  });
  const member = (name: string): MemberRecord => result.members.find((m) => m.name === name)!;

  it('keeps every cross section of an IfcSectionedSolidHorizontal and checks the shallowest', () => {
    const girder = member('G-haunch');
    expect(girder).toMatchObject({ status: 'ok', flags: expect.arrayContaining(['tapered']) });
    const profile = requireIProfile(girder.profile);
    expect(profile.depth_mm).toBe(600);
    expect(profile.along?.map((s) => [s.at, s.dimensions.family === 'I' ? s.dimensions.depth_mm : null])).toEqual([
      [0, 900],
      [2000 / 12000, 900],
      [4000 / 12000, 600],
      [1, 600],
    ]);
    expect(profile.governingAt).toBeCloseTo(4000 / 12000, 12);
    expect(girder.length_mm).toBeCloseTo(12000, 9);
  });

  it('flags a spine whose sections are of different families', () => {
    expect(member('S-spine')).toMatchObject({ status: 'flagged', reason: expect.stringContaining('from one section family to another') });
  });
});
