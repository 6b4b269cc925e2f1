/**
 * 4×4 affine transforms, column-major like web-ifc and glTF (element [col * 4 + row]), in double precision so that
 * model coordinates hundreds of kilometres from the origin keep sub-millimetre resolution.
 */
export type Vec3 = [number, number, number];
export type Mat4 = Float64Array;

export function identity(): Mat4 {
  const m = new Float64Array(16);
  m[0] = m[5] = m[10] = m[15] = 1;
  return m;
}

export function fromColumns(x: Vec3, y: Vec3, z: Vec3, origin: Vec3): Mat4 {
  return Float64Array.of(x[0], x[1], x[2], 0, y[0], y[1], y[2], 0, z[0], z[1], z[2], 0, origin[0], origin[1], origin[2], 1);
}

export function multiply(a: Mat4, b: Mat4): Mat4 {
  const out = new Float64Array(16);
  for (let col = 0; col < 4; col++) {
    for (let row = 0; row < 4; row++) {
      out[col * 4 + row] =
        a[row] * b[col * 4] + a[4 + row] * b[col * 4 + 1] + a[8 + row] * b[col * 4 + 2] + a[12 + row] * b[col * 4 + 3];
    }
  }
  return out;
}

export function transformPoint(m: Mat4, p: Vec3): Vec3 {
  const [x, y, z] = p;
  return [m[0] * x + m[4] * y + m[8] * z + m[12], m[1] * x + m[5] * y + m[9] * z + m[13], m[2] * x + m[6] * y + m[10] * z + m[14]];
}

export function transformDirection(m: Mat4, v: Vec3): Vec3 {
  const [x, y, z] = v;
  return [m[0] * x + m[4] * y + m[8] * z, m[1] * x + m[5] * y + m[9] * z, m[2] * x + m[6] * y + m[10] * z];
}

export const add = (a: Vec3, b: Vec3): Vec3 => [a[0] + b[0], a[1] + b[1], a[2] + b[2]];
export const subtract = (a: Vec3, b: Vec3): Vec3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
export const scale = (a: Vec3, s: number): Vec3 => [a[0] * s, a[1] * s, a[2] * s];
export const dot = (a: Vec3, b: Vec3): number => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
export const cross = (a: Vec3, b: Vec3): Vec3 => [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
export const norm = (a: Vec3): number => Math.hypot(a[0], a[1], a[2]);

/** Unit vector of `a`, or undefined for a zero or non-finite vector. */
export function normalize(a: Vec3): Vec3 | undefined {
  const n = norm(a);
  return n > 1e-12 && Number.isFinite(n) ? scale(a, 1 / n) : undefined;
}

/** The part of `v` at right angles to unit vector `axis`, normalised; undefined when `v` is parallel to it. */
function orthogonalPart(v: Vec3, axis: Vec3): Vec3 | undefined {
  return normalize(subtract(v, scale(axis, dot(v, axis))));
}

/**
 * IfcAxis2Placement3D: Z from Axis (default +Z), X from RefDirection made orthogonal to Z (default +X, or +Y when
 * +X is parallel to Z), Y = Z × X.
 */
export function axis2Placement(origin: Vec3, axis?: Vec3, refDirection?: Vec3): Mat4 {
  const z = (axis && normalize(axis)) ?? [0, 0, 1];
  const x = (refDirection && orthogonalPart(refDirection, z)) ?? orthogonalPart([1, 0, 0], z) ?? orthogonalPart([0, 1, 0], z) ?? [1, 0, 0];
  return fromColumns(x, cross(z, x), z, origin);
}

/**
 * IfcCartesianTransformationOperator3D(NonUniform): axes by the schema's BaseAxis function (Axis2 keeps its sense,
 * so a mirroring operator stays a mirror), then scaled per axis.
 */
export function transformationOperator(origin: Vec3, axis1?: Vec3, axis2?: Vec3, axis3?: Vec3, scales: Vec3 = [1, 1, 1]): Mat4 {
  const d1 = (axis3 && normalize(axis3)) ?? [0, 0, 1];
  const d2 = (axis1 && orthogonalPart(axis1, d1)) ?? orthogonalPart([1, 0, 0], d1) ?? [0, 1, 0];
  const y = axis2 ?? [0, 1, 0];
  const d3 = normalize(subtract(subtract(y, scale(d2, dot(y, d2))), scale(d1, dot(y, d1)))) ?? cross(d1, d2);
  return fromColumns(scale(d2, scales[0]), scale(d3, scales[1]), scale(d1, scales[2]), origin);
}

/** Determinant of the 3×3 part: negative for a mirroring transform (faces must then be turned over). */
export function determinant3(m: Mat4): number {
  return m[0] * (m[5] * m[10] - m[9] * m[6]) - m[4] * (m[1] * m[10] - m[9] * m[2]) + m[8] * (m[1] * m[6] - m[5] * m[2]);
}

/** Inverse transpose of the 3×3 part (column-major 3×3), which carries normals through any affine transform. */
export function normalMatrix(m: Mat4): Float64Array {
  const det = determinant3(m);
  const inv = 1 / det;
  return Float64Array.of(
    (m[5] * m[10] - m[6] * m[9]) * inv,
    (m[8] * m[6] - m[4] * m[10]) * inv,
    (m[4] * m[9] - m[8] * m[5]) * inv,
    (m[9] * m[2] - m[1] * m[10]) * inv,
    (m[0] * m[10] - m[8] * m[2]) * inv,
    (m[8] * m[1] - m[0] * m[9]) * inv,
    (m[1] * m[6] - m[5] * m[2]) * inv,
    (m[4] * m[2] - m[0] * m[6]) * inv,
    (m[0] * m[5] - m[4] * m[1]) * inv,
  );
}
