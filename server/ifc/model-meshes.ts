/**
 * Tessellation of every element by web-ifc (StreamAllMeshes), merged per element into glTF space. web-ifc already
 * hands out transforms into metres with Y up; models far from the origin are shifted by a whole-metre offset taken
 * from the first piece, so that 32-bit vertex positions keep millimetre precision.
 */
import type { IfcAPI } from 'web-ifc';
import { ElementMeshBuilder, type ElementMesh, FLOATS_PER_VERTEX, MeshStore } from './element-mesh';

/** Beyond this distance from the origin (metres, any axis) the model is shifted. */
const SHIFT_BEYOND_M = 1000;

export interface StreamedMeshes {
  meshes: ElementMesh[];
  /** Where the meshes are stored; further meshes of the model go there too. */
  store: MeshStore;
  /** Subtracted from every position, in glTF axes and metres; undefined when web-ifc produced no piece at all. */
  offset: [number, number, number] | undefined;
}

export function offsetFor(transform: ArrayLike<number>): [number, number, number] {
  const t = [transform[12], transform[13], transform[14]];
  return t.some((v) => Math.abs(v) > SHIFT_BEYOND_M) ? [Math.round(t[0]), Math.round(t[1]), Math.round(t[2])] : [0, 0, 0];
}

interface WasmHeaps {
  HEAPF32: Float32Array;
  HEAPU32: Uint32Array;
}

export function streamModelMeshes(api: IfcAPI, modelId: number, onProgress: (fraction: number) => void): StreamedMeshes {
  const meshes: ElementMesh[] = [];
  const store = new MeshStore();
  let offset: [number, number, number] | undefined;
  let builder: ElementMeshBuilder | undefined;
  const heaps = api.wasmModule as WasmHeaps;
  api.StreamAllMeshes(modelId, (mesh, index, total) => {
    const pieces = mesh.geometries;
    const count = pieces.size();
    for (let i = 0; i < count; i++) {
      const placed = pieces.get(i);
      offset ??= offsetFor(placed.flatTransformation);
      builder ??= new ElementMeshBuilder(offset, store);
      const geometry = api.GetGeometry(modelId, placed.geometryExpressID);
      const vertexPtr = geometry.GetVertexData() / 4;
      const indexPtr = geometry.GetIndexData() / 4;
      // Views into web-ifc's memory, read straight away by add(): saves copying every vertex twice.
      const vertices = heaps.HEAPF32.subarray(vertexPtr, vertexPtr + geometry.GetVertexDataSize());
      const indices = heaps.HEAPU32.subarray(indexPtr, indexPtr + geometry.GetIndexDataSize());
      if (vertices.length % FLOATS_PER_VERTEX === 0) builder.add(vertices, indices, placed.flatTransformation);
      geometry.delete();
    }
    const merged = builder?.take(mesh.expressID);
    if (merged) meshes.push(merged);
    if (total > 0 && (index % 256 === 0 || index === total - 1)) onProgress((index + 1) / total);
  });
  return { meshes, store, offset };
}
