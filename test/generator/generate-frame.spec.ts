/**
 * The generator's 'real-exports' and 'brep' output, checked with web-ifc (the general-purpose IFC library, not our
 * reader): every path is in the model with the entities it promises, the schema's own attribute layout parses, and
 * every member tessellates to a body of the section's depth and the member's length. Expected dimensions come from
 * real-export-sections.ts (published tables, each marked there; invented demo girders say so); lengths are the
 * scenario's grid (6000 × 7500 mm bays, 4000 mm storeys, test/generator/frame-layout.ts).
 */
import type { IfcAPI } from 'web-ifc';
import { ifcApi } from '../../server/ifc/open-model';
import { frameLayout } from './frame-layout';
import { type FrameSchema, isRealExportPath, type MemberPath, memberPathOf } from './frame-writer';
import { generateFrame, type GenerateFrameOptions } from './generate-frame';
import { REAL_EXPORT_SECTIONS, type RealExportPath, realExportPaths } from './real-export-sections';
import { type BoxDimensions, overallDepth_mm } from '../../server/engine/section-family';
import { enclosedVolume, type Point3 } from './solid-mesh';

const MEMBERS = 100;

interface OpenedFrame {
  modelId: number;
  /** Member express ids by path. */
  byPath: Map<MemberPath, number[]>;
  layout: ReturnType<typeof frameLayout>;
}

let api: IfcAPI;
beforeAll(async () => {
  api = await ifcApi();
});

const MEMBER_TYPES = ['IFCBEAM', 'IFCCOLUMN', 'IFCMEMBER', 'IFCBEAMSTANDARDCASE'];

function open(options: GenerateFrameOptions & { schema: FrameSchema }): OpenedFrame {
  const modelId = api.OpenModel(new TextEncoder().encode(generateFrame(options)));
  const layout = frameLayout(options.members);
  const byPath = new Map<MemberPath, number[]>();
  for (const typeName of MEMBER_TYPES) {
    const ids = api.GetLineIDsWithType(modelId, api.GetTypeCodeFromName(typeName));
    for (let i = 0; i < ids.size(); i++) {
      const line = api.GetLine(modelId, ids.get(i));
      const slot = layout.slots[Number(String(line.Tag.value).slice(1)) - 1];
      const path = memberPathOf(slot, options.patterns, options.schema);
      byPath.set(path, [...(byPath.get(path) ?? []), ids.get(i)]);
    }
  }
  return { modelId, byPath, layout };
}

/** Entity names reachable from a line, with how often each occurs (web-ifc resolves every reference). */
function entityCounts(modelId: number, expressId: number): Map<string, number> {
  const counts = new Map<string, number>();
  const visit = (value: unknown): void => {
    if (Array.isArray(value)) return value.forEach(visit);
    if (!value || typeof value !== 'object') return;
    const record = value as { type?: number; expressID?: number };
    if (typeof record.type === 'number' && typeof record.expressID === 'number') {
      const name = api.GetNameFromTypeCode(record.type).toUpperCase();
      counts.set(name, (counts.get(name) ?? 0) + 1);
    }
    for (const [key, child] of Object.entries(value)) if (!['ObjectPlacement', 'OwnerHistory', 'ContextOfItems'].includes(key)) visit(child);
  };
  visit(api.GetLine(modelId, expressId, true));
  return counts;
}

interface MeshExtent {
  size_mm: [number, number, number];
  triangles: number;
  volume_mm3: number;
}

