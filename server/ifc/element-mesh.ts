/**
 * One element's triangles in glTF space (metres, Y up), merged from all its pieces: interleaved position + normal
 * (6 floats a vertex) and indices. Pieces arrive in their own coordinates with a transform to glTF space; the
 * transform is applied in double precision and the model offset taken off before rounding to 32-bit floats.
 *
 * Meshes live in a few large arrays (an arena) rather than one small array each: tens of thousands of small array
 * buffers made the garbage collector run several times longer than the tessellation it was cleaning up after.
 */
import { determinant3, type Mat4, normalMatrix } from './matrix4';

export interface ElementMesh {
  expressId: number;
  /** x, y, z, nx, ny, nz per vertex. */
  vertices: Float32Array;
  indices: Uint16Array | Uint32Array;
  min: [number, number, number];
  max: [number, number, number];
}

export const FLOATS_PER_VERTEX = 6;

const ARENA_ELEMENTS = 4 * 1024 * 1024;

type TypedArrayOf<T> = T extends Float32Array ? Float32ArrayConstructor : T extends Uint16Array ? Uint16ArrayConstructor : Uint32ArrayConstructor;

/**
 * Hands out views into large arrays of one element type. The element being built is written in place at the arena's
 * tail (`reserve`, then `close`), so finishing it copies nothing.
 */
class Arena<T extends Float32Array | Uint16Array | Uint32Array> {
  private current: T;
  private used = 0;

  constructor(private readonly make: TypedArrayOf<T>) {
    this.current = new make(ARENA_ELEMENTS) as T;
  }

  /** Where the open element starts in the array `reserve` returns. */
  get start(): number {
    return this.used;
  }

  /**
   * The array to write the open element into, with room for `total` elements from `start`; when the current array is
   * too short, the `kept` elements already written move to a fresh one.
   */
  reserve(kept: number, total: number): T {
    if (this.used + total > this.current.length) {
      const fresh = new this.make(Math.max(ARENA_ELEMENTS, 2 * total)) as T;
      fresh.set(this.current.subarray(this.used, this.used + kept));
      this.current = fresh;
      this.used = 0;
    }
    return this.current;
  }

  /** Ends the open element at `length` elements and returns it. */
  close(length: number): T {
    const view = this.current.subarray(this.used, this.used + length) as T;
    this.used += length;
    return view;
  }

  take(length: number): T {
    this.reserve(0, length);
    return this.close(length);
  }
}

/** The arrays all meshes of one model are stored in. */
export class MeshStore {
  readonly vertices = new Arena<Float32Array>(Float32Array);
  readonly shortIndices = new Arena<Uint16Array>(Uint16Array);
  readonly longIndices = new Arena<Uint32Array>(Uint32Array);
}

const EMPTY_BOUNDS = [Infinity, Infinity, Infinity, -Infinity, -Infinity, -Infinity];

/** Columns of the 3×3 part at right angles and of one length. */
function isRotationWithUniformScale(m: Mat4): boolean {
  const lx = Math.hypot(m[0], m[1], m[2]);
  const ly = Math.hypot(m[4], m[5], m[6]);
  const lz = Math.hypot(m[8], m[9], m[10]);
  const tolerance = 1e-9 * lx;
  return (
    Math.abs(lx - ly) < tolerance &&
    Math.abs(lx - lz) < tolerance &&
    Math.abs(m[0] * m[4] + m[1] * m[5] + m[2] * m[6]) < tolerance * lx &&
    Math.abs(m[0] * m[8] + m[1] * m[9] + m[2] * m[10]) < tolerance * lx &&
    Math.abs(m[4] * m[8] + m[5] * m[9] + m[6] * m[10]) < tolerance * lx
  );
}

/**
 * Accumulates the pieces of one element at a time: vertices straight into the store's arena, indices in a reused
 * scratch array (whether they fit 16 bits is known only when the element is complete).
 */
export class ElementMeshBuilder {
  private indices = new Uint32Array(64 * 1024);
  private vertexCount = 0;
  private indexCount = 0;
  private readonly bounds = Float64Array.from(EMPTY_BOUNDS);
  private readonly transform: Mat4 = new Float64Array(16);
  private readonly normals = new Float64Array(9);

  /** `offset` is subtracted after transforming (glTF axes, metres). */
  constructor(
    private readonly offset: readonly [number, number, number],
    private readonly store: MeshStore,
  ) {}

  private reserveIndices(indices: number): void {
    if (indices > this.indices.length) {
      const grown = new Uint32Array(Math.max(indices, 2 * this.indices.length));
      grown.set(this.indices.subarray(0, this.indexCount));
      this.indices = grown;
    }
  }

