import { ElementMeshBuilder, FLOATS_PER_VERTEX, MeshStore } from './element-mesh';

// Column-major 4×4 matrices, as web-ifc hands them out (and as glTF stores them).
const IDENTITY = [1, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1];
const translate = (x: number, y: number, z: number) => [1, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1, 0, x, y, z, 1];
// A quarter turn about Z takes +X to +Y (right-hand rule; common practice, no source).
const QUARTER_TURN_Z = [0, 1, 0, 0, -1, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1];
const MIRROR_X = [-1, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1];

/** One triangle in the XY plane facing +Z, plus `extra` vertices that no triangle uses (to make a piece large). */
function triangle(extra = 0): { vertices: Float32Array; indices: Uint32Array } {
  const vertices = new Float32Array((3 + extra) * FLOATS_PER_VERTEX);
  vertices.set([0, 0, 0, 0, 0, 1, 1, 0, 0, 0, 0, 1, 0, 1, 0, 0, 0, 1]);
  return { vertices, indices: new Uint32Array([0, 1, 2]) };
}

const vertex = (mesh: { vertices: Float32Array }, i: number) => Array.from(mesh.vertices.subarray(i * 6, i * 6 + 6));

describe('element mesh builder', () => {
  it('places vertices by the transform, takes the model offset off and keeps the bounds', () => {
    const builder = new ElementMeshBuilder([10, 0, 0], new MeshStore());
    const piece = triangle();
    builder.add(piece.vertices, piece.indices, translate(12, 3, 4));
    const mesh = builder.take(7)!;
    expect(mesh.expressId).toBe(7);
    expect(vertex(mesh, 1)).toEqual([3, 3, 4, 0, 0, 1]);
    expect(mesh.min).toEqual([2, 3, 4]);
    expect(mesh.max).toEqual([3, 4, 4]);
    expect(Array.from(mesh.indices)).toEqual([0, 1, 2]);
  });

  it('turns normals with the element and keeps them of unit length under a uniform scale', () => {
    const builder = new ElementMeshBuilder([0, 0, 0], new MeshStore());
    const piece = triangle();
    piece.vertices.set([1, 0, 0], 3); // first normal along +X
    const scaledTurn = QUARTER_TURN_Z.map((v, i) => (i < 12 ? 2 * v : v));
    builder.add(piece.vertices, piece.indices, scaledTurn);
    const mesh = builder.take(1)!;
    expect(vertex(mesh, 1).slice(0, 3)).toEqual([0, 2, 0]);
    const [nx, ny, nz] = vertex(mesh, 0).slice(3);
    expect(nx).toBeCloseTo(0, 12);
    expect(ny).toBeCloseTo(1, 12);
    expect(nz).toBeCloseTo(0, 12);
  });


  it('carries normals through a non-uniform scale by the inverse transpose and renormalises them', () => {
    // Stretching X by 2 tilts a face's normal (1, 1, 0)/√2 to (1/2, 1, 0)/|…| = (1, 2, 0)/√5 (normals transform by
    // the inverse transpose; common practice, no source).
    const builder = new ElementMeshBuilder([0, 0, 0], new MeshStore());
    const piece = triangle();
    piece.vertices.set([Math.SQRT1_2, Math.SQRT1_2, 0], 3);
    builder.add(piece.vertices, piece.indices, Float64Array.of(2, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1));
    const mesh = builder.take(2)!;
    expect(vertex(mesh, 1).slice(0, 3)).toEqual([2, 0, 0]);
    const [nx, ny, nz] = vertex(mesh, 0).slice(3);
    expect(nx).toBeCloseTo(1 / Math.sqrt(5), 6);
    expect(ny).toBeCloseTo(2 / Math.sqrt(5), 6);
    expect(nz).toBe(0);
    expect(vertex(mesh, 2).slice(3)).toEqual([0, 0, 1]);
  });

  it('gives the same vertices for a transform as a plain array (web-ifc) and as a Float64Array (our own meshes)', () => {
    const piece = triangle();
    const place = (transform: number[] | Float64Array) => {
      const builder = new ElementMeshBuilder([1, 0, 0], new MeshStore());
      builder.add(piece.vertices, piece.indices, transform);
      return Array.from(builder.take(1)!.vertices);
    };
    const turnAndShift = QUARTER_TURN_Z.map((v, i) => (i >= 12 && i < 15 ? 3 + i : v));
    expect(place(Float64Array.from(turnAndShift))).toEqual(place(turnAndShift));
  });
  it('merges the pieces of one element, indices shifted to each piece’s vertices', () => {
    const builder = new ElementMeshBuilder([0, 0, 0], new MeshStore());
    const piece = triangle();
    builder.add(piece.vertices, piece.indices, IDENTITY);
    builder.add(piece.vertices, piece.indices, translate(0, 0, 5));
    const mesh = builder.take(3)!;
    expect(mesh.vertices.length).toBe(6 * FLOATS_PER_VERTEX);
    expect(Array.from(mesh.indices)).toEqual([0, 1, 2, 3, 4, 5]);
    expect(vertex(mesh, 3)).toEqual([0, 0, 5, 0, 0, 1]);
  });

  it('turns the faces of a mirrored piece back outwards', () => {
    const builder = new ElementMeshBuilder([0, 0, 0], new MeshStore());
    const piece = triangle();
    builder.add(piece.vertices, piece.indices, MIRROR_X);
    expect(Array.from(builder.take(4)!.indices)).toEqual([0, 2, 1]);
  });

  it('gives nothing for an element without pieces and starts afresh after each take', () => {
    const builder = new ElementMeshBuilder([0, 0, 0], new MeshStore());
    expect(builder.take(1)).toBeUndefined();
    const piece = triangle();
    builder.add(piece.vertices, piece.indices, IDENTITY);
    builder.take(1);
    builder.add(piece.vertices, piece.indices, translate(1, 0, 0));
    const second = builder.take(2)!;
    expect(second.vertices.length).toBe(3 * FLOATS_PER_VERTEX);
    expect(vertex(second, 0)).toEqual([1, 0, 0, 0, 0, 1]);
  });

  it('keeps an element whole and earlier elements untouched when it outgrows the current block of storage', () => {
    const store = new MeshStore();
    const builder = new ElementMeshBuilder([0, 0, 0], store);
    const small = triangle();
    builder.add(small.vertices, small.indices, translate(9, 9, 9));
    const earlier = builder.take(1)!;
    // Two pieces of 400 000 vertices each: together more than one 4 Mi-float block holds, so the second piece moves
    // the first to a fresh block.
    const big = triangle(400_000 - 3);
    builder.add(big.vertices, big.indices, translate(1, 0, 0));
    builder.add(big.vertices, big.indices, translate(2, 0, 0));
    const mesh = builder.take(2)!;
    expect(mesh.vertices.length).toBe(800_000 * FLOATS_PER_VERTEX);
    expect(vertex(mesh, 1)).toEqual([2, 0, 0, 0, 0, 1]);
    expect(vertex(mesh, 400_001)).toEqual([3, 0, 0, 0, 0, 1]);
    expect(Array.from(mesh.indices.subarray(3, 6))).toEqual([400_000, 400_001, 400_002]);
    expect(mesh.indices).toBeInstanceOf(Uint32Array);
    expect(vertex(earlier, 0)).toEqual([9, 9, 9, 0, 0, 1]);
  });
});
