/**
 * The two frames of the 3D view. The .glb is glTF's frame (Y up, metres), which is also three.js's; IFC and BCF
 * use the model's own frame (Z up, metres). The ingest turns IFC (x, y, z) into glTF (x, z, −y), a quarter turn
 * about X (the usual IFC → glTF mapping, common practice, no source), and may subtract a model offset to keep
 * coordinates small; the scene extras `modelOffset_m` hold that offset in IFC axes.
 */

export type Vec3 = readonly [x: number, y: number, z: number];

export const ZERO_OFFSET: Vec3 = [0, 0, 0];

export function threeToIfcDirection([x, y, z]: Vec3): Vec3 {
  return [x, -z, y];
}

export function ifcToThreeDirection([x, y, z]: Vec3): Vec3 {
  return [x, z, -y];
}

export function threeToIfcPoint(point: Vec3, modelOffset_m: Vec3): Vec3 {
  const [x, y, z] = threeToIfcDirection(point);
  return [x + modelOffset_m[0], y + modelOffset_m[1], z + modelOffset_m[2]];
}

export function ifcToThreePoint([x, y, z]: Vec3, modelOffset_m: Vec3): Vec3 {
  return ifcToThreeDirection([x - modelOffset_m[0], y - modelOffset_m[1], z - modelOffset_m[2]]);
}

function isVec3(value: unknown): value is Vec3 {
  return Array.isArray(value) && value.length === 3 && value.every((n) => typeof n === 'number' && Number.isFinite(n));
}

/** The model offset from the glTF scene's extras; no offset when absent. Throws on a malformed one. */
export function readModelOffset(sceneExtras: unknown): Vec3 {
  if (typeof sceneExtras !== 'object' || sceneExtras === null || !('modelOffset_m' in sceneExtras)) return ZERO_OFFSET;
  const offset = (sceneExtras as { modelOffset_m: unknown }).modelOffset_m;
  if (!isVec3(offset)) {
    throw new Error('The model file has a modelOffset_m that is not three finite numbers, so its position is unknown.');
  }
  return offset;
}

export function length(v: Vec3): number {
  return Math.hypot(v[0], v[1], v[2]);
}

export function normalise(v: Vec3): Vec3 {
  const l = length(v);
  if (!(l > 0) || !Number.isFinite(l)) {
    throw new Error(`A direction needs a finite, non-zero length, got [${v.join(', ')}].`);
  }
  return [v[0] / l, v[1] / l, v[2] / l];
}

export function dot(a: Vec3, b: Vec3): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}