  /**
   * Adds a piece: `source` holds x, y, z, nx, ny, nz per vertex in the piece's coordinates (a view into web-ifc's
   * memory is fine: it is read at once); `transform` takes them to glTF space.
   */
  add(source: Float32Array, sourceIndices: Uint32Array, transform: Mat4 | readonly number[]): void {
    const count = source.length / FLOATS_PER_VERTEX;
    if (count === 0 || sourceIndices.length === 0) return;
    const base = this.vertexCount;
    const out = this.store.vertices.reserve(base * FLOATS_PER_VERTEX, (base + count) * FLOATS_PER_VERTEX);
    this.reserveIndices(this.indexCount + sourceIndices.length);
    // One array type from here on: web-ifc hands plain arrays, our own meshes Float64Arrays, and mixing the two in
    // the loops below made every call slower.
    const m = this.transform;
    for (let i = 0; i < 16; i++) m[i] = transform[i];
    // A rotation with a uniform scale (nearly every placement) keeps unit normals unit after the scale is divided out.
    const normals = this.normals;
    const uniform = isRotationWithUniformScale(m);
    if (uniform) {
      const unitScale = 1 / Math.hypot(m[0], m[1], m[2]);
      for (let i = 0; i < 9; i++) normals[i] = m[i + Math.floor(i / 3)] * unitScale;
    } else normals.set(normalMatrix(m));
    const first = this.store.vertices.start + base * FLOATS_PER_VERTEX;
    this.transformVertices(source, out, first, m, normals, !uniform);
    const indices = this.indices;
    let at = this.indexCount;
    // A mirroring transform turns faces inside out; swap two corners of each triangle to turn them back.
    const flip = determinant3(m) < 0;
    for (let i = 0; i + 2 < sourceIndices.length; i += 3, at += 3) {
      indices[at] = sourceIndices[i] + base;
      indices[at + 1] = sourceIndices[flip ? i + 2 : i + 1] + base;
      indices[at + 2] = sourceIndices[flip ? i + 1 : i + 2] + base;
    }
    this.vertexCount += count;
    this.indexCount = at;
  }

  /** Writes `source` transformed into `out` from `first`, widening the bounds; `renormalise` for non-uniform scales. */
  private transformVertices(source: Float32Array, out: Float32Array, first: number, m: Float64Array, n: Float64Array, renormalise: boolean): void {
    const m0 = m[0], m1 = m[1], m2 = m[2], m4 = m[4], m5 = m[5], m6 = m[6], m8 = m[8], m9 = m[9], m10 = m[10];
    const n0 = n[0], n1 = n[1], n2 = n[2], n3 = n[3], n4 = n[4], n5 = n[5], n6 = n[6], n7 = n[7], n8 = n[8];
    const tx = m[12] - this.offset[0];
    const ty = m[13] - this.offset[1];
    const tz = m[14] - this.offset[2];
    const bounds = this.bounds;
    let minX = bounds[0], minY = bounds[1], minZ = bounds[2], maxX = bounds[3], maxY = bounds[4], maxZ = bounds[5];
    for (let v = 0, o = first; v < source.length; v += FLOATS_PER_VERTEX, o += FLOATS_PER_VERTEX) {
      const x = source[v];
      const y = source[v + 1];
      const z = source[v + 2];
      const px = m0 * x + m4 * y + m8 * z + tx;
      const py = m1 * x + m5 * y + m9 * z + ty;
      const pz = m2 * x + m6 * y + m10 * z + tz;
      out[o] = px;
      out[o + 1] = py;
      out[o + 2] = pz;
      if (px < minX) minX = px;
      if (px > maxX) maxX = px;
      if (py < minY) minY = py;
      if (py > maxY) maxY = py;
      if (pz < minZ) minZ = pz;
      if (pz > maxZ) maxZ = pz;
      const a = source[v + 3];
      const b = source[v + 4];
      const c = source[v + 5];
      let nx = n0 * a + n3 * b + n6 * c;
      let ny = n1 * a + n4 * b + n7 * c;
      let nz = n2 * a + n5 * b + n8 * c;
      if (renormalise) {
        const inverseLength = 1 / (Math.sqrt(nx * nx + ny * ny + nz * nz) || 1);
        nx *= inverseLength;
        ny *= inverseLength;
        nz *= inverseLength;
      }
      out[o + 3] = nx;
      out[o + 4] = ny;
      out[o + 5] = nz;
    }
    bounds[0] = minX;
    bounds[1] = minY;
    bounds[2] = minZ;
    bounds[3] = maxX;
    bounds[4] = maxY;
    bounds[5] = maxZ;
  }

  /** The merged mesh of the pieces added since the last call (undefined when there were none). */
  take(expressId: number): ElementMesh | undefined {
    const floats = this.vertexCount * FLOATS_PER_VERTEX;
    if (floats === 0) return undefined;
    const vertices = this.store.vertices.close(floats);
    const indices = this.vertexCount <= 0xffff ? this.store.shortIndices.take(this.indexCount) : this.store.longIndices.take(this.indexCount);
    indices.set(this.indices.subarray(0, this.indexCount));
    const [minX, minY, minZ, maxX, maxY, maxZ] = this.bounds;
    const min: [number, number, number] = [Math.fround(minX), Math.fround(minY), Math.fround(minZ)];
    const max: [number, number, number] = [Math.fround(maxX), Math.fround(maxY), Math.fround(maxZ)];
    this.bounds.set(EMPTY_BOUNDS);
    this.vertexCount = 0;
    this.indexCount = 0;
    return { expressId, vertices, indices, min, max };
  }
}