/** The bounding box of web-ifc's tessellation of a member, in model units (mm here). */
function meshExtent(modelId: number, expressId: number): MeshExtent {
  const mesh = api.GetFlatMesh(modelId, expressId);
  const min = [Infinity, Infinity, Infinity];
  const max = [-Infinity, -Infinity, -Infinity];
  let triangles = 0;
  let volume_mm3 = 0;
  for (let g = 0; g < mesh.geometries.size(); g++) {
    const placed = mesh.geometries.get(g);
    const geometry = api.GetGeometry(modelId, placed.geometryExpressID);
    const vertices = api.GetVertexArray(geometry.GetVertexData(), geometry.GetVertexDataSize());
    const indices = api.GetIndexArray(geometry.GetIndexData(), geometry.GetIndexDataSize());
    const m = placed.flatTransformation;
    // web-ifc meshes are y-up in metres (the model's mm scaled), so each coordinate is taken back to mm.
    const points: Point3[] = [];
    for (let v = 0; v < vertices.length; v += 6) {
      const [x, y, z] = [vertices[v], vertices[v + 1], vertices[v + 2]];
      const world = [0, 1, 2].map((k) => (m[k] * x + m[4 + k] * y + m[8 + k] * z + m[12 + k]) * 1000);
      world.forEach((value, k) => {
        min[k] = Math.min(min[k], value);
        max[k] = Math.max(max[k], value);
      });
      points.push(world as unknown as Point3);
    }
    const faces: [number, number, number][] = [];
    for (let i = 0; i < indices.length; i += 3) faces.push([indices[i], indices[i + 1], indices[i + 2]]);
    triangles += faces.length;
    volume_mm3 += enclosedVolume(points, faces);
    geometry.delete();
  }
  return { size_mm: [0, 1, 2].map((k) => max[k] - min[k]) as [number, number, number], triangles, volume_mm3 };
}

/** The entities each path must hold (beside its member, placement and material). */
function expectedEntities(path: RealExportPath): Record<string, number | 'some' | 0> {
  const section = REAL_EXPORT_SECTIONS[path];
  const { writing } = section;
  const base: Record<string, number | 'some' | 0> = { [section.ifcType.toUpperCase()]: 'some' };
  switch (writing.kind) {
    case 'outline':
      if (writing.curve === 'indexed') return { ...base, IFCINDEXEDPOLYCURVE: 'some', IFCCARTESIANPOINTLIST2D: 'some', IFCEXTRUDEDAREASOLID: 1 };
      if (writing.curve === 'polyline') return { ...base, IFCPOLYLINE: 'some', IFCTRIMMEDCURVE: 0, IFCEXTRUDEDAREASOLID: 1 };
      return { ...base, IFCCOMPOSITECURVE: 'some', IFCCOMPOSITECURVESEGMENT: 'some', IFCTRIMMEDCURVE: 'some', IFCCIRCLE: 'some', IFCEXTRUDEDAREASOLID: 1 };
    case 'parametric':
      return { ...base, IFCEXTRUDEDAREASOLID: 1 };
    case 'body':
      // Bodies only: no profile and no extrusion anywhere in the member.
      return {
        ...base,
        IFCEXTRUDEDAREASOLID: 0,
        IFCARBITRARYCLOSEDPROFILEDEF: 0,
        ...(writing.body === 'faceted-brep' ? { IFCCLOSEDSHELL: 1, IFCFACE: 'some', IFCPOLYLOOP: 'some' } : { IFCCARTESIANPOINTLIST3D: 1 }),
        ...(section.expected.dimensions.family === 'box' && writing.body !== 'triangulated-face-set'
          ? { [writing.body === 'faceted-brep' ? 'IFCFACEBOUND' : 'IFCINDEXEDPOLYGONALFACEWITHVOIDS']: 2 }
          : {}),
      };
    case 'tapered':
      return { ...base, IFCISHAPEPROFILEDEF: 2, IFCEXTRUDEDAREASOLID: 0 };
  }
}

