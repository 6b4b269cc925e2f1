/**
 * Closed polyhedral bodies of members, for the BREP and tessellated paths: a section swept straight (or between two
 * sections with matching vertices, for a taper) and an I-beam with a coped end. Built in the sweep's own coordinates
 * (section in x–y, member along z), then placed; faces are planar polygons, outward by the right-hand rule, and
 * neighbouring faces share their edges exactly (no T-junctions), as a valid closed shell must.
 */
import type { Point2 } from './section-loops';

export type Point3 = readonly [number, number, number];

/** A planar face: its outer loop and any holes, as indices into the mesh's points. */
export interface MeshFace {
  outer: number[];
  voids: number[][];
}

export interface Mesh {
  points: Point3[];
  faces: MeshFace[];
}

/** A section as chorded polygons: outer counter-clockwise, voids clockwise. */
export interface SectionPolygons {
  outer: Point2[];
  voids: Point2[][];
}

class MeshBuilder {
  readonly points: Point3[] = [];
  readonly faces: MeshFace[] = [];
  private readonly index = new Map<string, number>();

  at(p: Point2, z: number): number {
    const key = `${p[0].toFixed(6)},${p[1].toFixed(6)},${z.toFixed(6)}`;
    let i = this.index.get(key);
    if (i === undefined) {
      i = this.points.push([p[0], p[1], z]) - 1;
      this.index.set(key, i);
    }
    return i;
  }

  /** A cap at height z: seen from +z when `up`, otherwise from below (loops reversed). */
  cap(section: SectionPolygons, z: number, up: boolean): void {
    const ring = (loop: Point2[]): number[] => {
      const indices = loop.map((p) => this.at(p, z));
      return up ? indices : indices.reverse();
    };
    this.faces.push({ outer: ring(section.outer), voids: section.voids.map(ring) });
  }

  face(outer: number[]): void {
    this.faces.push({ outer, voids: [] });
  }

  build(): Mesh {
    return { points: this.points, faces: this.faces };
  }
}

function loopsOf(section: SectionPolygons): Point2[][] {
  return [section.outer, ...section.voids];
}

/** The body swept from `start` at z = 0 to `end` at z = length; both sections must have the same loops and counts. */
export function loftMesh(start: SectionPolygons, end: SectionPolygons, length_mm: number): Mesh {
  const startLoops = loopsOf(start);
  const endLoops = loopsOf(end);
  if (startLoops.length !== endLoops.length || startLoops.some((loop, i) => loop.length !== endLoops[i].length)) {
    throw new Error('a loft needs two sections with matching loops');
  }
  const m = new MeshBuilder();
  m.cap(start, 0, false);
  m.cap(end, length_mm, true);
  startLoops.forEach((loop, l) => {
    loop.forEach((p, i) => {
      const j = (i + 1) % loop.length;
      m.face([m.at(p, 0), m.at(loop[j], 0), m.at(endLoops[l][j], length_mm), m.at(endLoops[l][i], length_mm)]);
    });
  });
  return m.build();
}

export function prismMesh(section: SectionPolygons, length_mm: number): Mesh {
  return loftMesh(section, section, length_mm);
}

/** Sutherland–Hodgman clip of a polygon to the half plane y ≤ cut (`below`) or y ≥ cut. */
function clipToHalfPlane(polygon: readonly Point2[], cut_mm: number, below: boolean): Point2[] {
  const inside = (p: Point2): boolean => (below ? p[1] <= cut_mm : p[1] >= cut_mm);
  const out: Point2[] = [];
  polygon.forEach((p, i) => {
    const q = polygon[(i + 1) % polygon.length];
    if (inside(p)) out.push(p);
    if (inside(p) !== inside(q) && p[1] !== cut_mm && q[1] !== cut_mm) {
      const t = (cut_mm - p[1]) / (q[1] - p[1]);
      out.push([p[0] + t * (q[0] - p[0]), cut_mm]);
    }
  });
  return out;
}

