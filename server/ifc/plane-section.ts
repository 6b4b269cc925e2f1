/**
 * The section a plane cuts from a body's faces: every face the plane crosses gives segments (the crossings of its
 * edges, sorted along the face's line of intersection and paired even–odd, which handles its holes), the segments
 * are chained into closed loops, and the loops become one outline with its voids in the plane's own axes.
 */
import type { Point2_mm, SectionPolygon } from '../engine/section-family';
import { insideLoop, signedArea_mm2 as signedArea } from '../engine/section-polygon';
import type { BodyFaces } from './body-faces';
import type { Vec3 } from './matrix4';

/** Axes of a cut: u, v in the plane, w normal to it (unit vectors, element coordinates, u × v = w). */
export interface CutAxes {
  u: Vec3;
  v: Vec3;
  w: Vec3;
}

export type PlaneSection =
  | {
      status: 'section';
      /** Outer loop counter-clockwise, voids clockwise, in model units along u and v (element origin). */
      outer: Point2_mm[];
      voids: Point2_mm[][];
      area: number;
      /** Bounding box [minU, minV, maxU, maxV], model units. */
      bounds: [number, number, number, number];
    }
  /** `pieces`: the cut found several separate outlines — not one member's section. */
  | { status: 'failed'; reason: string; pieces?: number };

/** Points closer than this fraction of the section size are one point (exports round their coordinates). */
const JOIN_FRACTION = 1e-5;
/** A loop point this close (fraction of the section size) to the line through its neighbours is dropped. */
const STRAIGHT_FRACTION = 1e-7;

const dot = (p: Float64Array, i: number, a: Vec3): number => p[i] * a[0] + p[i + 1] * a[1] + p[i + 2] * a[2];

/**
 * Segments (u1, v1, u2, v2 after one another) cut by the plane w·p = offset. Answers undefined when a vertex lies
 * on the plane within `onPlane`: the caller moves the plane a little, so that no crossing is counted twice.
 */
function planeSegments(faces: BodyFaces, axes: CutAxes, offset: number, onPlane: number): number[] | undefined {
  const { positions, loopVertices, loopStarts, faceStarts } = faces;
  const vertexCount = positions.length / 3;
  const distance = new Float64Array(vertexCount);
  for (let i = 0; i < vertexCount; i++) {
    distance[i] = dot(positions, 3 * i, axes.w) - offset;
    if (Math.abs(distance[i]) <= onPlane) return undefined;
  }
  const segments: number[] = [];
  const crossings: number[] = [];
  for (let f = 0; f + 1 < faceStarts.length; f++) {
    crossings.length = 0;
    for (let l = faceStarts[f]; l < faceStarts[f + 1]; l++) {
      const start = loopStarts[l];
      const end = loopStarts[l + 1];
      for (let k = start; k < end; k++) {
        const a = loopVertices[k];
        const b = loopVertices[k + 1 < end ? k + 1 : start];
        const da = distance[a];
        const db = distance[b];
        if (da < 0 === db < 0) continue;
        const t = da / (da - db);
        const x = positions[3 * a] + (positions[3 * b] - positions[3 * a]) * t;
        const y = positions[3 * a + 1] + (positions[3 * b + 1] - positions[3 * a + 1]) * t;
        const z = positions[3 * a + 2] + (positions[3 * b + 2] - positions[3 * a + 2]) * t;
        crossings.push(x * axes.u[0] + y * axes.u[1] + z * axes.u[2], x * axes.v[0] + y * axes.v[1] + z * axes.v[2]);
      }
    }
    if (crossings.length === 4) segments.push(crossings[0], crossings[1], crossings[2], crossings[3]);
    else if (crossings.length > 4) pairAlongLine(crossings, segments);
  }
  return segments;
}

/** Crossings of one planar face lie on one line: sorted along it, the 1st and 2nd bound material, the 3rd and 4th… */
function pairAlongLine(crossings: readonly number[], segments: number[]): void {
  const count = crossings.length / 2;
  let far = 1;
  let farthest = -1;
  for (let i = 1; i < count; i++) {
    const d = (crossings[2 * i] - crossings[0]) ** 2 + (crossings[2 * i + 1] - crossings[1]) ** 2;
    if (d > farthest) [far, farthest] = [i, d];
  }
  const du = crossings[2 * far] - crossings[0];
  const dv = crossings[2 * far + 1] - crossings[1];
  const order = Array.from({ length: count }, (_, i) => i);
  const along = order.map((i) => crossings[2 * i] * du + crossings[2 * i + 1] * dv);
  order.sort((a, b) => along[a] - along[b]);
  for (let k = 0; k + 1 < count; k += 2) {
    const a = order[k];
    const b = order[k + 1];
    segments.push(crossings[2 * a], crossings[2 * a + 1], crossings[2 * b], crossings[2 * b + 1]);
  }
}

