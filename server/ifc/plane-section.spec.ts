/**
 * Plane cuts of faces built in the spec (invented shapes); areas by the shoelace formula (common practice, no source).
 */
import type { BodyFaces } from './body-faces';
import { prismFaceLoops } from './body-step';
import { fromColumns, type Vec3 } from './matrix4';
import { type CutAxes, planeSection, toSectionPolygon } from './plane-section';

/** Flat arrays of faces given as loops of points (a point per loop corner, none shared: the cut joins them by place). */
function facesOf(faces: Vec3[][][]): BodyFaces {
  const positions: number[] = [];
  const loopVertices: number[] = [];
  const loopStarts: number[] = [];
  const faceStarts: number[] = [];
  for (const loops of faces) {
    faceStarts.push(loopStarts.length);
    for (const loop of loops) {
      loopStarts.push(loopVertices.length);
      for (const p of loop) {
        loopVertices.push(positions.length / 3);
        positions.push(...p);
      }
    }
  }
  return {
    positions: Float64Array.from(positions),
    loopVertices: Uint32Array.from(loopVertices),
    loopStarts: Uint32Array.from([...loopStarts, loopVertices.length]),
    faceStarts: Uint32Array.from([...faceStarts, loopStarts.length]),
  };
}

const ALONG_Z: CutAxes = { u: [1, 0, 0], v: [0, 1, 0], w: [0, 0, 1] };

// A 10 mm wall in the y–z plane, 200 wide (y) and 1000 high (z), with a 100 × 600 opening from z = 200 to 800: its
// two large faces have the opening as a hole, so a cut through the opening crosses each of them four times.
const OPENING = {
  outer: [
    [0, -100],
    [1000, -100],
    [1000, 100],
    [0, 100],
  ] as [number, number][],
  voids: [
    [
      [200, -50],
      [200, 50],
      [800, 50],
      [800, -50],
    ] as [number, number][],
  ],
};
// The outline's x runs along z and its y along y; the wall's thickness is extruded along x.
const WALL = facesOf(prismFaceLoops(OPENING, 10, { place: fromColumns([0, 0, 1], [0, 1, 0], [1, 0, 0], [0, 0, 0]) }));

describe('planeSection', () => {
  it('pairs the crossings of a face with a hole along its line: below the opening the wall is one 10 × 200 strip', () => {
    const section = planeSection(WALL, ALONG_Z, 100, 200);
    if (section.status !== 'section') throw new Error(section.reason);
    expect(section.area).toBeCloseTo(2000, 9);
    expect(section.voids).toEqual([]);
    expect(section.bounds).toEqual([0, -100, 10, 100]);
  });

  it('finds two pieces where the cut passes through the opening', () => {
    expect(planeSection(WALL, ALONG_Z, 500, 200)).toEqual({
      status: 'failed',
      reason: 'the cut gives 2 separate pieces (two members in one body, or a built-up pair)',
      pieces: 2,
    });
  });

  it('moves the plane off vertices lying on it rather than counting a crossing twice', () => {
    // z = 200 is the opening's lower edge: moved up by a millionth of the size, the cut is in the opening.
    expect(planeSection(WALL, ALONG_Z, 200, 200)).toMatchObject({ status: 'failed', reason: expect.stringContaining('2 separate pieces') });
  });

  it('finds no material beyond the body', () => {
    expect(planeSection(WALL, ALONG_Z, 2000, 200)).toEqual({ status: 'failed', reason: 'the cut finds no material' });
  });
});

describe('toSectionPolygon', () => {
  it('scales a section to millimetres', () => {
    const square: [number, number][] = [
      [0, 0],
      [2, 0],
      [2, 2],
      [0, 2],
    ];
    expect(toSectionPolygon(square, [], 1000).outer).toEqual([
      [0, 0],
      [2000, 0],
      [2000, 2000],
      [0, 2000],
    ]);
  });
});
