/**
 * AISC rectangular and square HSS (ASTM A500, electric-resistance welded), named by their AISC Manual label
 * ('HSS5X4X3/8'). The wall stored is the design wall t_des = 0.93 t_nom that AISC 360 (B4.2) requires for section
 * properties, not the nominal one in the name: ERW tubes are made near the lower wall tolerance, so t_des is the closer
 * description of the steel, and a shear check on the nominal wall would be about 7 % unconservative.
 */
import { MM_PER_IN } from '../engine/units';
import type { CatalogueEntry, CatalogueSource } from './catalogue-section';
import { hollowBox } from './hollow-corners';

export const US_HSS_SOURCE: CatalogueSource = {
  id: 'aisc-shapes-v15.0-hss',
  title: 'AISC Shapes Database v15.0, rectangular and square HSS: Ht, B, t_des and A',
  provenance:
    'Transcribed from the published database file aisc-shapes-database-v15.0.csv (copy read at ' +
    'github.com/jonsadka/steel-explorer); only the HSS5 and HSS4 rows read so far are here. Outer corner radius 2 t_des ' +
    'and inner t_des as AISC computes properties (from memory), confirmed by every tabulated area in the spec.',
  fromMemory: false,
};

/** AISC Manual label, A (in²), Ht, B, t_des (in); A is kept only for the spec's cross-check. */
export type HssRow = readonly [label: string, area_in2: number, ht_in: number, b_in: number, tdes_in: number];

// Source: US_HSS_SOURCE, every row.
export const HSS_ROWS: readonly HssRow[] = [
  ['HSS5X5X3/16', 3.28, 5.00, 5.00, 0.174],
  ['HSS5X5X1/8', 2.23, 5.00, 5.00, 0.116],
  ['HSS5X4X1/2', 6.95, 5.00, 4.00, 0.465],
  ['HSS5X4X3/8', 5.48, 5.00, 4.00, 0.349],
  ['HSS5X4X5/16', 4.68, 5.00, 4.00, 0.291],
  ['HSS5X4X1/4', 3.84, 5.00, 4.00, 0.233],
  ['HSS5X4X3/16', 2.93, 5.00, 4.00, 0.174],
  ['HSS5X4X1/8', 2.00, 5.00, 4.00, 0.116],
  ['HSS5X3X1/2', 6.02, 5.00, 3.00, 0.465],
  ['HSS5X3X3/8', 4.78, 5.00, 3.00, 0.349],
  ['HSS5X3X5/16', 4.10, 5.00, 3.00, 0.291],
  ['HSS5X3X1/4', 3.37, 5.00, 3.00, 0.233],
  ['HSS5X3X3/16', 2.58, 5.00, 3.00, 0.174],
  ['HSS5X3X1/8', 1.77, 5.00, 3.00, 0.116],
  ['HSS4-1/2X4-1/2X1/2', 6.95, 4.50, 4.50, 0.465],
  ['HSS4-1/2X4-1/2X3/8', 5.48, 4.50, 4.50, 0.349],
  ['HSS4-1/2X4-1/2X5/16', 4.68, 4.50, 4.50, 0.291],
  ['HSS4-1/2X4-1/2X1/4', 3.84, 4.50, 4.50, 0.233],
  ['HSS4-1/2X4-1/2X3/16', 2.93, 4.50, 4.50, 0.174],
  ['HSS4-1/2X4-1/2X1/8', 2.00, 4.50, 4.50, 0.116],
  ['HSS4X4X1/2', 6.02, 4.00, 4.00, 0.465],
  ['HSS4X4X3/8', 4.78, 4.00, 4.00, 0.349],
  ['HSS4X4X5/16', 4.10, 4.00, 4.00, 0.291],
];

export const US_HSS_ENTRIES: readonly CatalogueEntry[] = HSS_ROWS.map(([label, , ht, b, tdes]) => {
  const t_mm = tdes * MM_PER_IN;
  return {
    name: label,
    series: label.slice(0, label.lastIndexOf('X')),
    family: 'box',
    dimensions: hollowBox(ht * MM_PER_IN, b * MM_PER_IN, t_mm, { outer_mm: 2 * t_mm, inner_mm: t_mm }),
    process: 'cold-formed',
    sourceId: US_HSS_SOURCE.id,
  };
});
