/**
 * Our own mesh of an extruded I-section, for members web-ifc cannot tessellate (it rejects
 * IfcAsymmetricIShapeProfileDef, for one). The outline is the engine's idealised I (section-outline.ts: root fillets,
 * sloped flanges, toe radii), centred on its bounding box as IFC places parameterised profiles.
 */
import { sectionOutline } from '../engine/section-outline';
import type { IMemberProfile } from './model-read-result';
import { cross, normalize, type Vec3 } from './matrix4';

export type Point2 = [number, number];

/** Counter-clockwise outline in mm; the chords stray at most `chordTolerance_mm` from the arcs (0.1 % of the depth: display only). */
export function iSectionOutline(profile: Pick<IMemberProfile, 'depth_mm' | 'webThickness_mm' | 'topFlange' | 'bottomFlange'>, chordTolerance_mm = profile.depth_mm / 1000): Point2[] {
  const { depth_mm, webThickness_mm, topFlange, bottomFlange } = profile;
  return sectionOutline({ family: 'I', depth_mm, webThickness_mm, topFlange, bottomFlange }, chordTolerance_mm).outer.map(([x, y]): Point2 => [x, y]);
}

function cross2(o: Point2, a: Point2, b: Point2): number {
  return (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
}

function inTriangle(p: Point2, a: Point2, b: Point2, c: Point2): boolean {
  return cross2(a, b, p) >= 0 && cross2(b, c, p) >= 0 && cross2(c, a, p) >= 0;
}

/** Ear clipping of a simple counter-clockwise polygon; returns index triples, counter-clockwise. */
export function triangulate(polygon: readonly Point2[]): number[] {
  const remaining = polygon.map((_, i) => i);
  const triangles: number[] = [];
  let guard = polygon.length * polygon.length;
  while (remaining.length > 3 && guard-- > 0) {
    for (let k = 0; k < remaining.length; k++) {
      const [i0, i1, i2] = [remaining[(k + remaining.length - 1) % remaining.length], remaining[k], remaining[(k + 1) % remaining.length]];
      const [a, b, c] = [polygon[i0], polygon[i1], polygon[i2]];
      if (cross2(a, b, c) <= 1e-12) continue;
      const blocked = remaining.some((j) => j !== i0 && j !== i1 && j !== i2 && inTriangle(polygon[j], a, b, c));
      if (blocked) continue;
      triangles.push(i0, i1, i2);
      remaining.splice(k, 1);
      break;
    }
  }
  if (remaining.length === 3) triangles.push(remaining[0], remaining[1], remaining[2]);
  return triangles;
}

/** An outline with its cap triangles, worked out once per profile. */
export interface Outline {
  points: readonly Point2[];
  cap: readonly number[];
}

export function outlineWithCap(points: readonly Point2[]): Outline {
  return { points, cap: triangulate(points) };
}

/**
 * Prism of the outline (in the solid's xy plane, model units) swept by `direction × depth`: caps and flat-shaded
 * sides, as x, y, z, nx, ny, nz per vertex.
 */
export function extrudedMesh(outline: Outline, direction: Vec3, depth: number): { vertices: Float32Array; indices: Uint32Array } {
  const { points, cap } = outline;
  const n = points.length;
  const vertices = new Float32Array(6 * n * 6);
  const indices = new Uint32Array(2 * cap.length + 6 * n);
  const [dx, dy, dz] = [direction[0] * depth, direction[1] * depth, direction[2] * depth];
  let v = 0;
  const put = (x: number, y: number, z: number, nx: number, ny: number, nz: number): number => {
    const at = v * 6;
    vertices[at] = x;
    vertices[at + 1] = y;
    vertices[at + 2] = z;
    vertices[at + 3] = nx;
    vertices[at + 4] = ny;
    vertices[at + 5] = nz;
    return v++;
  };
  for (const [x, y] of points) put(x, y, 0, 0, 0, -1);
  for (const [x, y] of points) put(x + dx, y + dy, dz, 0, 0, 1);
  let i = 0;
  for (let t = 0; t < cap.length; t += 3) {
    indices[i++] = n + cap[t];
    indices[i++] = n + cap[t + 1];
    indices[i++] = n + cap[t + 2];
    indices[i++] = cap[t];
    indices[i++] = cap[t + 2];
    indices[i++] = cap[t + 1];
  }
  for (let k = 0; k < n; k++) {
    const [x0, y0] = points[k];
    const [x1, y1] = points[(k + 1) % n];
    const [nx, ny, nz] = normalize(cross([x1 - x0, y1 - y0, 0], direction)) ?? [0, 0, 1];
    const a = put(x0, y0, 0, nx, ny, nz);
    const b = put(x1, y1, 0, nx, ny, nz);
    const c = put(x1 + dx, y1 + dy, dz, nx, ny, nz);
    const d = put(x0 + dx, y0 + dy, dz, nx, ny, nz);
    indices[i++] = a;
    indices[i++] = b;
    indices[i++] = c;
    indices[i++] = a;
    indices[i++] = c;
    indices[i++] = d;
  }
  return { vertices, indices };
}