/** Joins segment ends that meet (within `join`) into points, each point knowing its two segments' other ends. */
function chainLoops(segments: readonly number[], join: number): { loops: Point2_mm[][] } | { reason: string } {
  const cells = new Map<number, number[]>();
  const pointU: number[] = [];
  const pointV: number[] = [];
  const links: number[][] = [];
  const cellOf = (c: number): number => Math.floor(c / join);
  const key = (cu: number, cv: number): number => cu * 67108864 + cv;
  const pointAt = (u: number, v: number): number => {
    const cu = cellOf(u);
    const cv = cellOf(v);
    for (let du = -1; du <= 1; du++) {
      for (let dv = -1; dv <= 1; dv++) {
        for (const p of cells.get(key(cu + du, cv + dv)) ?? []) {
          if (Math.abs(pointU[p] - u) <= join && Math.abs(pointV[p] - v) <= join) return p;
        }
      }
    }
    const p = pointU.length;
    pointU.push(u);
    pointV.push(v);
    links.push([]);
    const k = key(cu, cv);
    const cell = cells.get(k);
    if (cell) cell.push(p);
    else cells.set(k, [p]);
    return p;
  };
  for (let s = 0; s < segments.length; s += 4) {
    const a = pointAt(segments[s], segments[s + 1]);
    const b = pointAt(segments[s + 2], segments[s + 3]);
    if (a === b) continue;
    links[a].push(b);
    links[b].push(a);
  }
  const open = links.filter((l) => l.length === 1).length;
  if (open > 0) return { reason: 'the cut does not close: the body is an open surface or has gaps between its faces' };
  if (links.some((l) => l.length > 2)) return { reason: 'the cut meets itself: the body touches itself or has faces inside it' };
  const visited = new Uint8Array(links.length);
  const loops: Point2_mm[][] = [];
  for (let first = 0; first < links.length; first++) {
    if (visited[first] || links[first].length === 0) continue;
    const loop: Point2_mm[] = [];
    let previous = -1;
    let current = first;
    while (!visited[current]) {
      visited[current] = 1;
      loop.push([pointU[current], pointV[current]]);
      const [x, y] = links[current];
      const next = x !== previous ? x : y;
      previous = current;
      current = next;
    }
    if (loop.length >= 3) loops.push(loop);
  }
  return { loops };
}

/** Drops points on the straight line through their neighbours (a triangulated face splits a straight side). */
function withoutStraightPoints(loop: Point2_mm[], tolerance: number): Point2_mm[] {
  let points = loop;
  for (let changed = true; changed && points.length > 3; ) {
    changed = false;
    const kept: Point2_mm[] = [];
    for (let i = 0; i < points.length; i++) {
      const a = kept.length > 0 ? kept[kept.length - 1] : points[points.length - 1];
      const b = points[i];
      const c = points[(i + 1) % points.length];
      const length = Math.hypot(c[0] - a[0], c[1] - a[1]);
      const offLine = Math.abs((b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]));
      if (length > 0 && offLine <= tolerance * length) changed = true;
      else kept.push(b);
    }
    points = kept;
  }
  return points;
}

/**
 * The section cut by the plane w·p = offset (element coordinates, model units). `size` is the body's cross size, which
 * sets how close points must be to count as one.
 */
export function planeSection(faces: BodyFaces, axes: CutAxes, offset: number, size: number): PlaneSection {
  let segments: number[] | undefined;
  // Nudge the plane off vertices lying on it: a few steps of a millionth of the size stay far within any tolerance.
  for (let nudge = 0; nudge < 8 && !segments; nudge++) {
    segments = planeSegments(faces, axes, offset + nudge * 1e-6 * size, 1e-9 * size);
  }
  if (!segments) return { status: 'failed', reason: 'the cut runs along the body’s edges wherever it is placed' };
  if (segments.length === 0) return { status: 'failed', reason: 'the cut finds no material' };
  const chained = chainLoops(segments, JOIN_FRACTION * size);
  if ('reason' in chained) return { status: 'failed', reason: chained.reason };
  const loops = chained.loops.map((l) => withoutStraightPoints(l, STRAIGHT_FRACTION * size)).filter((l) => Math.abs(signedArea(l)) > 0);
  if (loops.length === 0) return { status: 'failed', reason: 'the cut finds no material' };
  // A loop inside an even number of others bounds material, inside an odd number it bounds a void.
  const depth = loops.map((loop, i) => loops.filter((other, j) => j !== i && insideLoop(loop[0], other)).length);
  const outers = loops.filter((_, i) => depth[i] % 2 === 0);
  if (outers.length > 1) {
    return { status: 'failed', reason: `the cut gives ${outers.length} separate pieces (two members in one body, or a built-up pair)`, pieces: outers.length };
  }
  const outer = signedArea(outers[0]) > 0 ? outers[0] : outers[0].reverse();
  const voids = loops.filter((_, i) => depth[i] % 2 === 1).map((l) => (signedArea(l) < 0 ? l : l.reverse()));
  const area = signedArea(outer) + voids.reduce((sum, l) => sum + signedArea(l), 0);
  const bounds: [number, number, number, number] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const [u, v] of outer) {
    bounds[0] = Math.min(bounds[0], u);
    bounds[1] = Math.min(bounds[1], v);
    bounds[2] = Math.max(bounds[2], u);
    bounds[3] = Math.max(bounds[3], v);
  }
  return { status: 'section', outer, voids, area, bounds };
}

/** The section as a SectionPolygon in millimetres, from the element origin's projection on the plane. */
export function toSectionPolygon(outer: readonly Point2_mm[], voids: readonly Point2_mm[][], scaleToMm: number): SectionPolygon {
  const toMm = (loop: readonly Point2_mm[]): Point2_mm[] => loop.map(([u, v]) => [u * scaleToMm, v * scaleToMm] as const);
  return { outer: toMm(outer), voids: voids.map(toMm) };
}
