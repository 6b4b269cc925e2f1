/**
 * The IFC reader's one entry: open the file, read units and members, tessellate and bake the .glb.
 *
 *   const result = await readModel('frame.ifc', { glb: { path: 'frame.glb' }, onProgress: (phase, f) => … });
 *
 * Bad files throw IfcReadError (nothing is returned half-read); a member that cannot be read is returned flagged.
 * Results are a checking aid: they depend on the model's section data and must be confirmed by the engineer of record.
 */
import type { CatalogueSection } from '../catalogue/catalogue-section';
import type { EnYieldRule, GradeId } from '../engine/grades';
import { ElementMeshBuilder, type ElementMesh } from './element-mesh';
import { type GlbElement, glbBytes, writeGlbFile } from './glb-writer';
import { extrudedMesh, iSectionOutline, type Outline, outlineWithCap } from './i-section-mesh';
import { lengthUnitOf } from './length-unit';
import { fromColumns, type Mat4, multiply, type Vec3 } from './matrix4';
import { MemberReader } from './member-reader';
import { offsetFor, streamModelMeshes } from './model-meshes';
import { isIProfile, type MemberRecord, type ModelReadResult } from './model-read-result';
import { openModel } from './open-model';
import { StepLines, textOf } from './step-lines';
import { projectUnits, radiansPerAngleUnit } from './unit-assignment';

export type ReadPhase = 'parse' | 'members' | 'geometry' | 'write';

export interface ReadModelOptions {
  /** Shown in ModelInfo; defaults to the path's base name or the header's FILE_NAME. */
  fileName?: string;
  /** 'bytes' (default) returns the .glb in the result, { path } streams it to a file, 'none' skips geometry. */
  glb?: 'none' | 'bytes' | { path: string };
  /** Grade for members whose material names none; S355 unless the project says otherwise. */
  defaultGrade?: GradeId;
  yieldRule?: EnYieldRule;
  /** An uploaded project catalogue, searched before the built-in tables. */
  projectCatalogue?: readonly CatalogueSection[];
  onProgress?: (phase: ReadPhase, fraction: number) => void;
}

/** IFC (Z up, model units) to glTF (Y up, metres): (x, y, z) → (x, z, −y). */
function gltfFromModel(scaleToMm: number): Mat4 {
  const s = scaleToMm / 1000;
  return fromColumns([s, 0, 0], [0, 0, -s], [0, s, 0], [0, 0, 0]);
}

/** glTF-axis offset back to IFC axes (the modelOffset_m of the glb contract). */
function toIfcAxes(offset: Vec3): [number, number, number] {
  return [offset[0], -offset[2], offset[1]];
}

function baseName(path: string): string {
  return path.split(/[\\/]/).pop() ?? path;
}

interface OwnMeshInput {
  record: MemberRecord;
  reader: MemberReader;
  toGltf: Mat4;
  scaleToMm: number;
  /** Outlines by profile: members of one profile share the same profile object. */
  outlines: WeakMap<object, Outline>;
}

/** Transform and model-unit mesh of a member's extruded I-section, built by us; undefined if it is not extruded. */
function ownMeshPieces({ record, reader, toGltf, scaleToMm, outlines }: OwnMeshInput): { vertices: Float32Array; indices: Uint32Array; transform: Mat4 } | undefined {
  const { profile } = record;
  const solid = isIProfile(profile) ? reader.solidOf(record.expressId) : undefined;
  const extrusion = solid && reader.extrusionOf(solid.solid);
  if (!extrusion || !isIProfile(profile)) return undefined;
  let outline = outlines.get(profile);
  if (!outline) {
    outline = outlineWithCap(iSectionOutline(profile).map(([x, y]) => [x / scaleToMm, y / scaleToMm] as [number, number]));
    outlines.set(profile, outline);
  }
  const { vertices, indices } = extrudedMesh(outline, extrusion.direction, extrusion.depth);
  return { vertices, indices, transform: multiply(toGltf, multiply(solid.placement, extrusion.frame)) };
}

function contextElement(lines: StepLines, mesh: ElementMesh): GlbElement {
  const line = lines.line(mesh.expressId);
  return {
    mesh,
    globalId: textOf(line?.args[0]) ?? `#${mesh.expressId}`,
    ifcClass: lines.typeName(line?.type ?? 0),
    context: true,
  };
}

