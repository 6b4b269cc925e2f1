/**
 * Sections a reader must refuse rather than guess (test/fixtures/ifc/bad-sections.ifc, hand-written, invented): each
 * member is flagged with a plain reason — never a crash, a NaN, or a section it does not have.
 */
import * as path from 'node:path';
import type { MemberRecord, ModelReadResult } from './model-read-result';
import { readModel } from './read-model';

const FILE = path.resolve(__dirname, '../../test/fixtures/ifc/bad-sections.ifc');

describe('bad-sections.ifc', () => {
  let result: ModelReadResult;
  beforeAll(async () => {
    result = await readModel(FILE, { glb: 'bytes' });
  });
  const member = (name: string): MemberRecord => result.members.find((m) => m.name === name)!;

  it.each([
    ['B-zero', 'zero-length', 'The member has no length'],
    ['B-open', 'profile-not-in-catalogue', 'it is open: a gap of 300 mm'],
    ['B-bowtie', 'profile-not-in-catalogue', "outline 'PL-CROSSED-1' encloses no area"],
    ['B-offset', 'section-unrecognised', 'its top flange is off-centre from the web by 40 mm'],
    ['B-pair', 'section-unrecognised', "The body cannot be one member's section: Its body (IfcFacetedBrep) gives no section: the cut gives 2 separate pieces"],
  ])('flags %s (%s) with its reason', (name, flag, words) => {
    const m = member(name);
    expect(m).toMatchObject({ status: 'flagged', flags: expect.arrayContaining([flag]), reason: expect.stringContaining(words) });
    // Never a NaN anywhere in the record (a zero-length member keeps the section it has; flagged members are not checked).
    if (name !== 'B-zero') expect(m.section).toBeNull();
    expect(JSON.stringify(m)).not.toMatch(/NaN|null,"reason":""/);
  });

  it('does not take a name (IPE 300) as the section of an outline or a body that contradicts it', () => {
    expect(member('B-offset').profile).toBeNull();
    expect(member('B-pair').profile).toBeNull();
  });

  it('counts every member flagged and still bakes the geometry', () => {
    expect(result.model.counts).toMatchObject({ members: 5, ok: 0, flagged: 5 });
    expect(result.glb?.byteLength).toBeGreaterThan(0);
  });
});
