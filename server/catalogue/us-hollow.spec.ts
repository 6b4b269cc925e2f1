import { expectClose } from '../engine/expect-close';
import { MM_PER_IN } from '../engine/units';
import { findCatalogueEntry } from './catalogue-lookup';
import { outlineArea_mm2 } from './entry-area';
import { HSS_ROWS, ROUND_HSS_ROWS, US_HSS_ENTRIES, US_ROUND_HSS_ENTRIES } from './us-hollow';

describe('AISC rectangular, square and round HSS', () => {
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

  it.each(['HSS6x6x3/8', 'HSS6X6X.375', 'HSS6X6X3/8', 'Column:HSS6x6x3/8:1'])('finds %s as HSS6X6X3/8 with t_des', (text) => {
    // AISC Shapes Database v15.0, HSS6X6X3/8: Ht = B 6.00, t_nom 0.375, t_des 0.349 in, A 7.58 in².
    const hit = findCatalogueEntry(text);
    expect(hit).toMatchObject({ entry: { name: 'HSS6X6X3/8', family: 'box', process: 'cold-formed' } });
    expect(hit!.entry.dimensions).toMatchObject({ depth_mm: 6 * MM_PER_IN, width_mm: 6 * MM_PER_IN, webThickness_mm: 0.349 * MM_PER_IN });
  });

  it.each(['HSS6.625x0.280', 'HSS6.625X.280', 'HSS6.625X0.280'])('finds %s as the round HSS6.625X0.280 with t_des', (text) => {
    // AISC Shapes Database v15.0, HSS6.625X.280: OD 6.625 (label; the OD column says 6.63), t_nom 0.280, t_des 0.260 in,
    // A 5.20 in².
    const hit = findCatalogueEntry(text);
    expect(hit).toMatchObject({ entry: { name: 'HSS6.625X0.280', family: 'tube' } });
    expect(hit!.entry.dimensions).toEqual({ family: 'tube', diameter_mm: 6.625 * MM_PER_IN, wallThickness_mm: 0.26 * MM_PER_IN });
    // The database gives t_des to three decimals: 0.93 × 0.280 = 0.2604 is tabulated 0.260.
    expectClose(0.26, 0.93 * 0.28, 0.002, 't_des');
  });

  it('rebuilds the tabulated area of every round HSS within 1 % from its outside diameter and t_des', () => {
    for (const [index, [label, area]] of ROUND_HSS_ROWS.entries()) expectClose(outlineArea_mm2(US_ROUND_HSS_ENTRIES[index].dimensions) / MM_PER_IN ** 2, area, 0.01, `${label} A`);
  });

  it('reads a round HSS with a whole-inch diameter written either way', () => {
    // The database's EDI name 'HSS6X.500' and its Manual label 'HSS6.000X0.500' are the same section.
    expect(findCatalogueEntry('HSS6X.500')?.entry.name).toBe('HSS6.000X0.500');
  });
});
