import { expectClose } from '../engine/expect-close';
import { MM_PER_IN } from '../engine/units';
import { findCatalogueEntry } from './catalogue-lookup';
import { outlineArea_mm2 } from './entry-area';
import { HSS_ROWS, US_HSS_ENTRIES } from './us-hollow';

describe('AISC rectangular and square HSS', () => {
  it('stores the design wall t_des = 0.93 t_nom', () => {
    // AISC Shapes Database v15.0, HSS4X4X3/8: t_nom 0.375, t_des 0.349 in, A 4.78 in²; 0.93 rule: AISC 360-22 B4.2.
    const d = findCatalogueEntry('HSS4x4x3/8')!.entry.dimensions;
    expect(d).toMatchObject({ family: 'box', webThickness_mm: 0.349 * MM_PER_IN });
    expectClose(0.349, 0.93 * 0.375, 0.001, 't_des');
  });

  it('rebuilds the tabulated area of every HSS within 1 % with corners 2 t_des outside and t_des inside', () => {
    for (const [index, [label, area]] of HSS_ROWS.entries()) expectClose(outlineArea_mm2(US_HSS_ENTRIES[index].dimensions) / MM_PER_IN ** 2, area, 0.01, `${label} A`);
  });

  it('finds a size written with a mixed fraction', () => {
    expect(findCatalogueEntry('HSS4-1/2x4-1/2x1/4')?.entry.name).toBe('HSS4-1/2X4-1/2X1/4');
  });
});