/**
 * A straight member whose top is cut away over `copeLength_mm` from its start down to y = `cut_mm` (a coped beam end
 * clearing a supporting girder's flange). The cut must cross the section in one straight run (the web of an I).
 */
export function copedMesh(outer: readonly Point2[], length_mm: number, copeLength_mm: number, cut_mm: number): Mesh {
  const lower = clipToHalfPlane(outer, cut_mm, true);
  const upper = clipToHalfPlane(outer, cut_mm, false);
  const onCut = (p: Point2): boolean => Math.abs(p[1] - cut_mm) < 1e-9;
  const m = new MeshBuilder();
  const c = copeLength_mm;
  const L = length_mm;
  m.cap({ outer: lower, voids: [] }, 0, false);
  m.cap({ outer: lower, voids: [] }, L, true);
  m.cap({ outer: upper, voids: [] }, c, false);
  m.cap({ outer: upper, voids: [] }, L, true);
  lower.forEach((p, i) => {
    const q = lower[(i + 1) % lower.length];
    if (onCut(p) && onCut(q)) {
      // The cope's floor, from the start to where the full section begins.
      m.face([m.at(p, 0), m.at(q, 0), m.at(q, c), m.at(p, c)]);
      return;
    }
    // Sides touching the cut carry the vertex at z = c, where the upper part's sides begin.
    const face = [m.at(p, 0), m.at(q, 0)];
    if (onCut(q)) face.push(m.at(q, c));
    face.push(m.at(q, L), m.at(p, L));
    if (onCut(p)) face.push(m.at(p, c));
    m.face(face);
  });
  upper.forEach((p, i) => {
    const q = upper[(i + 1) % upper.length];
    if (!(onCut(p) && onCut(q))) m.face([m.at(p, c), m.at(q, c), m.at(q, L), m.at(p, L)]);
  });
  return m.build();
}

/** Places a mesh: x, y, z of the sweep become origin + x·xAxis + y·yAxis + z·zAxis (unit, orthogonal axes). */
export function placedMesh(mesh: Mesh, origin: Point3, xAxis: Point3, yAxis: Point3, zAxis: Point3): Mesh {
  return {
    faces: mesh.faces,
    points: mesh.points.map(([x, y, z]) => [0, 1, 2].map((k) => origin[k] + x * xAxis[k] + y * yAxis[k] + z * zAxis[k]) as unknown as Point3),
  };
}

const cross2 = (o: Point2, a: Point2, b: Point2): number => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);

function insideTriangle(p: Point2, a: Point2, b: Point2, c: Point2): boolean {
  return cross2(a, b, p) >= 0 && cross2(b, c, p) >= 0 && cross2(c, a, p) >= 0;
}

/** Ear clipping of a simple counter-clockwise polygon; returns triangles as positions in `polygon`. */
function earClip(polygon: readonly Point2[]): [number, number, number][] {
  const remaining = polygon.map((_, i) => i);
  const triangles: [number, number, number][] = [];
  while (remaining.length > 3) {
    const n = remaining.length;
    let clipped = false;
    for (let k = 0; k < n && !clipped; k++) {
      const [i, j, l] = [remaining[(k + n - 1) % n], remaining[k], remaining[(k + 1) % n]];
      if (cross2(polygon[i], polygon[j], polygon[l]) <= 1e-12) continue;
      const blocked = remaining.some((r) => r !== i && r !== j && r !== l && insideTriangle(polygon[r], polygon[i], polygon[j], polygon[l]));
      if (blocked) continue;
      triangles.push([i, j, l]);
      remaining.splice(k, 1);
      clipped = true;
    }
    if (!clipped) throw new Error('ear clipping found no ear: the polygon is not simple');
  }
  triangles.push([remaining[0], remaining[1], remaining[2]]);
  return triangles;
}