describe.each(['IFC4', 'IFC2X3'] as const)('real-export patterns in %s, read with web-ifc', (schema) => {
  let frame: OpenedFrame;
  beforeAll(() => {
    frame = open({ members: MEMBERS, schema, patterns: 'real-exports' });
  });
  afterAll(() => api.CloseModel(frame.modelId));

  it(`holds every path of the schema in ${MEMBERS} members, and no IFC4-only path in IFC2X3`, () => {
    const paths = [...realExportPaths(schema, 'beam'), ...realExportPaths(schema, 'column')];
    for (const path of paths) expect({ path, present: frame.byPath.has(path) }).toEqual({ path, present: true });
    const ifc4Only = (Object.keys(REAL_EXPORT_SECTIONS) as RealExportPath[]).filter((p) => REAL_EXPORT_SECTIONS[p].ifc4Only);
    expect(ifc4Only.filter((p) => frame.byPath.has(p))).toEqual(schema === 'IFC2X3' ? [] : ifc4Only);
  });

  it('gives each path the entities it promises', () => {
    const wrong: string[] = [];
    for (const [path, ids] of frame.byPath) {
      if (!isRealExportPath(path)) continue;
      const counts = entityCounts(frame.modelId, ids[0]);
      for (const [entity, expected] of Object.entries(expectedEntities(path))) {
        const found = counts.get(entity) ?? 0;
        if (expected === 'some' ? found === 0 : found !== expected) wrong.push(`${path}: ${found} ${entity}, expected ${expected}`);
      }
    }
    expect(wrong).toEqual([]);
  });

  it('writes some composite segments reversed (SameSense .F.) in the outline trimmed by points', () => {
    const text = generateFrame({ members: MEMBERS, schema, patterns: 'real-exports' });
    expect(text).toMatch(/IFCCOMPOSITECURVESEGMENT\(\.CONTINUOUS\.,\.F\.,/);
    expect(text).toMatch(/IFCTRIMMEDCURVE\(#\d+,\(IFCPARAMETERVALUE\([0-9.E-]+\)\),\(IFCPARAMETERVALUE/);
    expect(text).toMatch(/IFCTRIMMEDCURVE\(#\d+,\(#\d+\),\(#\d+\),\.[TF]\.,\.CARTESIAN\.\)/);
  });

  it('names sections where the table says: profile name, ObjectType, Name or nowhere', () => {
    for (const [path, ids] of frame.byPath) {
      if (!isRealExportPath(path)) continue;
      const { designation, designationIn } = REAL_EXPORT_SECTIONS[path];
      const line = api.GetLine(frame.modelId, ids[0]);
      expect({ path, objectType: line.ObjectType?.value ?? null }).toEqual({ path, objectType: designationIn === 'ObjectType' ? designation : null });
      if (designationIn === 'Name') expect(line.Name.value).toBe(designation);
      else expect(line.Name.value).toMatch(/^[BC]\d+$/);
    }
  });

  it('tessellates every member to the section depth and the member length', () => {
    const wrong: string[] = [];
    for (const [path, ids] of frame.byPath) {
      if (!isRealExportPath(path)) continue;
      const { writing, role, expected } = REAL_EXPORT_SECTIONS[path];
      const depth_mm = writing.kind === 'tapered' ? Math.max(writing.start.depth_mm, writing.end.depth_mm) : overallDepth_mm(expected.dimensions);
      for (const id of ids) {
        const extent = meshExtent(frame.modelId, id);
        // web-ifc is y-up: a column's length and a beam's depth are along y; beams run along x or z.
        const [x, y, z] = extent.size_mm.map((v) => Number(v.toFixed(3)));
        const length_mm = Math.round(role === 'column' ? y : Math.max(x, z));
        const span_mm = role === 'column' ? 4000 : x > z ? 6000 : 7500;
        if (extent.triangles === 0) wrong.push(`${path}: no mesh`);
        else if (length_mm !== span_mm) wrong.push(`${path}: length ${length_mm}, expected ${span_mm} (${x} × ${y} × ${z})`);
        // web-ifc 0.0.78 extrudes IfcCShapeProfileDef flat (zero depth), so only its mesh is checked; it draws circles
        // with about 22 chords, so a tube's extent is its diameter to within cos(π/22), 1 %.
        else if (role === 'beam' && path !== 'cshape' && Math.abs(y - depth_mm) / depth_mm > (path === 'circle-hollow' ? 0.015 : 0.001)) wrong.push(`${path}: depth ${y}, expected ${depth_mm} (${x} × ${y} × ${z})`);
      }
    }
    expect([...new Set(wrong)]).toEqual([]);
  });
});

/** Area of a rectangular hollow section with corner radii: 2·t·(B + H − 2·t) − (4 − π)·(ro² − ri²) for one wall
 * thickness (common practice, no source), with unequal walls for a welded box (sharp corners). */
function hollowArea_mm2(d: BoxDimensions): number {
  const solid = d.width_mm * d.depth_mm - (4 - Math.PI) * (d.outerCornerRadius_mm ?? 0) ** 2;
  const hole = (d.width_mm - 2 * d.webThickness_mm) * (d.depth_mm - 2 * d.flangeThickness_mm) - (4 - Math.PI) * (d.innerCornerRadius_mm ?? 0) ** 2;
  return solid - hole;
}

describe('hollow sections through web-ifc', () => {
  it('keep their void: the tessellated volume is the hollow area times the length (within 1.2 %)', () => {
    const frame = open({ members: MEMBERS, schema: 'IFC4', patterns: 'real-exports' });
    try {
      const measured: Record<string, number> = {};
      for (const [path, ids] of frame.byPath) {
        if (!isRealExportPath(path) || REAL_EXPORT_SECTIONS[path].expected.dimensions.family !== 'box') continue;
        const extent = meshExtent(frame.modelId, ids[0]);
        const length_mm = Math.max(extent.size_mm[0], extent.size_mm[2]);
        const ratio = Math.abs(extent.volume_mm3) / length_mm / hollowArea_mm2(REAL_EXPORT_SECTIONS[path].expected.dimensions as BoxDimensions);
        measured[path] = Number(ratio.toFixed(3));
      }
      expect(Object.keys(measured).sort()).toEqual(['brep-box', 'outline-rounded-rhs', 'outline-welded-box', 'polygonal-box', 'rectangle-hollow', 'triangulated-box']);
      // A filled void would give 4 to 10 times the area; chords across corner arcs take off up to about 1 %.
      for (const [path, ratio] of Object.entries(measured)) expect({ path, within: Math.abs(ratio - 1) <= 0.012, ratio }).toEqual({ path, within: true, ratio });
    } finally {
      api.CloseModel(frame.modelId);
    }
  });
});

describe('header and bodies options', () => {
  it('writes FILE_SCHEMA IFC4X3_RC2 on request, which web-ifc opens as IFC4X3', () => {
    const text = generateFrame({ members: 20, schema: 'IFC4X3', headerSchema: 'IFC4X3_RC2', patterns: 'real-exports' });
    expect(text).toContain("FILE_SCHEMA(('IFC4X3_RC2'));");
    const modelId = api.OpenModel(new TextEncoder().encode(text));
    expect(api.GetModelSchema(modelId)).toMatch(/^IFC4X3/);
    api.CloseModel(modelId);
    expect(() => generateFrame({ members: 20, schema: 'IFC4', headerSchema: 'IFC4X3_RC2' })).toThrow('IFC4X3');
  });

  it.each(['IFC4', 'IFC2X3'] as const)('with brep bodies in %s, every member is an IfcFacetedBrep that tessellates', (schema) => {
    const frame = open({ members: MEMBERS, schema, bodies: 'brep' });
    try {
      const wrong: string[] = [];
      for (const [path, ids] of frame.byPath) {
        for (const id of ids) {
          const counts = entityCounts(frame.modelId, id);
          const swept = [...counts.keys()].filter((name) => name.includes('PROFILEDEF') || name.startsWith('IFCEXTRUDEDAREASOLID'));
          if (counts.get('IFCFACETEDBREP') !== 1 || swept.length > 0) wrong.push(`${path}: ${[...counts.keys()].join(' ')}`);
          else if (meshExtent(frame.modelId, id).triangles === 0) wrong.push(`${path}: no mesh`);
        }
      }
      expect([...new Set(wrong)]).toEqual([]);
    } finally {
      api.CloseModel(frame.modelId);
    }
  });
});
