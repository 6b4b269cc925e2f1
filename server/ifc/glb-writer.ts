/**
 * Writes a model's geometry as one glTF 2.0 binary (.glb).
 *
 * CONTRACT for the 3D viewer (keep in step with src/app/viewer):
 * - One node per IFC element, in scene 0. node.name = the element's GlobalId; node.extras =
 *   { globalId: string, expressId: number, ifcClass: string, context: boolean } — context is true for elements that
 *   are not beams, columns or members (slabs, walls, plates, …), shown only for orientation.
 * - Each node has its own mesh with one triangle primitive: attributes POSITION and NORMAL (float32 VEC3), indices
 *   (uint16, or uint32 above 65,535 vertices). Material 0 'member' (opaque grey), material 1 'context' (translucent).
 * - Coordinates in metres, glTF Y up: (x, y, z)_IFC → (x, z, −y)_glTF. Node transforms are identity: vertices are
 *   in scene coordinates.
 * - Far-off models are shifted towards the origin: then scene.extras = { modelOffset_m: [x, y, z] }, in IFC axes,
 *   with IFC model coordinates = (glTF coordinates converted back to IFC axes) + modelOffset_m.
 *
 * The file is written by hand rather than through a general glTF library: a property graph of 20,000 nodes and 60,000
 * accessors took seconds and hundreds of MB, here the JSON is built once and the binary chunk is streamed. The tests
 * read the result back with @gltf-transform/core.
 */
import * as fs from 'node:fs';
import type { ElementMesh } from './element-mesh';

export interface GlbElement {
  mesh: ElementMesh;
  globalId: string;
  ifcClass: string;
  context: boolean;
}

export interface GlbInput {
  elements: readonly GlbElement[];
  /** IFC axes, metres; omitted when the model was not shifted. */
  modelOffset_m?: [number, number, number];
}

const GLB_MAGIC = 0x46546c67;
const CHUNK_JSON = 0x4e4f534a;
const CHUNK_BIN = 0x004e4942;
const FLOAT = 5126;
const UNSIGNED_SHORT = 5123;
const UNSIGNED_INT = 5125;
const ARRAY_BUFFER = 34962;
const ELEMENT_ARRAY_BUFFER = 34963;
const VERTEX_STRIDE = 24;

const MATERIALS = [
  { name: 'member', pbrMetallicRoughness: { baseColorFactor: [0.6, 0.62, 0.64, 1], metallicFactor: 0, roughnessFactor: 0.8 } },
  {
    name: 'context',
    alphaMode: 'BLEND',
    doubleSided: true,
    pbrMetallicRoughness: { baseColorFactor: [0.86, 0.87, 0.88, 0.3], metallicFactor: 0, roughnessFactor: 1 },
  },
];

const align4 = (n: number): number => (n + 3) & ~3;

interface Layout {
  json: Uint8Array;
  vertexBytes: number;
  indexBytes: number;
}

function layout(input: GlbInput): Layout {
  const nodes: object[] = [];
  const meshes: object[] = [];
  const accessors: object[] = [];
  let vertexOffset = 0;
  let indexOffset = 0;
  input.elements.forEach((element, i) => {
    const { mesh } = element;
    const count = mesh.vertices.length / 6;
    const wide = mesh.indices instanceof Uint32Array;
    const a = accessors.length;
    accessors.push(
      { bufferView: 0, byteOffset: vertexOffset, componentType: FLOAT, count, type: 'VEC3', min: mesh.min, max: mesh.max },
      { bufferView: 0, byteOffset: vertexOffset + 12, componentType: FLOAT, count, type: 'VEC3' },
      { bufferView: 1, byteOffset: indexOffset, componentType: wide ? UNSIGNED_INT : UNSIGNED_SHORT, count: mesh.indices.length, type: 'SCALAR' },
    );
    meshes.push({ primitives: [{ attributes: { POSITION: a, NORMAL: a + 1 }, indices: a + 2, material: element.context ? 1 : 0, mode: 4 }] });
    nodes.push({
      name: element.globalId,
      mesh: i,
      extras: { globalId: element.globalId, expressId: mesh.expressId, ifcClass: element.ifcClass, context: element.context },
    });
    vertexOffset += mesh.vertices.byteLength;
    indexOffset = align4(indexOffset + mesh.indices.byteLength);
  });
  const scene: Record<string, unknown> = { name: 'model', nodes: nodes.map((_, i) => i) };
  if (input.modelOffset_m) scene.extras = { modelOffset_m: input.modelOffset_m };
  const gltf: Record<string, unknown> = {
    asset: { version: '2.0', generator: 'Taulens IFC reader' },
    scene: 0,
    scenes: [scene],
    nodes,
    materials: MATERIALS,
  };
  if (nodes.length > 0) {
    Object.assign(gltf, {
      meshes,
      accessors,
      bufferViews: [
        { buffer: 0, byteOffset: 0, byteLength: vertexOffset, byteStride: VERTEX_STRIDE, target: ARRAY_BUFFER },
        { buffer: 0, byteOffset: vertexOffset, byteLength: indexOffset, target: ELEMENT_ARRAY_BUFFER },
      ],
      buffers: [{ byteLength: vertexOffset + indexOffset }],
    });
  }
  return { json: new TextEncoder().encode(JSON.stringify(gltf)), vertexBytes: vertexOffset, indexBytes: indexOffset };
}

