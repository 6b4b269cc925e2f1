/** Outlines of axis-aligned rectangles taken together (invented plates; expected areas by arithmetic beside each). */
import { signedDoubleArea_mm2 } from './profile-curve';
import { rectangleUnion } from './rectangle-union';

const box = (minX: number, minY: number, maxX: number, maxY: number) => ({ minX, minY, maxX, maxY });

describe('rectangleUnion', () => {
  it('merges overlapping plates: a web running into both flanges counts once (2·200·10 + 180·8)', () => {
    const union = rectangleUnion([box(-100, 90, 100, 100), box(-100, -100, 100, -90), box(-4, -100, 4, 100)]);
    if ('problem' in union) throw new Error(union.problem);
    expect(signedDoubleArea_mm2(union.outer) / 2).toBe(2 * 200 * 10 + 180 * 8);
    expect(union.outer).toHaveLength(12);
    expect(union.voids).toEqual([]);
  });

  it('gives a void clockwise for a ring of four plates', () => {
    const union = rectangleUnion([box(0, 0, 10, 100), box(90, 0, 100, 100), box(10, 0, 90, 10), box(10, 90, 90, 100)]);
    if ('problem' in union) throw new Error(union.problem);
    expect(signedDoubleArea_mm2(union.outer) / 2).toBe(100 * 100);
    expect(union.voids.map((v) => signedDoubleArea_mm2(v) / 2)).toEqual([-80 * 80]);
  });

  it('refuses plates that touch only at a corner or do not touch at all', () => {
    expect(rectangleUnion([box(0, 0, 10, 10), box(10, 10, 20, 20)])).toEqual({ problem: 'its parts touch only at a corner' });
    expect(rectangleUnion([box(0, 0, 10, 10), box(20, 0, 30, 10)])).toEqual({ problem: 'its parts make 2 separate pieces, not one' });
  });
});
