/**
 * AISC rectangular, square and round HSS (ASTM A500, electric-resistance welded), named by their AISC Manual label
 * ('HSS5X4X3/8', 'HSS6.625X0.280'). The wall stored is the design wall t_des = 0.93 t_nom that AISC 360 (B4.2) requires for section
 * properties, not the nominal one in the name: ERW tubes are made near the lower wall tolerance, so t_des is the closer
 * description of the steel, and a shear check on the nominal wall would be about 7 % unconservative.
 */
import { MM_PER_IN } from '../engine/units';
import type { CatalogueEntry, CatalogueSource } from './catalogue-section';
import { hollowBox, tube } from './hollow-corners';

export const US_HSS_SOURCE: CatalogueSource = {
  id: 'aisc-shapes-v15.0-hss',
  title: 'AISC Shapes Database v15.0, rectangular, square and round HSS: Ht, B or OD, t_des and A',
  provenance:
    'Transcribed from the published database file aisc-shapes-database-v15.0.csv (copy read at ' +
    'github.com/jonsadka/steel-explorer); only the rows read so far are here (rectangular HSS10X3 to HSS4X4, round ' +
    'HSS6.875 to HSS5). Outer corner radius 2 t_des and inner t_des as AISC computes properties (from memory), ' +
    'confirmed by every tabulated area in the spec; round HSS diameters are read from the label, the OD column being ' +
    'rounded to two decimals.',
  fromMemory: false,
};

/** AISC Manual label, A (in²), Ht, B, t_des (in); A is kept only for the spec's cross-check. */
export type HssRow = readonly [label: string, area_in2: number, ht_in: number, b_in: number, tdes_in: number];

