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

/** Hands out views into large arrays of one element type. */
class Arena<T extends Float32Array | Uint16Array | Uint32Array> {
  private current: T;
  private used = 0;

  constructor(private readonly make: TypedArrayOf<T>) {
    this.current = new make(ARENA_ELEMENTS) as T;
  }

  take(length: number): T {
    if (this.used + length > this.current.length) {
      this.current = new this.make(Math.max(ARENA_ELEMENTS, length)) as T;
      this.used = 0;
    }
    const view = this.current.subarray(this.used, this.used + length) as T;
    this.used += length;
    return view;
  }
}

/** The arrays all meshes of one model are stored in. */
export class MeshStore {
  readonly vertices = new Arena<Float32Array>(Float32Array);
  readonly shortIndices = new Arena<Uint16Array>(Uint16Array);
  readonly longIndices = new Arena<Uint32Array>(Uint32Array);
}

/** Accumulates the pieces of one element at a time in reused scratch arrays. */
export class ElementMeshBuilder {
  private vertices = new Float32Array(64 * 1024);
  private indices = new Uint32Array(64 * 1024);
  private vertexCount = 0;
  private indexCount = 0;

  /** `offset` is subtracted after transforming (glTF axes, metres). */
  constructor(
    private readonly offset: readonly [number, number, number],
    private readonly store: MeshStore,
  ) {}

  private reserve(floats: number, indices: number): void {
    if (floats > this.vertices.length) {
      const grown = new Float32Array(Math.max(floats, 2 * this.vertices.length));
      grown.set(this.vertices.subarray(0, this.vertexCount * FLOATS_PER_VERTEX));
      this.vertices = grown;
    }
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
    this.reserve((base + count) * FLOATS_PER_VERTEX, this.indexCount + sourceIndices.length);
    const m = transform;
    const n = normalMatrix(m as Mat4);
    const [ox, oy, oz] = this.offset;
    const out = this.vertices;
    let o = base * FLOATS_PER_VERTEX;
    for (let v = 0; v < source.length; v += FLOATS_PER_VERTEX, o += FLOATS_PER_VERTEX) {
      const x = source[v];
      const y = source[v + 1];
      const z = source[v + 2];
      out[o] = m[0] * x + m[4] * y + m[8] * z + m[12] - ox;
      out[o + 1] = m[1] * x + m[5] * y + m[9] * z + m[13] - oy;
      out[o + 2] = m[2] * x + m[6] * y + m[10] * z + m[14] - oz;
      const a = source[v + 3];
      const b = source[v + 4];
      const c = source[v + 5];
      const nx = n[0] * a + n[3] * b + n[6] * c;
      const ny = n[1] * a + n[4] * b + n[7] * c;
      const nz = n[2] * a + n[5] * b + n[8] * c;
      const length = Math.sqrt(nx * nx + ny * ny + nz * nz) || 1;
      out[o + 3] = nx / length;
      out[o + 4] = ny / length;
      out[o + 5] = nz / length;
    }
    const indices = this.indices;
    let at = this.indexCount;
    // A mirroring transform turns faces inside out; swap two corners of each triangle to turn them back.
    const flip = determinant3(m as Mat4) < 0;
    for (let i = 0; i + 2 < sourceIndices.length; i += 3, at += 3) {
      indices[at] = sourceIndices[i] + base;
      indices[at + 1] = sourceIndices[flip ? i + 2 : i + 1] + base;
      indices[at + 2] = sourceIndices[flip ? i + 1 : i + 2] + base;
    }
    this.vertexCount += count;
    this.indexCount = at;
  }

  /** The merged mesh of the pieces added since the last call (undefined when there were none). */
  take(expressId: number): ElementMesh | undefined {
    const floats = this.vertexCount * FLOATS_PER_VERTEX;
    if (floats === 0) return undefined;
    const vertices = this.store.vertices.take(floats);
    vertices.set(this.vertices.subarray(0, floats));
    const indices = this.vertexCount <= 0xffff ? this.store.shortIndices.take(this.indexCount) : this.store.longIndices.take(this.indexCount);
    indices.set(this.indices.subarray(0, this.indexCount));
    const min: [number, number, number] = [Infinity, Infinity, Infinity];
    const max: [number, number, number] = [-Infinity, -Infinity, -Infinity];
    for (let v = 0; v < floats; v += FLOATS_PER_VERTEX) {
      for (let k = 0; k < 3; k++) {
        const value = vertices[v + k];
        if (value < min[k]) min[k] = value;
        if (value > max[k]) max[k] = value;
      }
    }
    this.vertexCount = 0;
    this.indexCount = 0;
    return { expressId, vertices, indices, min, max };
  }
}
