/**
 * One element's triangles in glTF space (metres, Y up), merged from all its pieces: interleaved position + normal
 * (6 floats a vertex) and indices. Pieces arrive in their own coordinates with a transform to glTF space; the
 * transform is applied in double precision and the model offset taken off before rounding to 32-bit floats.
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

interface Piece {
  vertices: Float32Array;
  indices: Uint16Array | Uint32Array;
}

/** 16-bit indices while the vertex count allows (the glb is a third smaller then). */
function indexArray(vertexCount: number, length: number): Uint16Array | Uint32Array {
  return vertexCount <= 0xffff ? new Uint16Array(length) : new Uint32Array(length);
}

/** Accumulates the pieces of one element at a time. */
export class ElementMeshBuilder {
  private pieces: Piece[] = [];
  private vertexCount = 0;
  private indexCount = 0;

  /** `offset` is subtracted after transforming (glTF axes, metres). */
  constructor(private readonly offset: readonly [number, number, number]) {}

  /**
   * Adds a piece: `source` holds x, y, z, nx, ny, nz per vertex in the piece's coordinates (a view into web-ifc's
   * memory is fine: it is read at once); `transform` takes them to glTF space.
   */
  add(source: Float32Array, sourceIndices: Uint32Array, transform: Mat4 | readonly number[]): void {
    const count = source.length / FLOATS_PER_VERTEX;
    if (count === 0 || sourceIndices.length === 0) return;
    const m = transform;
    const n = normalMatrix(m as Mat4);
    const [ox, oy, oz] = this.offset;
    const out = new Float32Array(source.length);
    for (let v = 0; v < source.length; v += FLOATS_PER_VERTEX) {
      const x = source[v];
      const y = source[v + 1];
      const z = source[v + 2];
      out[v] = m[0] * x + m[4] * y + m[8] * z + m[12] - ox;
      out[v + 1] = m[1] * x + m[5] * y + m[9] * z + m[13] - oy;
      out[v + 2] = m[2] * x + m[6] * y + m[10] * z + m[14] - oz;
      const a = source[v + 3];
      const b = source[v + 4];
      const c = source[v + 5];
      const nx = n[0] * a + n[3] * b + n[6] * c;
      const ny = n[1] * a + n[4] * b + n[7] * c;
      const nz = n[2] * a + n[5] * b + n[8] * c;
      const length = Math.sqrt(nx * nx + ny * ny + nz * nz) || 1;
      out[v + 3] = nx / length;
      out[v + 4] = ny / length;
      out[v + 5] = nz / length;
    }
    const indices = indexArray(count, sourceIndices.length);
    indices.set(sourceIndices);
    // A mirroring transform turns faces inside out; swap two corners of each triangle to turn them back.
    if (determinant3(m as Mat4) < 0) {
      for (let i = 0; i + 2 < indices.length; i += 3) {
        const t = indices[i + 1];
        indices[i + 1] = indices[i + 2];
        indices[i + 2] = t;
      }
    }
    this.pieces.push({ vertices: out, indices });
    this.vertexCount += count;
    this.indexCount += indices.length;
  }

  get isEmpty(): boolean {
    return this.vertexCount === 0;
  }

  /** The merged mesh of the pieces added since the last call (undefined when there were none). */
  take(expressId: number): ElementMesh | undefined {
    if (this.vertexCount === 0) {
      this.pieces = [];
      return undefined;
    }
    const single = this.pieces.length === 1 ? this.pieces[0] : undefined;
    const vertices = single ? single.vertices : new Float32Array(this.vertexCount * FLOATS_PER_VERTEX);
    const indices = single ? single.indices : indexArray(this.vertexCount, this.indexCount);
    if (!single) {
      let vertexBase = 0;
      let indexAt = 0;
      for (const piece of this.pieces) {
        vertices.set(piece.vertices, vertexBase * FLOATS_PER_VERTEX);
        for (let i = 0; i < piece.indices.length; i++) indices[indexAt++] = piece.indices[i] + vertexBase;
        vertexBase += piece.vertices.length / FLOATS_PER_VERTEX;
      }
    }
    const min: [number, number, number] = [Infinity, Infinity, Infinity];
    const max: [number, number, number] = [-Infinity, -Infinity, -Infinity];
    for (let v = 0; v < vertices.length; v += FLOATS_PER_VERTEX) {
      for (let k = 0; k < 3; k++) {
        const value = vertices[v + k];
        if (value < min[k]) min[k] = value;
        if (value > max[k]) max[k] = value;
      }
    }
    this.pieces = [];
    this.vertexCount = 0;
    this.indexCount = 0;
    return { expressId, vertices, indices, min, max };
  }
}
