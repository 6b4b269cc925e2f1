/**
 * Turns the loaded glTF scene (one node per element, see the glb contract in the ingest) into two batches: the
 * members, opaque and coloured per instance, and the context elements (slabs, walls…), see-through pale grey.
 * A batch draws all its elements in one multi-draw call; colour and visibility change per instance in small
 * textures without touching the geometry buffers.
 */
import {
  BatchedMesh,
  BufferAttribute,
  BufferGeometry,
  type Material,
  type Mesh,
  type Object3D,
  type Texture,
} from 'three';
import { ElementIndex } from './element-index';
import type { GpuResources } from './gpu-resources';
import { MAX_PICKABLE_INSTANCES } from './pick-id';

export interface ModelBatch {
  mesh: BatchedMesh;
  index: ElementIndex;
}

export interface ModelBatches {
  members: ModelBatch | null;
  context: ModelBatch | null;
  /** Meshes that named no element (no GlobalId on them or their nodes), left out of the view. */
  skippedMeshes: number;
}

interface ElementMeshes {
  globalId: string;
  context: boolean;
  meshes: Mesh[];
}

/** The element a mesh belongs to: the nearest node, itself included, that carries a GlobalId. */
function owningElement(mesh: Object3D): { globalId: string; context: boolean } | null {
  for (let node: Object3D | null = mesh; node !== null; node = node.parent) {
    const data = node.userData as { globalId?: unknown; name?: unknown; context?: unknown };
    // The contract puts the GlobalId in the node's extras; the node name carries it too.
    const globalId = [data.globalId, data.name].find((v): v is string => typeof v === 'string' && v !== '');
    if (globalId !== undefined) return { globalId, context: data.context === true };
  }
  return null;
}

function isPlainMesh(object: Object3D): object is Mesh {
  const flags = object as Partial<Record<'isMesh' | 'isInstancedMesh' | 'isBatchedMesh' | 'isSkinnedMesh', boolean>>;
  return flags.isMesh === true && !flags.isInstancedMesh && !flags.isBatchedMesh && !flags.isSkinnedMesh;
}

function collectElements(scene: Object3D): { members: ElementMeshes[]; context: ElementMeshes[]; skipped: number } {
  const byGlobalId = new Map<string, ElementMeshes>();
  let skipped = 0;
  scene.traverse((object) => {
    if (!isPlainMesh(object)) return;
    const owner = owningElement(object);
    if (owner === null) {
      skipped++;
      return;
    }
    const element = byGlobalId.get(owner.globalId);
    if (element === undefined) byGlobalId.set(owner.globalId, { ...owner, meshes: [object] });
    else element.meshes.push(object);
  });
  const elements = [...byGlobalId.values()];
  return { members: elements.filter((e) => !e.context), context: elements.filter((e) => e.context), skipped };
}

/** A float position attribute, whatever the file stored (quantised or interleaved data is unpacked). */
function float32Attribute(attribute: BufferGeometry['attributes'][string]): BufferAttribute {
  if (attribute instanceof BufferAttribute && attribute.array instanceof Float32Array && !attribute.normalized) {
    return attribute;
  }
  const values = new Float32Array(attribute.count * 3);
  for (let i = 0; i < attribute.count; i++) {
    values[i * 3] = attribute.getX(i);
    values[i * 3 + 1] = attribute.getY(i);
    values[i * 3 + 2] = attribute.getZ(i);
  }
  return new BufferAttribute(values, 3);
}

/**
 * The geometry as a batch takes it: every geometry of one batch must carry the same attributes, so only position,
 * normal and an index are kept (normals computed and an index made where the file has none).
 */
function batchableGeometry(source: BufferGeometry): BufferGeometry {
  const geometry = new BufferGeometry();
  const position = float32Attribute(source.getAttribute('position'));
  geometry.setAttribute('position', position);
  const normal = source.getAttribute('normal');
  if (normal !== undefined) geometry.setAttribute('normal', float32Attribute(normal));
  const index = source.getIndex();
  geometry.setIndex(index ?? new BufferAttribute(Uint32Array.from({ length: position.count }, (_, i) => i), 1));
  if (normal === undefined) geometry.computeVertexNormals();
  // Computed here, where the positions are contiguous, the batch copies them instead of walking its own index.
  geometry.computeBoundingBox();
  geometry.computeBoundingSphere();
  return geometry;
}

