/**
 * Generated frames (test/generator) in every schema and length unit: each profile path comes back with the section
 * the generator wrote. The rolled sections are the catalogue's (EN 10365 and AISC Shapes Database v15.0 values, see
 * server/catalogue), the welded ones invented; lengths are the scenario's grid (6000 × 7500 mm bays, 4000 mm storeys).
 */
import { type Document, WebIO } from '@gltf-transform/core';
import type { FrameLayout } from '../../test/generator/frame-layout';
import { imperialSections, metricSections } from '../../test/generator/frame-sections';
import { FAR_SITE_ORIGIN_MM, generateFrame } from '../../test/generator/generate-frame';
import { type FrameSchema, type FrameUnit, pathOf, sectionOf } from '../../test/generator/frame-writer';
import { frameLayout } from '../../test/generator/frame-layout';
import { MM_PER_FT, MM_PER_IN } from '../engine/units';
import { type MemberRecord, type ModelReadResult, requireIProfile } from './model-read-result';
import { readModel } from './read-model';

const MEMBERS = 100;
const SCHEMAS: readonly FrameSchema[] = ['IFC4', 'IFC2X3', 'IFC4X3'];
const UNITS: readonly FrameUnit[] = ['mm', 'm', 'inch', 'foot'];
/** Exact definitions: 1 in = 25.4 mm, 1 ft = 304.8 mm (International Yard and Pound Agreement, 1959; server/engine/units.ts). */
const EXPECTED_UNIT: Record<FrameUnit, { name: string; scaleToMm: number }> = {
  mm: { name: 'millimetre', scaleToMm: 1 },
  m: { name: 'metre', scaleToMm: 1000 },
  inch: { name: 'inch', scaleToMm: MM_PER_IN },
  foot: { name: 'foot', scaleToMm: MM_PER_FT },
};

function expectClose(actual: number | null | undefined, expected: number, relative = 1e-9): void {
  expect(actual).not.toBeNull();
  expect(Math.abs((actual as number) - expected)).toBeLessThanOrEqual(relative * Math.max(1, Math.abs(expected)));
}

function bytes(text: string): Uint8Array {
  return new TextEncoder().encode(text);
}

function slotOf(layout: FrameLayout, member: MemberRecord): FrameLayout['slots'][number] {
  // Tags are written as T<position in the layout, from 1>.
  return layout.slots[Number(member.tag!.slice(1)) - 1];
}

describe.each(SCHEMAS.flatMap((schema) => UNITS.map((unit) => [schema, unit] as const)))('generated frame, %s in %s', (schema, unit) => {
  const layout = frameLayout(MEMBERS);
  const sections = unit === 'inch' || unit === 'foot' ? imperialSections() : metricSections();
  let result: ModelReadResult;
  beforeAll(async () => {
    result = await readModel(bytes(generateFrame({ members: MEMBERS, schema, unit })), { glb: 'none' });
  });

  it('reads the unit and every member', () => {
    expect(result.model).toMatchObject({ schema, lengthUnit: EXPECTED_UNIT[unit].name, lengthScaleToMm: EXPECTED_UNIT[unit].scaleToMm });
    expect(result.members).toHaveLength(MEMBERS);
  });

  it('gives each path the section the generator wrote', () => {
    for (const member of result.members) {
      const path = pathOf(slotOf(layout, member));
      const spec = sectionOf(path, sections, schema);
      if (spec.kind !== 'i') {
        // Read with the family and dimensions the file gives, and checked through their outline.
        expect({ path, status: member.status }).toEqual({ path, status: 'ok' });
        expect(member.section!.area_mm2).toBeGreaterThan(0);
        expect(member.profile).toMatchObject(
          spec.kind === 'tube' ? { family: 'tube', source: 'ifc-profile', ifcType: 'IfcCircleHollowProfileDef' } : { family: 'angle', source: 'ifc-profile', ifcType: 'IfcLShapeProfileDef' },
        );
        continue;
      }
      expect({ path, status: member.status, reason: member.reason }).toEqual({ path, status: 'ok', reason: undefined });
      const profile = requireIProfile(member.profile);
      // Geometry first: an outline is measured, its name only cross-checked.
      expect(profile.source).toBe(path === 'name-only-outline' ? 'outline' : 'ifc-profile');
      expect(profile.ifcType).toBe(
        path === 'name-only-outline' ? 'IfcArbitraryClosedProfileDef' : path === 'asymmetric' ? 'IfcAsymmetricIShapeProfileDef' : 'IfcIShapeProfileDef',
      );
      expect(profile.fabrication).toBe(spec.input.fabrication);
      expectClose(profile.depth_mm, spec.input.depth_mm);
      expectClose(profile.webThickness_mm, spec.input.webThickness_mm);
      for (const flange of ['topFlange', 'bottomFlange'] as const) {
        expectClose(profile[flange].width_mm, spec.input[flange].width_mm);
        expectClose(profile[flange].thickness_mm, spec.input[flange].thickness_mm);
        // The generator draws this outline without root fillets: the section is measured as drawn, not as named.
        expectClose(profile[flange].filletRadius_mm, path === 'name-only-outline' ? 0 : spec.input[flange].filletRadius_mm);
        if (spec.input[flange].slope_rad && schema !== 'IFC2X3') expectClose(profile[flange].slope_rad, spec.input[flange].slope_rad!);
      }
      expect(member.section!.area_mm2).toBeGreaterThan(0);
    }
  });

  it('reads lengths, axes and storeys in model coordinates', () => {
    for (const member of result.members) {
      const slot = slotOf(layout, member);
      const span = Math.hypot(...slot.end_mm.map((v, i) => v - slot.start_mm[i]));
      expectClose(member.length_mm, span);
      expect(member.storey).toBe(`Level ${String(slot.storey + 1).padStart(2, '0')}`);
      // Beams without an Axis representation take the extrusion's centre line, half the depth below the reference line.
      const drop = pathOf(slot) === 'extrusion-only' ? requireIProfile(member.profile).depth_mm / 2 : 0;
      slot.start_mm.forEach((v, i) => expectClose(member.axis!.start_mm[i], i === 2 ? v - drop : v, 1e-9));
      slot.end_mm.forEach((v, i) => expectClose(member.axis!.end_mm[i], i === 2 ? v - drop : v, 1e-9));
    }
  });

  it('reads materials and grades, with the default grade assumed for a name without one', () => {
    const extrusionOnly = result.members.find((m) => pathOf(slotOf(layout, m)) === 'extrusion-only')!;
    expect(extrusionOnly.material).toMatchObject({ name: 'Steel', grade: 'S355', assumed: true });
    expect(extrusionOnly.flags).toContain('assumed-grade');
    const mapped = result.members.find((m) => pathOf(slotOf(layout, m)) === 'mapped-type')!;
    // The mapped beams get their material from their type (IfcRelAssociatesMaterial on the IfcBeamType).
    expect(mapped.material).toMatchObject({ name: unit === 'mm' || unit === 'm' ? 'S275JR' : 'A36', assumed: false });
    const profileSet = result.members.find((m) => pathOf(slotOf(layout, m)) === 'material-profile-set')!;
    expect(profileSet.material).toMatchObject({ name: unit === 'mm' || unit === 'm' ? 'S460M' : 'A572 Gr 50', assumed: false });
  });
});