// Source: US_HSS_SOURCE, every row.
export const HSS_ROWS: readonly HssRow[] = [
  ['HSS10X3X3/16', 4.32, 10.00, 3.00, 0.174],
  ['HSS10X3X1/8', 2.93, 10.00, 3.00, 0.116],
  ['HSS10X2X3/8', 7.58, 10.00, 2.00, 0.349],
  ['HSS10X2X5/16', 6.43, 10.00, 2.00, 0.291],
  ['HSS10X2X1/4', 5.24, 10.00, 2.00, 0.233],
  ['HSS10X2X3/16', 3.98, 10.00, 2.00, 0.174],
  ['HSS10X2X1/8', 2.70, 10.00, 2.00, 0.116],
  ['HSS9X9X5/8', 18.7, 9.00, 9.00, 0.581],
  ['HSS9X9X1/2', 15.3, 9.00, 9.00, 0.465],
  ['HSS9X9X3/8', 11.8, 9.00, 9.00, 0.349],
  ['HSS9X9X5/16', 9.92, 9.00, 9.00, 0.291],
  ['HSS9X9X1/4', 8.03, 9.00, 9.00, 0.233],
  ['HSS9X9X3/16', 6.06, 9.00, 9.00, 0.174],
  ['HSS9X9X1/8', 4.09, 9.00, 9.00, 0.116],
  ['HSS9X7X5/8', 16.4, 9.00, 7.00, 0.581],
  ['HSS9X7X1/2', 13.5, 9.00, 7.00, 0.465],
  ['HSS9X7X3/8', 10.4, 9.00, 7.00, 0.349],
  ['HSS9X7X5/16', 8.76, 9.00, 7.00, 0.291],
  ['HSS9X7X1/4', 7.10, 9.00, 7.00, 0.233],
  ['HSS9X7X3/16', 5.37, 9.00, 7.00, 0.174],
  ['HSS9X5X5/8', 14.0, 9.00, 5.00, 0.581],
  ['HSS9X5X1/2', 11.6, 9.00, 5.00, 0.465],
  ['HSS9X5X3/8', 8.97, 9.00, 5.00, 0.349],
  ['HSS9X5X5/16', 7.59, 9.00, 5.00, 0.291],
  ['HSS9X5X1/4', 6.17, 9.00, 5.00, 0.233],
  ['HSS9X5X3/16', 4.67, 9.00, 5.00, 0.174],
  ['HSS9X3X1/2', 9.74, 9.00, 3.00, 0.465],
  ['HSS9X3X3/8', 7.58, 9.00, 3.00, 0.349],
  ['HSS9X3X5/16', 6.43, 9.00, 3.00, 0.291],
  ['HSS9X3X1/4', 5.24, 9.00, 3.00, 0.233],
  ['HSS9X3X3/16', 3.98, 9.00, 3.00, 0.174],
  ['HSS7X4X3/8', 6.88, 7.00, 4.00, 0.349],
  ['HSS7X4X5/16', 5.85, 7.00, 4.00, 0.291],
  ['HSS7X4X1/4', 4.77, 7.00, 4.00, 0.233],
  ['HSS7X4X3/16', 3.63, 7.00, 4.00, 0.174],
  ['HSS7X4X1/8', 2.46, 7.00, 4.00, 0.116],
  ['HSS7X3X1/2', 7.88, 7.00, 3.00, 0.465],
  ['HSS7X3X3/8', 6.18, 7.00, 3.00, 0.349],
  ['HSS7X3X5/16', 5.26, 7.00, 3.00, 0.291],
  ['HSS7X3X1/4', 4.30, 7.00, 3.00, 0.233],
  ['HSS7X3X3/16', 3.28, 7.00, 3.00, 0.174],
  ['HSS7X3X1/8', 2.23, 7.00, 3.00, 0.116],
  ['HSS7X2X1/4', 3.84, 7.00, 2.00, 0.233],
  ['HSS7X2X3/16', 2.93, 7.00, 2.00, 0.174],
  ['HSS7X2X1/8', 2.00, 7.00, 2.00, 0.116],
  ['HSS6X6X5/8', 11.7, 6.00, 6.00, 0.581],
  ['HSS6X6X1/2', 9.74, 6.00, 6.00, 0.465],
  ['HSS6X6X3/8', 7.58, 6.00, 6.00, 0.349],
  ['HSS6X6X5/16', 6.43, 6.00, 6.00, 0.291],
  ['HSS6X6X1/4', 5.24, 6.00, 6.00, 0.233],
  ['HSS6X6X3/16', 3.98, 6.00, 6.00, 0.174],
  ['HSS6X6X1/8', 2.70, 6.00, 6.00, 0.116],
  ['HSS6X5X1/2', 8.81, 6.00, 5.00, 0.465],
  ['HSS6X5X3/8', 6.88, 6.00, 5.00, 0.349],
  ['HSS6X5X5/16', 5.85, 6.00, 5.00, 0.291],
  ['HSS6X5X1/4', 4.77, 6.00, 5.00, 0.233],
  ['HSS6X5X3/16', 3.63, 6.00, 5.00, 0.174],
  ['HSS6X5X1/8', 2.46, 6.00, 5.00, 0.116],
  ['HSS6X4X1/2', 7.88, 6.00, 4.00, 0.465],
  ['HSS6X4X3/8', 6.18, 6.00, 4.00, 0.349],
  ['HSS6X4X5/16', 5.26, 6.00, 4.00, 0.291],
  ['HSS6X4X1/4', 4.30, 6.00, 4.00, 0.233],
  ['HSS6X4X3/16', 3.28, 6.00, 4.00, 0.174],
  ['HSS6X4X1/8', 2.23, 6.00, 4.00, 0.116],
  ['HSS6X3X1/2', 6.95, 6.00, 3.00, 0.465],
  ['HSS6X3X3/8', 5.48, 6.00, 3.00, 0.349],
  ['HSS6X3X5/16', 4.68, 6.00, 3.00, 0.291],
  ['HSS6X3X1/4', 3.84, 6.00, 3.00, 0.233],
  ['HSS6X3X3/16', 2.93, 6.00, 3.00, 0.174],
  ['HSS6X3X1/8', 2.00, 6.00, 3.00, 0.116],
  ['HSS6X2X3/8', 4.78, 6.00, 2.00, 0.349],
  ['HSS6X2X5/16', 4.10, 6.00, 2.00, 0.291],
  ['HSS6X2X1/4', 3.37, 6.00, 2.00, 0.233],
  ['HSS6X2X3/16', 2.58, 6.00, 2.00, 0.174],
  ['HSS6X2X1/8', 1.77, 6.00, 2.00, 0.116],
  ['HSS5-1/2X5-1/2X3/8', 6.88, 5.50, 5.50, 0.349],
  ['HSS5-1/2X5-1/2X5/16', 5.85, 5.50, 5.50, 0.291],
  ['HSS5-1/2X5-1/2X1/4', 4.77, 5.50, 5.50, 0.233],
  ['HSS5-1/2X5-1/2X3/16', 3.63, 5.50, 5.50, 0.174],
  ['HSS5-1/2X5-1/2X1/8', 2.46, 5.50, 5.50, 0.116],
  ['HSS5X5X1/2', 7.88, 5.00, 5.00, 0.465],
  ['HSS5X5X3/8', 6.18, 5.00, 5.00, 0.349],
  ['HSS5X5X5/16', 5.26, 5.00, 5.00, 0.291],
  ['HSS5X5X1/4', 4.30, 5.00, 5.00, 0.233],
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

/** AISC Manual label, A (in²), outside diameter, t_des (in); A is kept only for the spec's cross-check. */
export type RoundHssRow = readonly [label: string, area_in2: number, od_in: number, tdes_in: number];

// Source: US_HSS_SOURCE, every row.
export const ROUND_HSS_ROWS: readonly RoundHssRow[] = [
  ['HSS6.875X0.312', 6.02, 6.875, 0.291],
  ['HSS6.875X0.250', 4.86, 6.875, 0.233],
  ['HSS6.875X0.188', 3.66, 6.875, 0.174],
  ['HSS6.625X0.500', 9.00, 6.625, 0.465],
  ['HSS6.625X0.432', 7.86, 6.625, 0.402],
  ['HSS6.625X0.375', 6.88, 6.625, 0.349],
  ['HSS6.625X0.312', 5.79, 6.625, 0.291],
  ['HSS6.625X0.280', 5.20, 6.625, 0.260],
  ['HSS6.625X0.250', 4.68, 6.625, 0.233],
  ['HSS6.625X0.188', 3.53, 6.625, 0.174],
  ['HSS6.625X0.125', 2.37, 6.625, 0.116],
  ['HSS6.000X0.500', 8.09, 6.000, 0.465],
  ['HSS6.000X0.375', 6.20, 6.000, 0.349],
  ['HSS6.000X0.312', 5.22, 6.000, 0.291],
  ['HSS6.000X0.280', 4.69, 6.000, 0.260],
  ['HSS6.000X0.250', 4.22, 6.000, 0.233],
  ['HSS6.000X0.188', 3.18, 6.000, 0.174],
  ['HSS6.000X0.125', 2.14, 6.000, 0.116],
  ['HSS5.563X0.500', 7.45, 5.563, 0.465],
  ['HSS5.563X0.375', 5.72, 5.563, 0.349],
  ['HSS5.563X0.258', 4.01, 5.563, 0.240],
  ['HSS5.563X0.188', 2.95, 5.563, 0.174],
  ['HSS5.563X0.134', 2.12, 5.563, 0.124],
  ['HSS5.500X0.500', 7.36, 5.500, 0.465],
  ['HSS5.500X0.375', 5.65, 5.500, 0.349],
  ['HSS5.500X0.258', 3.97, 5.500, 0.240],
  ['HSS5.000X0.500', 6.62, 5.000, 0.465],
  ['HSS5.000X0.375', 5.10, 5.000, 0.349],
  ['HSS5.000X0.312', 4.30, 5.000, 0.291],
  ['HSS5.000X0.258', 3.59, 5.000, 0.240],
  ['HSS5.000X0.250', 3.49, 5.000, 0.233],
  ['HSS5.000X0.188', 2.64, 5.000, 0.174],
  ['HSS5.000X0.125', 1.78, 5.000, 0.116],
];

export const US_ROUND_HSS_ENTRIES: readonly CatalogueEntry[] = ROUND_HSS_ROWS.map(([label, , od, tdes]) => ({
  name: label,
  series: label.slice(0, label.lastIndexOf('X')),
  family: 'tube',
  dimensions: tube(od * MM_PER_IN, tdes * MM_PER_IN),
  process: 'cold-formed',
  sourceId: US_HSS_SOURCE.id,
}));
