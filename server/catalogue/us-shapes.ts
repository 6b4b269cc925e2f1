/**
 * US rolled shapes beside the W-shapes, in inches as AISC tabulates them (converted to mm through units.ts): S, M and
 * HP I-shapes, C and MC channels. Columns: AISC Manual label, A (in²), d, bf, tw, tf, k_des (in); A is kept only for the
 * spec's cross-check.
 *
 * S-shapes, C and MC channels have sloped inner flange faces (2 in 12, from memory; for MC channels the slope is the
 * less certain, but with it every MC area below is rebuilt within 1 % while parallel flanges miss by 0.5–3.7 %) and AISC tabulates tf as the average
 * flange thickness, which is the thickness half-way along the outstand: the engine's own convention. The root radius
 * is not tabulated; it is derived from k_des, the distance from the outer flange face to the web toe of the fillet,
 * so that the drawn fillet leaves the web where AISC says it does. Toe radii are not tabulated and taken as 0.
 */
import type { ChannelDimensions } from '../engine/section-family';
import { MM_PER_IN } from '../engine/units';
import type { CatalogueEntry, CatalogueSection, CatalogueSource } from './catalogue-section';

export const US_SHAPES_SOURCE: CatalogueSource = {
  id: 'aisc-shapes-v15.0-s-m-c',
  title: 'AISC Shapes Database v15.0 (companion to the 15th edition Steel Construction Manual), S, M, HP, C and MC shapes',
  provenance:
    'A, d, bf, tw, tf and k_des transcribed from the published database file aisc-shapes-database-v15.0.csv (copy read ' +
    'at github.com/jonsadka/steel-explorer); not every shape of each series is here. The 2-in-12 flange slope of S, C ' +
    'and MC shapes is from memory; root radii are derived from k_des and every area rebuilt within 1 % in the spec. Pin this ' +
    'version when comparing.',
  fromMemory: false,
};

/*
 * Left out, because their area rebuilt with the fillet derived from k_des and no toe radius came out more than 1 %
 * above the tabulated A (the database gives neither radius; for these lighter sizes the derived fillet is too big):
 * S18X70, S18X54.7, S15X42.9, S12X40.8, S12X35, S12X31.8 (1.1–1.9 %), M8X6.2, M6X4.4, M4X6 (1.0–1.8 %), M4X4.08,
 * M4X3.45, M4X3.2, M3X2.9 (3.6–3.9 %), C9X15, C8X13.75, C8X11.5, C6X10.5, C6X8.2, C4X7.25 (1.0–1.4 %), HP10X57,
 * HP10X42, HP8X36 (1.4–2.3 %), MC13X40, MC12X10.6, MC10X8.4, MC8X8.5 (1.0–1.5 %).
 * Not read from the database yet: the heavier HP18 shapes listed before HP18X135, and the MC shapes listed after
 * MC6X16.3 (lighter MC6, MC4 and MC3).
 */
export type UsShapeRow = readonly [label: string, area_in2: number, d_in: number, bf_in: number, tw_in: number, tf_in: number, kdes_in: number];

/** Inner flange slope of S-shapes and C channels: 2 in 12 (16.67 %), from memory. */
export const US_SLOPE_RAD = Math.atan(2 / 12);

// Source: US_SHAPES_SOURCE, every row.
export const S_ROWS: readonly UsShapeRow[] = [
  ['S24X121', 35.5, 24.5, 8.05, 0.800, 1.09, 2.00],
  ['S24X106', 31.1, 24.5, 7.87, 0.620, 1.09, 2.00],
  ['S24X100', 29.3, 24.0, 7.25, 0.745, 0.870, 1.75],
  ['S24X90', 26.5, 24.0, 7.13, 0.625, 0.870, 1.75],
  ['S24X80', 23.5, 24.0, 7.00, 0.500, 0.870, 1.75],
  ['S20X96', 28.2, 20.3, 7.20, 0.800, 0.920, 1.75],
  ['S20X86', 25.3, 20.3, 7.06, 0.660, 0.920, 1.75],
  ['S20X75', 22.0, 20.0, 6.39, 0.635, 0.795, 1.63],
  ['S20X66', 19.4, 20.0, 6.26, 0.505, 0.795, 1.63],
  ['S15X50', 14.7, 15.0, 5.64, 0.550, 0.622, 1.38],
  ['S12X50', 14.7, 12.0, 5.48, 0.687, 0.659, 1.44],
];

// Source: US_SHAPES_SOURCE, every row.
export const M_ROWS: readonly UsShapeRow[] = [
  ['M6X3.7', 1.09, 5.92, 2.00, 0.0980, 0.129, 0.313],
  ['M5X18.9', 5.56, 5.00, 5.00, 0.316, 0.416, 0.813],
];

