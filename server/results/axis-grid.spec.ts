import type { Point3_mm } from '../ifc/model-read-result';
import { type AxisSegment, AxisGrid, distanceToSegment_mm } from './axis-grid';

describe('distanceToSegment_mm', () => {
  const segment: AxisSegment = { start_mm: [0, 0, 0], end_mm: [10, 0, 0] };

  it('measures to the foot of the perpendicular inside the segment, and to the nearer end outside it', () => {
    expect(distanceToSegment_mm([5, 3, 4], segment)).toBeCloseTo(5, 12);
    expect(distanceToSegment_mm([13, 4, 0], segment)).toBeCloseTo(5, 12);
    expect(distanceToSegment_mm([-3, 0, 4], segment)).toBeCloseTo(5, 12);
  });

  it('treats a zero-length axis as a point', () => {
    expect(distanceToSegment_mm([3, 4, 0], { start_mm: [0, 0, 0], end_mm: [0, 0, 0] })).toBeCloseTo(5, 12);
  });
});

describe('AxisGrid', () => {
  /** Deterministic pseudo-random numbers (a linear congruential generator), so failures reproduce. */
  function random(seed: number): () => number {
    let state = seed;
    return () => {
      state = (state * 1664525 + 1013904223) % 4294967296;
      return state / 4294967296;
    };
  }

  it('finds exactly the axes a brute-force search finds, long diagonals included', () => {
    const next = random(7);
    const point = (span: number): Point3_mm => [next() * span, next() * span, next() * span];
    const axes: (AxisSegment | null)[] = Array.from({ length: 300 }, (_, i) => {
      if (i % 50 === 0) return null;
      const start = point(40000);
      // Mostly frame-sized members, some very long diagonals that take the along-the-axis path.
      const reach = i % 10 === 0 ? 60000 : 6000;
      return { start_mm: start, end_mm: [start[0] + (next() - 0.5) * reach, start[1] + (next() - 0.5) * reach, start[2] + (next() - 0.5) * reach] };
    });
    const radius = 150;
    const grid = new AxisGrid(axes, radius);
    for (let probe = 0; probe < 2000; probe++) {
      // Probe points near random axes as well as anywhere.
      const axis = axes[Math.floor(next() * axes.length)];
      const p: Point3_mm =
        axis && probe % 2 === 0
          ? [axis.start_mm[0] + (next() - 0.5) * 400, axis.start_mm[1] + (next() - 0.5) * 400, axis.start_mm[2] + (next() - 0.5) * 400]
          : point(40000);
      const expected = axes.flatMap((a, index) => (a && distanceToSegment_mm(p, a) <= radius ? [index] : [])).sort((x, y) => x - y);
      const found = grid.near(p).map((hit) => hit.index).sort((x, y) => x - y);
      expect(found).toEqual(expected);
    }
  });
});
