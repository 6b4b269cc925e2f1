/**
 * Outlines of selected and hovered elements: the element's geometry is copied out of its batch, its crease edges
 * drawn as lines over everything else so a selected member can be found behind others. The batch itself is left
 * alone, so the member keeps its utilisation colour while selected.
 */
import {
  type BatchedMesh,
  BufferAttribute,
  BufferGeometry,
  EdgesGeometry,
  Group,
  LineBasicMaterial,
  LineSegments,
  Matrix4,
  type Plane,
} from 'three';
import type { GpuResources } from './gpu-resources';

/** Edges between faces meeting at more than this angle are drawn; flat-shaded steel has 90° edges. */
const CREASE_ANGLE_DEG = 30;
/** Past this many instances an outline would cost more than it tells; the rest stay selected without one. */
const MAX_OUTLINED_INSTANCES = 300;

const _matrix = /*@__PURE__*/ new Matrix4();

function instanceGeometry(batch: BatchedMesh, instanceId: number): BufferGeometry {
  const range = batch.getGeometryRangeAt(batch.getGeometryIdAt(instanceId));
  const positions = batch.geometry.getAttribute('position').array as Float32Array;
  const batchIndex = batch.geometry.getIndex()!.array;
  const index = new Uint32Array(range.indexCount);
  for (let i = 0; i < range.indexCount; i++) index[i] = batchIndex[range.indexStart + i] - range.vertexStart;
  const geometry = new BufferGeometry();
  geometry.setAttribute(
    'position',
    new BufferAttribute(positions.slice(range.vertexStart * 3, (range.vertexStart + range.vertexCount) * 3), 3),
  );
  geometry.setIndex(new BufferAttribute(index, 1));
  return geometry;
}

export class SelectionOutline {
  readonly object = new Group();
  private readonly material: LineBasicMaterial;
  private readonly resources: GpuResources;
  private lines: LineSegments[] = [];

  constructor(resources: GpuResources, colour: number, clippingPlanes: Plane[]) {
    this.resources = resources;
    this.material = resources.track(
      new LineBasicMaterial({ color: colour, depthTest: false, transparent: true, clippingPlanes }),
    );
    // Drawn after the model so the lines sit on top.
    this.object.renderOrder = 10;
  }

  show(batch: BatchedMesh, instanceIds: readonly number[]): void {
    this.clear();
    for (const instanceId of instanceIds.slice(0, MAX_OUTLINED_INSTANCES)) {
      const solid = instanceGeometry(batch, instanceId);
      const edges = this.resources.track(new EdgesGeometry(solid, CREASE_ANGLE_DEG));
      solid.dispose();
      const line = new LineSegments(edges, this.material);
      line.renderOrder = 10;
      line.matrixAutoUpdate = false;
      line.matrix.copy(batch.getMatrixAt(instanceId, _matrix)).premultiply(batch.matrixWorld);
      this.object.add(line);
      this.lines.push(line);
    }
  }

  clear(): void {
    for (const line of this.lines) {
      this.object.remove(line);
      this.resources.release(line.geometry);
    }
    this.lines = [];
  }
}