// Source: US_SHAPES_SOURCE, every row. HP bearing piles: parallel flanges, web and flange nominally equally thick.
export const HP_ROWS: readonly UsShapeRow[] = [
  ['HP18X135', 39.9, 17.5, 17.8, 0.750, 0.750, 1.93],
  ['HP16X183', 54.1, 16.5, 16.3, 1.13, 1.13, 2.31],
  ['HP16X162', 47.7, 16.3, 16.1, 1.00, 1.00, 2.18],
  ['HP16X141', 41.7, 16.0, 16.0, 0.875, 0.875, 2.06],
  ['HP16X121', 35.8, 15.8, 15.9, 0.750, 0.750, 1.93],
  ['HP16X101', 29.9, 15.5, 15.8, 0.625, 0.625, 1.81],
  ['HP16X88', 25.8, 15.3, 15.7, 0.540, 0.540, 1.72],
  ['HP14X117', 34.4, 14.2, 14.9, 0.805, 0.805, 1.50],
  ['HP14X102', 30.1, 14.0, 14.8, 0.705, 0.705, 1.38],
  ['HP14X89', 26.1, 13.8, 14.7, 0.615, 0.615, 1.31],
  ['HP14X73', 21.4, 13.6, 14.6, 0.505, 0.505, 1.19],
  ['HP12X89', 25.9, 12.4, 12.3, 0.720, 0.720, 1.32],
  ['HP12X84', 24.6, 12.3, 12.3, 0.685, 0.685, 1.38],
  ['HP12X74', 21.8, 12.1, 12.2, 0.605, 0.610, 1.31],
  ['HP12X63', 18.4, 11.9, 12.1, 0.515, 0.515, 1.25],
  ['HP12X53', 15.5, 11.8, 12.0, 0.435, 0.435, 1.13],
];

// Source: US_SHAPES_SOURCE, every row.
export const C_ROWS: readonly UsShapeRow[] = [
  ['C15X40', 11.8, 15.0, 3.52, 0.520, 0.650, 1.44],
  ['C15X33.9', 10.0, 15.0, 3.40, 0.400, 0.650, 1.44],
  ['C12X30', 8.81, 12.0, 3.17, 0.510, 0.501, 1.13],
  ['C12X25', 7.34, 12.0, 3.05, 0.387, 0.501, 1.13],
  ['C12X20.7', 6.08, 12.0, 2.94, 0.282, 0.501, 1.13],
  ['C10X30', 8.81, 10.0, 3.03, 0.673, 0.436, 1.00],
  ['C10X25', 7.35, 10.0, 2.89, 0.526, 0.436, 1.00],
  ['C10X20', 5.87, 10.0, 2.74, 0.379, 0.436, 1.00],
  ['C10X15.3', 4.48, 10.0, 2.60, 0.240, 0.436, 1.00],
  ['C9X20', 5.87, 9.00, 2.65, 0.448, 0.413, 1.00],
  ['C9X13.4', 3.94, 9.00, 2.43, 0.233, 0.413, 1.00],
  ['C8X18.75', 5.51, 8.00, 2.53, 0.487, 0.390, 0.938],
  ['C7X14.75', 4.33, 7.00, 2.30, 0.419, 0.366, 0.875],
  ['C7X12.25', 3.59, 7.00, 2.19, 0.314, 0.366, 0.875],
  ['C7X9.8', 2.87, 7.00, 2.09, 0.210, 0.366, 0.875],
  ['C6X13', 3.82, 6.00, 2.16, 0.437, 0.343, 0.813],
  ['C5X9', 2.64, 5.00, 1.89, 0.325, 0.320, 0.750],
  ['C5X6.7', 1.97, 5.00, 1.75, 0.190, 0.320, 0.750],
];