function buildBatch(
  elements: readonly ElementMeshes[],
  material: Material,
  resources: GpuResources,
): ModelBatch | null {
  if (elements.length === 0) return null;
  const batchable = new Map<BufferGeometry, BufferGeometry>();
  let vertexCount = 0;
  let indexCount = 0;
  let instanceCount = 0;
  for (const element of elements) {
    for (const mesh of element.meshes) {
      instanceCount++;
      if (batchable.has(mesh.geometry) || mesh.geometry.getAttribute('position') === undefined) continue;
      const geometry = batchableGeometry(mesh.geometry);
      batchable.set(mesh.geometry, geometry);
      vertexCount += geometry.getAttribute('position').count;
      indexCount += geometry.getIndex()!.count;
    }
  }
  if (instanceCount > MAX_PICKABLE_INSTANCES) {
    throw new Error(
      `The model has ${instanceCount} element meshes; the 3D view draws at most ${MAX_PICKABLE_INSTANCES}.`,
    );
  }
  const mesh = resources.track(new BatchedMesh(instanceCount, vertexCount, indexCount, material));
  const geometryIds = new Map<BufferGeometry, number>();
  const counts: number[] = [];
  for (const element of elements) {
    let added = 0;
    for (const source of element.meshes) {
      const geometry = batchable.get(source.geometry);
      if (geometry === undefined) continue;
      let geometryId = geometryIds.get(source.geometry);
      if (geometryId === undefined) {
        geometryId = mesh.addGeometry(geometry);
        geometryIds.set(source.geometry, geometryId);
      }
      mesh.setMatrixAt(mesh.addInstance(geometryId), source.matrixWorld);
      added++;
    }
    counts.push(added);
  }
  for (const geometry of batchable.values()) geometry.dispose();
  // The first upload sends whole buffers; the per-geometry update ranges would only split it up.
  for (const attribute of [...Object.values(mesh.geometry.attributes), mesh.geometry.getIndex()]) {
    if (attribute instanceof BufferAttribute) attribute.clearUpdateRanges();
  }
  const kept = elements.filter((_, i) => counts[i] > 0);
  mesh.computeBoundingBox();
  mesh.computeBoundingSphere();
  return { mesh, index: ElementIndex.fromElements(kept.map((e) => e.globalId), counts.filter((n) => n > 0)) };
}

/** Disposes what the glTF loader created; the batches hold copies of the geometry. */
export function disposeLoadedScene(scene: Object3D): void {
  const disposed = new Set<{ dispose(): void }>();
  scene.traverse((object) => {
    const mesh = object as Partial<Mesh>;
    if (mesh.geometry) disposed.add(mesh.geometry);
    const materials = mesh.material === undefined ? [] : Array.isArray(mesh.material) ? mesh.material : [mesh.material];
    for (const material of materials) {
      disposed.add(material);
      for (const value of Object.values(material)) {
        if ((value as Partial<Texture> | null)?.isTexture) disposed.add(value as Texture);
      }
    }
  });
  for (const item of disposed) item.dispose();
}

/** Builds both batches and disposes the loaded scene. `resources` then owns the batches. */
export function buildModelBatches(
  scene: Object3D,
  materials: { member: Material; context: Material },
  resources: GpuResources,
): ModelBatches {
  scene.updateMatrixWorld(true);
  const { members, context, skipped } = collectElements(scene);
  try {
    const memberBatch = buildBatch(members, materials.member, resources);
    const contextBatch = buildBatch(context, materials.context, resources);
    if (memberBatch) {
      // Members are opaque: the depth test orders them, so sorting 50,000 of them every frame would be wasted work.
      memberBatch.mesh.sortObjects = false;
    }
    return { members: memberBatch, context: contextBatch, skippedMeshes: skipped };
  } finally {
    disposeLoadedScene(scene);
  }
}