/** Unit normal of a face by Newell's method. */
function faceNormal(points: readonly Point3[], loop: readonly number[]): Point3 {
  const n = [0, 0, 0];
  loop.forEach((a, i) => {
    const p = points[a];
    const q = points[loop[(i + 1) % loop.length]];
    n[0] += (p[1] - q[1]) * (p[2] + q[2]);
    n[1] += (p[2] - q[2]) * (p[0] + q[0]);
    n[2] += (p[0] - q[0]) * (p[1] + q[1]);
  });
  const l = Math.hypot(n[0], n[1], n[2]);
  return [n[0] / l, n[1] / l, n[2] / l];
}

/** A face's loop in its own plane, counter-clockwise seen against the normal's direction. */
function flatten(points: readonly Point3[], loop: readonly number[], normal: Point3): Point2[] {
  const helper: Point3 = Math.abs(normal[0]) < 0.9 ? [1, 0, 0] : [0, 1, 0];
  const u = [normal[1] * helper[2] - normal[2] * helper[1], normal[2] * helper[0] - normal[0] * helper[2], normal[0] * helper[1] - normal[1] * helper[0]];
  const lu = Math.hypot(u[0], u[1], u[2]);
  const uu = u.map((v) => v / lu);
  const v = [normal[1] * uu[2] - normal[2] * uu[1], normal[2] * uu[0] - normal[0] * uu[2], normal[0] * uu[1] - normal[1] * uu[0]];
  return loop.map((i) => {
    const p = points[i];
    return [p[0] * uu[0] + p[1] * uu[1] + p[2] * uu[2], p[0] * v[0] + p[1] * v[1] + p[2] * v[2]];
  });
}

/**
 * Triangles of every face, keeping each face's orientation. A face with one void is split into the strip between its
 * two loops, which must have matching vertices (the generator's hollow sections do: both loops come from one shape).
 */
export function triangulate(mesh: Mesh): [number, number, number][] {
  const triangles: [number, number, number][] = [];
  for (const face of mesh.faces) {
    if (face.voids.length > 1) throw new Error('faces with more than one void are not triangulated');
    if (face.voids.length === 1) {
      const outer = face.outer;
      const inner = [...face.voids[0]].reverse();
      if (inner.length !== outer.length) throw new Error('a face with a void needs loops with matching vertices');
      // Pair each outer vertex with its inner twin: the rotation of the inner loop that puts them closest.
      const distance2 = (a: number, b: number): number => mesh.points[a].reduce((sum, v, k) => sum + (v - mesh.points[b][k]) ** 2, 0);
      const costOf = (shift: number): number => outer.reduce((sum, o, i) => sum + distance2(o, inner[(i + shift) % inner.length]), 0);
      const shift = inner.map((_, k) => k).reduce((best, k) => (costOf(k) < costOf(best) ? k : best), 0);
      const matched = inner.map((_, i) => inner[(i + shift) % inner.length]);
      outer.forEach((o, i) => {
        const j = (i + 1) % outer.length;
        triangles.push([o, outer[j], matched[j]], [o, matched[j], matched[i]]);
      });
      continue;
    }
    const flat = flatten(mesh.points, face.outer, faceNormal(mesh.points, face.outer));
    for (const [a, b, c] of earClip(flat)) triangles.push([face.outer[a], face.outer[b], face.outer[c]]);
  }
  return triangles;
}

/** Volume enclosed by outward triangles (divergence theorem: the sum of a·(b×c)/6 over the triangles). */
export function enclosedVolume(points: readonly Point3[], triangles: readonly (readonly [number, number, number])[]): number {
  let sum = 0;
  for (const [a, b, c] of triangles) {
    const [p, q, r] = [points[a], points[b], points[c]];
    sum += p[0] * (q[1] * r[2] - q[2] * r[1]) - p[1] * (q[0] * r[2] - q[2] * r[0]) + p[2] * (q[0] * r[1] - q[1] * r[0]);
  }
  return sum / 6;
}