// Source: US_SHAPES_SOURCE, every row. MC (miscellaneous) channels.
export const MC_ROWS: readonly UsShapeRow[] = [
  ['MC18X58', 17.1, 18.0, 4.20, 0.700, 0.625, 1.44],
  ['MC18X51.9', 15.3, 18.0, 4.10, 0.600, 0.625, 1.44],
  ['MC18X45.8', 13.5, 18.0, 4.00, 0.500, 0.625, 1.44],
  ['MC18X42.7', 12.6, 18.0, 3.95, 0.450, 0.625, 1.44],
  ['MC13X50', 14.7, 13.0, 4.41, 0.787, 0.610, 1.44],
  ['MC13X35', 10.3, 13.0, 4.07, 0.447, 0.610, 1.44],
  ['MC13X31.8', 9.35, 13.0, 4.00, 0.375, 0.610, 1.44],
  ['MC12X50', 14.7, 12.0, 4.14, 0.835, 0.700, 1.31],
  ['MC12X45', 13.2, 12.0, 4.01, 0.710, 0.700, 1.31],
  ['MC12X40', 11.8, 12.0, 3.89, 0.590, 0.700, 1.31],
  ['MC12X35', 10.3, 12.0, 3.77, 0.465, 0.700, 1.31],
  ['MC12X31', 9.12, 12.0, 3.67, 0.370, 0.700, 1.31],
  ['MC12X14.3', 4.18, 12.0, 2.12, 0.250, 0.313, 0.750],
  ['MC10X41.1', 12.1, 10.0, 4.32, 0.796, 0.575, 1.31],
  ['MC10X33.6', 9.87, 10.0, 4.10, 0.575, 0.575, 1.31],
  ['MC10X28.5', 8.37, 10.0, 3.95, 0.425, 0.575, 1.31],
  ['MC10X25', 7.34, 10.0, 3.41, 0.380, 0.575, 1.31],
  ['MC10X22', 6.45, 10.0, 3.32, 0.290, 0.575, 1.31],
  ['MC10X6.5', 1.95, 10.0, 1.17, 0.152, 0.202, 0.563],
  ['MC9X25.4', 7.47, 9.00, 3.50, 0.450, 0.550, 1.25],
  ['MC9X23.9', 7.02, 9.00, 3.45, 0.400, 0.550, 1.25],
  ['MC8X22.8', 6.70, 8.00, 3.50, 0.427, 0.525, 1.19],
  ['MC8X21.4', 6.28, 8.00, 3.45, 0.375, 0.525, 1.19],
  ['MC8X20', 5.87, 8.00, 3.03, 0.400, 0.500, 1.13],
  ['MC8X18.7', 5.50, 8.00, 2.98, 0.353, 0.500, 1.13],
  ['MC7X22.7', 6.67, 7.00, 3.60, 0.503, 0.500, 1.13],
  ['MC7X19.1', 5.61, 7.00, 3.45, 0.352, 0.500, 1.13],
  ['MC6X18', 5.29, 6.00, 3.50, 0.379, 0.475, 1.06],
  ['MC6X15.3', 4.49, 6.00, 3.50, 0.340, 0.385, 0.875],
  ['MC6X16.3', 4.79, 6.00, 3.00, 0.375, 0.475, 1.06],
];

/**
 * Root radius r (mm) whose fillet leaves the web at k_des below the outer face, for a flange whose thickness at the web
 * face is `rootThickness_mm` and whose inner face falls at `slopeTan`: k = t_root + r (sec α − tan α).
 */
function rootRadiusFromK_mm(kdes_mm: number, rootThickness_mm: number, slopeTan: number): number {
  return (kdes_mm - rootThickness_mm) / (Math.sqrt(1 + slopeTan * slopeTan) - slopeTan);
}

const seriesOfLabel = (label: string): string => label.slice(0, label.indexOf('X'));

function iSection([label, , d, bf, tw, tf, kdes]: UsShapeRow, sloped: boolean): CatalogueSection {
  const slopeTan = sloped ? Math.tan(US_SLOPE_RAD) : 0;
  const rootThickness_in = tf + (slopeTan * (bf - tw)) / 4;
  return {
    name: label,
    series: seriesOfLabel(label),
    depth_mm: d * MM_PER_IN,
    width_mm: bf * MM_PER_IN,
    webThickness_mm: tw * MM_PER_IN,
    flangeThickness_mm: tf * MM_PER_IN,
    rootRadius_mm: rootRadiusFromK_mm(kdes * MM_PER_IN, rootThickness_in * MM_PER_IN, slopeTan),
    ...(sloped ? { flangeSlope_rad: US_SLOPE_RAD } : {}),
    sourceId: US_SHAPES_SOURCE.id,
  };
}

export function cChannelDimensions([, , d, bf, tw, tf, kdes]: UsShapeRow): ChannelDimensions {
  const slopeTan = Math.tan(US_SLOPE_RAD);
  const rootThickness_in = tf + (slopeTan * (bf - tw)) / 2;
  return {
    family: 'channel',
    depth_mm: d * MM_PER_IN,
    width_mm: bf * MM_PER_IN,
    webThickness_mm: tw * MM_PER_IN,
    flangeThickness_mm: tf * MM_PER_IN,
    rootRadius_mm: rootRadiusFromK_mm(kdes * MM_PER_IN, rootThickness_in * MM_PER_IN, slopeTan),
    slope_rad: US_SLOPE_RAD,
  };
}

export const US_I_SECTIONS: readonly CatalogueSection[] = [
  ...S_ROWS.map((row) => iSection(row, true)),
  ...M_ROWS.map((row) => iSection(row, false)),
  ...HP_ROWS.map((row) => iSection(row, false)),
];

/** C then MC rows, in the order of US_CHANNEL_ENTRIES. */
export const US_CHANNEL_ROWS: readonly UsShapeRow[] = [...C_ROWS, ...MC_ROWS];

export const US_CHANNEL_ENTRIES: readonly CatalogueEntry[] = US_CHANNEL_ROWS.map((row) => ({
  name: row[0],
  series: seriesOfLabel(row[0]),
  family: 'channel',
  dimensions: cChannelDimensions(row),
  process: 'hot-rolled',
  sourceId: US_SHAPES_SOURCE.id,
}));
