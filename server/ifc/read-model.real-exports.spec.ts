/**
 * A generated model holding every way real exports give a section (test/generator/real-export-sections.ts): outlines
 * with arcs and voids, parametric profiles of every family, bodies only (faceted breps and face sets, with and without a
 * name), tapered members and an IFC4X3_RC2 header. Each member must come back with the family, the source and the
 * dimensions the generator wrote — or, for a tapered member, never with its larger end. Dimensions of the named
 * sections are the generator's (EN 10365, EN 10056-1, AS/NZS 3679.1 / 1163, EN 10219-2 — from memory, see that file).
 */
import { frameLayout } from '../../test/generator/frame-layout';
import { generateFrame } from '../../test/generator/generate-frame';
import { type FrameSchema, isRealExportPath, memberPathOf } from '../../test/generator/frame-writer';
import { REAL_EXPORT_SECTIONS, type RealExportSection } from '../../test/generator/real-export-sections';
import { dimensionValues, overallDepth_mm, type SectionDimensions } from '../engine/section-family';
import { type MemberRecord, type ModelReadResult, sectionDimensionsOf } from './model-read-result';
import { readModel } from './read-model';

const MEMBERS = 200;

function bytes(text: string): Uint8Array {
  return new TextEncoder().encode(text);
}

/**
 * Plates and extents to 0.1 % (outline arcs are chorded to 0.005 % of the depth, body cuts are exact on planar faces);
 * radii to 1 % from a curve's arcs, but 20 % from a body, whose fillets are three facets per quarter circle.
 */
function expectSameSection(actual: SectionDimensions, expected: SectionDimensions, fromBody: boolean, label: string): void {
  expect({ label, family: actual.family }).toEqual({ label, family: expected.family });
  const got = dimensionValues(actual);
  for (const [key, want] of Object.entries(dimensionValues(expected))) {
    const radius = /radius|slope/i.test(key);
    // An optional radius left out means none.
    if (radius && got[key] === undefined) got[key] = 0;
    const tolerance = radius ? (fromBody ? 0.2 : 0.01) * Math.max(want, 1) : 1e-3 * Math.max(want, overallDepth_mm(expected) / 100);
    expect({ label, key, value: got[key] ?? null }).toEqual({ label, key, value: expect.any(Number) });
    expect({ label, key, off: Math.abs(got[key] - want) <= tolerance }).toEqual({ label, key, off: true });
  }
}

function sectionOfPath(member: MemberRecord, schema: FrameSchema): RealExportSection | undefined {
  // Tags are written as T<position in the layout, from 1>.
  const slot = frameLayout(MEMBERS).slots[Number(member.tag!.slice(1)) - 1];
  const path = memberPathOf(slot, 'real-exports', schema);
  return isRealExportPath(path) ? REAL_EXPORT_SECTIONS[path] : undefined;
}

describe.each(['IFC4', 'IFC2X3'] as const)('real-export patterns, %s', (schema) => {
  let result: ModelReadResult;
  beforeAll(async () => {
    result = await readModel(bytes(generateFrame({ members: MEMBERS, schema, patterns: 'real-exports' })), { glb: 'none' });
  });

  it('reads every pattern with the family, source and dimensions written', () => {
    const seen = new Set<string>();
    for (const member of result.members) {
      const written = sectionOfPath(member, schema);
      if (!written) continue;
      const path = `${member.tag} ${written.ifcType} ${written.designation ?? '(no name)'}`;
      seen.add(written.ifcType + written.expected.foundBy);
      const { expected } = written;
      // Plates and other shapes have no shear rule; every other family is read for checking.
      const listedOnly = expected.dimensions.family === 'plate' || expected.dimensions.family === 'other';
      expect({ path, status: member.status, reason: member.reason }).toEqual({
        path,
        status: listedOnly ? 'not-applicable' : 'ok',
        reason: listedOnly ? expect.stringContaining('no web shear rule for this family') : undefined,
      });
      expect({ path, source: member.profile?.source }).toEqual({ path, source: expected.foundBy });
      const profile = member.profile!;
      if (expected.endDimensions) {
        // Tapered: both ends kept, the smaller governs (never the larger end).
        expect(profile.along?.map((s) => s.at)).toEqual([0, 1]);
        expectSameSection(profile.along![0].dimensions, expected.dimensions, false, `${path} start`);
        expectSameSection(profile.along![1].dimensions, expected.endDimensions, false, `${path} end`);
        const smaller = overallDepth_mm(expected.endDimensions) < overallDepth_mm(expected.dimensions) ? expected.endDimensions : expected.dimensions;
        expectSameSection(sectionDimensionsOf(profile), smaller, false, `${path} governing`);
        expect(member.flags).toContain('tapered');
        continue;
      }
      expectSameSection(sectionDimensionsOf(profile), expected.dimensions, expected.foundBy === 'body-cut', path);
      if (member.status === 'ok') expect(member.section!.area_mm2).toBeGreaterThan(0);
    }
    // Every pattern of the schema was met.
    const patterns = Object.values(REAL_EXPORT_SECTIONS).filter((s) => schema === 'IFC4' || !s.ifc4Only);
    expect(seen.size).toBe(new Set(patterns.map((s) => s.ifcType + s.expected.foundBy)).size);
  });

  it('gives every body-only member an axis and a length from its body', () => {
    for (const member of result.members) {
      if (sectionOfPath(member, schema)?.expected.foundBy !== 'body-cut') continue;
      expect({ tag: member.tag, axis: member.axis !== null, length: (member.length_mm ?? 0) > 0 }).toEqual({ tag: member.tag, axis: true, length: true });
    }
  });
});

describe('an IFC4X3_RC2 header', () => {
  it('is read as IFC4X3 with the members, and the model says it was read as such', async () => {
    const text = generateFrame({ members: 60, schema: 'IFC4X3', headerSchema: 'IFC4X3_RC2' });
    const result = await readModel(bytes(text), { glb: 'none' });
    expect(result.model).toMatchObject({ fileSchema: 'IFC4X3_RC2', schema: 'IFC4X3', schemaReadAs: true });
    expect(result.model.counts).toMatchObject({ members: 60, ok: 60, notApplicable: 0, flagged: 0 });
  });
});
