/**
 * A uniform grid over member axes (straight segments), for finding the axes that pass within a distance of a point
 * without testing every member. Each axis is listed in every cell its bounding box, grown by the search radius, touches.
 */
import type { Point3_mm } from '../ifc/model-read-result';

export interface AxisSegment {
  start_mm: Point3_mm;
  end_mm: Point3_mm;
}

/** Cells per axis stay few: a cell is at least half the typical axis length. */
const MIN_CELL_MM = 100;
/** Above this many cells a bounding box is replaced by cells along the axis. */
const MAX_BOX_CELLS = 512;

export class AxisGrid {
  private readonly cells = new Map<string, number[]>();
  private readonly cell_mm: number;

  constructor(
    private readonly axes: readonly (AxisSegment | null)[],
    private readonly radius_mm: number,
  ) {
    this.cell_mm = Math.max(MIN_CELL_MM, 2 * radius_mm, medianLength(axes) / 2);
    axes.forEach((axis, index) => {
      if (axis) this.insert(axis, index);
    });
  }

  /** The axes whose segment passes within the radius of the point, with their distance. */
  near(point: Point3_mm): Array<{ index: number; distance_mm: number }> {
    const hits: Array<{ index: number; distance_mm: number }> = [];
    for (const index of this.cells.get(this.keyOf(point)) ?? []) {
      const distance = distanceToSegment_mm(point, this.axes[index]!);
      if (distance <= this.radius_mm) hits.push({ index, distance_mm: distance });
    }
    return hits;
  }

  private insert(axis: AxisSegment, index: number): void {
    for (const key of this.cellsAlong(axis)) {
      const list = this.cells.get(key);
      if (list) list.push(index);
      else this.cells.set(key, [index]);
    }
  }

  /**
   * The cells a point within the radius of the axis can fall in: the grown bounding box, or for a long diagonal (whose
   * box would be mostly empty) the neighbours of points spaced half a cell along it. A cell is at least twice the
   * radius, so such a point is never more than one cell away from the nearest sample's cell.
   */
  private cellsAlong(axis: AxisSegment): Set<string> {
    const low = [0, 1, 2].map((d) => this.cellIndex(Math.min(axis.start_mm[d], axis.end_mm[d]) - this.radius_mm));
    const high = [0, 1, 2].map((d) => this.cellIndex(Math.max(axis.start_mm[d], axis.end_mm[d]) + this.radius_mm));
    const boxCells = (high[0] - low[0] + 1) * (high[1] - low[1] + 1) * (high[2] - low[2] + 1);
    const keys = new Set<string>();
    if (boxCells <= MAX_BOX_CELLS) {
      for (let i = low[0]; i <= high[0]; i++) {
        for (let j = low[1]; j <= high[1]; j++) {
          for (let k = low[2]; k <= high[2]; k++) keys.add(`${i},${j},${k}`);
        }
      }
      return keys;
    }
    const steps = Math.ceil(distance_mm(axis.start_mm, axis.end_mm) / (this.cell_mm / 2));
    for (let step = 0; step <= steps; step++) {
      const t = step / steps;
      const centre = [0, 1, 2].map((d) => this.cellIndex(axis.start_mm[d] + t * (axis.end_mm[d] - axis.start_mm[d])));
      for (let i = -1; i <= 1; i++) {
        for (let j = -1; j <= 1; j++) {
          for (let k = -1; k <= 1; k++) keys.add(`${centre[0] + i},${centre[1] + j},${centre[2] + k}`);
        }
      }
    }
    return keys;
  }

  private cellIndex(coordinate_mm: number): number {
    return Math.floor(coordinate_mm / this.cell_mm);
  }

  private keyOf(point: Point3_mm): string {
    return `${this.cellIndex(point[0])},${this.cellIndex(point[1])},${this.cellIndex(point[2])}`;
  }
}

export function distance_mm(a: Point3_mm, b: Point3_mm): number {
  return Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
}

/** Shortest distance from a point to a segment (to its nearer end when the foot falls outside it). */
export function distanceToSegment_mm(point: Point3_mm, segment: AxisSegment): number {
  const [ax, ay, az] = segment.start_mm;
  const dx = segment.end_mm[0] - ax;
  const dy = segment.end_mm[1] - ay;
  const dz = segment.end_mm[2] - az;
  const lengthSquared = dx * dx + dy * dy + dz * dz;
  const t =
    lengthSquared === 0
      ? 0
      : Math.min(1, Math.max(0, ((point[0] - ax) * dx + (point[1] - ay) * dy + (point[2] - az) * dz) / lengthSquared));
  return Math.hypot(point[0] - (ax + t * dx), point[1] - (ay + t * dy), point[2] - (az + t * dz));
}

function medianLength(axes: readonly (AxisSegment | null)[]): number {
  const lengths = axes
    .filter((axis): axis is AxisSegment => axis !== null)
    .map((axis) => distance_mm(axis.start_mm, axis.end_mm))
    .sort((a, b) => a - b);
  return lengths.length === 0 ? 0 : lengths[Math.floor(lengths.length / 2)];
}