describe('generated frame geometry', () => {
  let result: ModelReadResult;
  let document: Document;
  const layout = frameLayout(MEMBERS);
  beforeAll(async () => {
    result = await readModel(bytes(generateFrame({ members: MEMBERS, schema: 'IFC2X3', unit: 'foot' })));
    document = await new WebIO().readBinary(result.glb!);
  });

  it('has a glb node for every member and, as context, for every slab', () => {
    const nodes = document.getRoot().listNodes();
    const members = nodes.filter((n) => !(n.getExtras() as { context: boolean }).context);
    const context = nodes.filter((n) => (n.getExtras() as { context: boolean }).context);
    expect(members.map((n) => n.getName()).sort()).toEqual(result.members.map((m) => m.globalId).sort());
    expect(context.map((n) => (n.getExtras() as { ifcClass: string }).ifcClass)).toEqual(Array(layout.storeys).fill('IfcSlab'));
    expect(result.model.counts).toMatchObject({ contextElements: layout.storeys, meshedElements: MEMBERS + layout.storeys });
  });

  it('builds the asymmetric girders itself (web-ifc 0.0.78 does not tessellate IfcAsymmetricIShapeProfileDef)', () => {
    const asymmetric = result.members.filter((m) => pathOf(slotOf(layout, m)) === 'asymmetric');
    expect(asymmetric.length).toBeGreaterThan(0);
    for (const girder of asymmetric) expect(girder.flags).toContain('geometry-built');
    const node = document.getRoot().listNodes().find((n) => n.getName() === asymmetric[0].globalId)!;
    const position = node.getMesh()!.listPrimitives()[0].getAttribute('POSITION')!;
    // A girder along model Y, 7500 mm long, hanging 36 in deep below the floor: glTF z spans the length, y the depth.
    expectClose(position.getMax([])[2] - position.getMin([])[2], 7.5, 1e-6);
    expectClose(position.getMax([])[1] - position.getMin([])[1], (36 * MM_PER_IN) / 1000, 1e-6);
  });
});

describe('generated frame far from the origin', () => {
  it('shifts the glb towards the origin and states the offset, keeping model coordinates in the records', async () => {
    const result = await readModel(bytes(generateFrame({ members: MEMBERS, schema: 'IFC4', unit: 'm', siteOrigin_mm: FAR_SITE_ORIGIN_MM })));
    const layout = frameLayout(MEMBERS);
    const first = result.members.find((m) => m.tag === 'T1')!;
    layout.slots[0].start_mm.forEach((v, i) => expectClose(first.axis!.start_mm[i], v + FAR_SITE_ORIGIN_MM[i], 1e-12));
    const document = await new WebIO().readBinary(result.glb!);
    const offset = (document.getRoot().listScenes()[0].getExtras() as { modelOffset_m: number[] }).modelOffset_m;
    // Whole metres close to the site origin (485 km east, 5270 km north, 12 m up).
    expect(Math.abs(offset[0] - 485_000)).toBeLessThan(100);
    expect(Math.abs(offset[1] - 5_270_000)).toBeLessThan(100);
    for (const node of document.getRoot().listNodes()) {
      const position = node.getMesh()!.listPrimitives()[0].getAttribute('POSITION')!;
      expect(Math.max(...position.getMax([]).map(Math.abs), ...position.getMin([]).map(Math.abs))).toBeLessThan(1000);
    }
    // IFC model coordinates = glTF converted back to IFC axes + modelOffset_m: the first column's base, in metres.
    const column = document.getRoot().listNodes().find((n) => n.getName() === first.globalId)!;
    const min = column.getMesh()!.listPrimitives()[0].getAttribute('POSITION')!.getMin([]);
    expectClose(min[1] + offset[2], (FAR_SITE_ORIGIN_MM[2] + layout.slots[0].start_mm[2]) / 1000, 1e-6);
  });
});