function chunkHeader(length: number, type: number): Uint8Array {
  const header = new Uint8Array(8);
  const view = new DataView(header.buffer);
  view.setUint32(0, length, true);
  view.setUint32(4, type, true);
  return header;
}

const bytesOf = (array: Float32Array | Uint16Array | Uint32Array): Uint8Array => new Uint8Array(array.buffer, array.byteOffset, array.byteLength);

/** Streams the .glb to `sink` in pieces; returns its length in bytes. */
function writeGlb(input: GlbInput, sink: (bytes: Uint8Array) => void): number {
  const { json, vertexBytes, indexBytes } = layout(input);
  const jsonLength = align4(json.byteLength);
  const binLength = vertexBytes + indexBytes;
  const total = 12 + 8 + jsonLength + (binLength > 0 ? 8 + binLength : 0);
  const header = new Uint8Array(12);
  const view = new DataView(header.buffer);
  view.setUint32(0, GLB_MAGIC, true);
  view.setUint32(4, 2, true);
  view.setUint32(8, total, true);
  sink(header);
  sink(chunkHeader(jsonLength, CHUNK_JSON));
  sink(json);
  if (jsonLength > json.byteLength) sink(new Uint8Array(jsonLength - json.byteLength).fill(0x20));
  if (binLength === 0) return total;
  sink(chunkHeader(binLength, CHUNK_BIN));
  for (const { mesh } of input.elements) sink(bytesOf(mesh.vertices));
  for (const { mesh } of input.elements) {
    sink(bytesOf(mesh.indices));
    const padding = align4(mesh.indices.byteLength) - mesh.indices.byteLength;
    if (padding > 0) sink(new Uint8Array(padding));
  }
  return total;
}

export function glbBytes(input: GlbInput): Uint8Array {
  const pieces: Uint8Array[] = [];
  const total = writeGlb(input, (bytes) => pieces.push(bytes));
  const out = new Uint8Array(total);
  let at = 0;
  for (const piece of pieces) {
    out.set(piece, at);
    at += piece.byteLength;
  }
  return out;
}

/**
 * Writes the .glb to a file without holding it in memory a second time. It is written beside the target and renamed
 * at the end, so a failure leaves no half-written file.
 */
export function writeGlbFile(input: GlbInput, path: string): number {
  const partial = `${path}.partial`;
  try {
    const total = writeBuffered(input, partial);
    fs.renameSync(partial, path);
    return total;
  } catch (error) {
    fs.rmSync(partial, { force: true });
    throw error;
  }
}

/** Gathers the many small pieces (two per element) into 1 MB writes. */
function writeBuffered(input: GlbInput, path: string): number {
  const fd = fs.openSync(path, 'w');
  const buffer = Buffer.alloc(1 << 20);
  let used = 0;
  const flush = (): void => {
    if (used > 0) fs.writeSync(fd, buffer, 0, used);
    used = 0;
  };
  try {
    const total = writeGlb(input, (bytes) => {
      if (used + bytes.byteLength > buffer.length) flush();
      if (bytes.byteLength > buffer.length) fs.writeSync(fd, bytes);
      else {
        buffer.set(bytes, used);
        used += bytes.byteLength;
      }
    });
    flush();
    return total;
  } finally {
    fs.closeSync(fd);
  }
}