export async function readModel(source: Uint8Array | string, options: ReadModelOptions = {}): Promise<ModelReadResult> {
  const progress = options.onProgress ?? (() => undefined);
  const glb = options.glb ?? 'bytes';
  progress('parse', 0);
  const opened = await openModel(source);
  try {
    progress('parse', 1);
    const lines = new StepLines(opened.api, opened.modelId, opened.text);
    const units = projectUnits(lines);
    const length = lengthUnitOf(units);
    const reader = new MemberReader(lines, {
      ifc2x3: opened.header.schema === 'IFC2X3',
      scaleToMm: length.scaleToMm,
      radiansPerAngleUnit: radiansPerAngleUnit(units),
      defaultGrade: options.defaultGrade ?? 'S355',
      yieldRule: options.yieldRule ?? 'en10025-2',
      projectCatalogue: options.projectCatalogue,
    });
    const ids = reader.memberIds();
    const members: MemberRecord[] = [];
    progress('members', 0);
    ids.forEach((id, i) => {
      members.push(reader.read(id));
      if (i % 1000 === 999) progress('members', (i + 1) / ids.length);
    });
    progress('members', 1);

    let glbResult: Uint8Array | undefined;
    let meshedElements = 0;
    let contextElements = 0;
    if (glb !== 'none') {
      progress('geometry', 0);
      const streamed = streamModelMeshes(opened.api, opened.modelId, (f) => progress('geometry', 0.9 * f));
      const byId = new Map<number, MemberRecord>(members.map((m) => [m.expressId, m]));
      const elements: GlbElement[] = [];
      const meshed = new Set<number>();
      for (const mesh of streamed.meshes) {
        const member = byId.get(mesh.expressId);
        meshed.add(mesh.expressId);
        elements.push(member ? { mesh, globalId: member.globalId, ifcClass: member.ifcClass, context: false } : contextElement(lines, mesh));
      }
      const toGltf = gltfFromModel(length.scaleToMm);
      let offset = streamed.offset;
      let builder: ElementMeshBuilder | undefined;
      const outlines = new WeakMap<object, Outline>();
      for (const record of members) {
        if (meshed.has(record.expressId) || record.flags.includes('no-representation')) continue;
        const pieces = record.status === 'ok' ? ownMeshPieces({ record, reader, toGltf, scaleToMm: length.scaleToMm, outlines }) : undefined;
        if (!pieces) {
          record.flags.push('no-geometry');
          continue;
        }
        offset ??= offsetFor(pieces.transform);
        builder ??= new ElementMeshBuilder(offset, streamed.store);
        builder.add(pieces.vertices, pieces.indices, pieces.transform);
        const mesh = builder.take(record.expressId);
        if (!mesh) continue;
        record.flags.push('geometry-built');
        elements.push({ mesh, globalId: record.globalId, ifcClass: record.ifcClass, context: false });
      }
      progress('geometry', 1);
      meshedElements = elements.length;
      contextElements = elements.filter((e) => e.context).length;
      const shifted = offset && offset.some((v) => v !== 0) ? toIfcAxes(offset) : undefined;
      const input = { elements, ...(shifted ? { modelOffset_m: shifted } : {}) };
      progress('write', 0);
      if (glb === 'bytes') glbResult = glbBytes(input);
      else writeGlbFile(input, glb.path);
      progress('write', 1);
    }

    const count = (status: MemberRecord['status']): number => members.filter((m) => m.status === status).length;
    const fileName = options.fileName ?? (typeof source === 'string' ? baseName(source) : opened.header.fileName);
    return {
      model: {
        schema: opened.header.schema,
        fileSchema: opened.header.fileSchema,
        ...(opened.header.readAs ? { schemaReadAs: true as const } : {}),
        lengthUnit: length.name,
        lengthScaleToMm: length.scaleToMm,
        ...(opened.header.application ? { application: opened.header.application } : {}),
        ...(fileName ? { fileName } : {}),
        counts: {
          members: members.length,
          ok: count('ok'),
          notApplicable: count('not-applicable'),
          flagged: count('flagged'),
          contextElements,
          meshedElements,
        },
      },
      members,
      ...(glbResult ? { glb: glbResult } : {}),
    };
  } finally {
    opened.close();
  }
}
