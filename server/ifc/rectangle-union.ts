/**
 * The outline of several axis-aligned rectangles taken together (the plates of a built-up IfcCompositeProfileDef:
 * a welded I from three plates, a box from four): the plane is cut into the grid of all rectangle edges, the covered
 * cells are found, and their outside edges are chained into loops with the material on the left, so the outer loop
 * runs counter-clockwise and voids clockwise by construction.
 */
import type { Point2_mm } from '../engine/section-family';
import { signedDoubleArea_mm2 } from './profile-curve';

export interface Rectangle_mm {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

/** Edges closer than this share of the overall extent are one edge (unit conversion leaves 1e-13 mm differences). */
const SNAP = 1e-9;

function gridLines(values: number[], tolerance: number): number[] {
  const sorted = values.slice().sort((a, b) => a - b);
  const lines: number[] = [];
  for (const v of sorted) if (lines.length === 0 || v - lines[lines.length - 1] > tolerance) lines.push(v);
  return lines;
}

export function rectangleUnion(rectangles: readonly Rectangle_mm[]): { outer: Point2_mm[]; voids: Point2_mm[][] } | { problem: string } {
  const extent = Math.max(...rectangles.map((r) => Math.max(r.maxX - r.minX, r.maxY - r.minY)));
  const tolerance = SNAP * extent;
  const xs = gridLines(rectangles.flatMap((r) => [r.minX, r.maxX]), tolerance);
  const ys = gridLines(rectangles.flatMap((r) => [r.minY, r.maxY]), tolerance);
  const nx = xs.length - 1;
  const ny = ys.length - 1;
  const covered = (i: number, j: number): boolean => {
    if (i < 0 || j < 0 || i >= nx || j >= ny) return false;
    const cx = (xs[i] + xs[i + 1]) / 2;
    const cy = (ys[j] + ys[j + 1]) / 2;
    return rectangles.some((r) => r.minX < cx && cx < r.maxX && r.minY < cy && cy < r.maxY);
  };
  // Grid corner (i, j) as one number; each outside edge of a covered cell leaves its start corner, material on its left.
  const key = (i: number, j: number): number => i * (ny + 1) + j;
  const next = new Map<number, number>();
  const cornerTwice = { found: false };
  const edge = (from: number, to: number): void => {
    if (next.has(from)) cornerTwice.found = true;
    next.set(from, to);
  };
  for (let i = 0; i < nx; i++) {
    for (let j = 0; j < ny; j++) {
      if (!covered(i, j)) continue;
      if (!covered(i, j - 1)) edge(key(i, j), key(i + 1, j));
      if (!covered(i + 1, j)) edge(key(i + 1, j), key(i + 1, j + 1));
      if (!covered(i, j + 1)) edge(key(i + 1, j + 1), key(i, j + 1));
      if (!covered(i - 1, j)) edge(key(i, j + 1), key(i, j));
    }
  }
  if (cornerTwice.found) return { problem: 'its parts touch only at a corner' };
  const loops: Point2_mm[][] = [];
  while (next.size > 0) {
    const [start] = next.keys();
    const corners: Point2_mm[] = [];
    for (let at = start; ; ) {
      corners.push([xs[Math.floor(at / (ny + 1))], ys[at % (ny + 1)]]);
      const to = next.get(at)!;
      next.delete(at);
      at = to;
      if (at === start) break;
    }
    loops.push(withoutStraightCorners(corners));
  }
  const outers = loops.filter((l) => signedDoubleArea_mm2(l) > 0);
  if (outers.length !== 1) return { problem: `its parts make ${outers.length} separate pieces, not one` };
  return { outer: outers[0], voids: loops.filter((l) => signedDoubleArea_mm2(l) < 0) };
}

/** Drops the corners where the loop goes straight on (grid lines of other rectangles cross its edges there). */
function withoutStraightCorners(points: Point2_mm[]): Point2_mm[] {
  return points.filter((p, i) => {
    const a = points[(i + points.length - 1) % points.length];
    const b = points[(i + 1) % points.length];
    return (a[0] - p[0]) * (b[1] - p[1]) - (a[1] - p[1]) * (b[0] - p[0]) !== 0;
  });
}
