/**
 * Australian and New Zealand cold-formed hollow sections (AS/NZS 1163): SHS and RHS with the makers' corner radii,
 * CHS. Sizes are named in the makers' style, '100x100x6.0 SHS', '100x50x4.0 RHS', '168.3x4.8 CHS': size first, family
 * last, wall in one decimal. Exports write it '100x6.0SHS' too; written so, a size that EN tables also list (with other
 * corners) is this table's.
 */
import type { CatalogueEntry, CatalogueSource } from './catalogue-section';
import { asnzs1163Corners, hollowBox, tube } from './hollow-corners';

export const AU_HOLLOW_SOURCE: CatalogueSource = {
  id: 'asnzs-1163',
  title: 'AS/NZS 1163 cold-formed structural hollow sections, sizes and wall thicknesses (as listed in the makers\' tables)',
  provenance:
    'Sizes compared with two open size lists of the Australian makers\' tables (public GitHub repositories, one typed ' +
    'from the makers\' catalogues, one from the design capacity tables); only sizes found in both lists are kept. Corner radii by the makers\' rule (hollow-corners.ts, from ' +
    'memory), confirmed by tabulated masses in the spec. Verify before relying on it.',
  fromMemory: true,
  namingForm: 'as-nzs',
};

const fmt = (t: number): string => t.toFixed(1);

// Source: AU_HOLLOW_SOURCE. Side (mm) → wall thicknesses (mm).
const SHS: ReadonlyArray<readonly [side: number, walls: readonly number[]]> = [
  [50, [2.0, 2.5, 3.0, 4.0, 5.0]],
  [65, [2.0, 2.5, 3.0, 4.0, 5.0, 6.0]],
  [75, [2.5, 3.0, 4.0, 5.0, 6.0]],
  [89, [3.5, 5.0, 6.0]],
  [100, [2.5, 3.0, 4.0, 5.0, 6.0, 9.0, 10.0]],
  [125, [4.0, 5.0, 6.0, 9.0, 10.0]],
  [150, [5.0, 6.0, 9.0, 10.0]],
  [200, [5.0, 6.0, 9.0, 10.0, 12.5, 16.0]],
  [250, [6.0, 9.0, 10.0, 12.5, 16.0]],
];

// Source: AU_HOLLOW_SOURCE. Depth × width (mm) → wall thicknesses (mm).
const RHS: ReadonlyArray<readonly [depth: number, width: number, walls: readonly number[]]> = [
  [50, 25, [2.0, 3.0]],
  [75, 50, [3.0, 4.0]],
  [100, 50, [3.0, 4.0, 5.0]],
  [125, 75, [5.0, 6.0]],
  [150, 100, [4.0, 5.0, 6.0, 9.0]],
];

// Source: AU_HOLLOW_SOURCE. Outside diameter (mm) → wall thicknesses (mm).
const CHS: ReadonlyArray<readonly [diameter: number, walls: readonly number[]]> = [
  [48.3, [2.9, 3.2, 4.0, 5.4]],
  [60.3, [2.9, 3.6, 4.5, 5.4]],
  [76.1, [2.3, 3.2, 3.6, 4.5, 5.9]],
  [88.9, [2.6, 3.2, 4.0, 5.0, 5.5, 5.9]],
  [101.6, [2.6, 3.2, 4.0, 5.0]],
  [114.3, [3.2, 3.6, 4.5, 4.8, 5.4, 6.0]],
  [139.7, [3.0, 3.5, 5.0, 5.4]],
  [165.1, [3.0, 3.5, 5.0, 5.4]],
  [168.3, [4.8, 6.4, 7.1]],
  [219.1, [4.8, 6.4, 8.2]],
  [273.1, [4.8, 6.4, 9.3]],
  [323.9, [6.4, 9.5, 12.7]],
  [355.6, [6.4, 9.5, 12.7]],
  [406.4, [6.4, 9.5, 12.7]],
  [457.0, [6.4, 9.5, 12.7]],
  [508.0, [6.4, 9.5, 12.7]],
  [610.0, [6.4, 9.5, 12.7]],
];

function box(kind: 'SHS' | 'RHS', depth_mm: number, width_mm: number, wall_mm: number): CatalogueEntry {
  return {
    name: `${depth_mm}x${width_mm}x${fmt(wall_mm)} ${kind}`,
    series: `AU ${kind}`,
    family: 'box',
    dimensions: hollowBox(depth_mm, width_mm, wall_mm, asnzs1163Corners(wall_mm)),
    process: 'cold-formed',
    sourceId: AU_HOLLOW_SOURCE.id,
  };
}

export const AU_HOLLOW_ENTRIES: readonly CatalogueEntry[] = [
  ...SHS.flatMap(([side, walls]) => walls.map((t) => box('SHS', side, side, t))),
  ...RHS.flatMap(([d, b, walls]) => walls.map((t) => box('RHS', d, b, t))),
  ...CHS.flatMap(([diameter, walls]) =>
    walls.map((t): CatalogueEntry => ({
      name: `${diameter.toFixed(1)}x${fmt(t)} CHS`,
      series: 'AU CHS',
      family: 'tube',
      dimensions: tube(diameter, t),
      process: 'cold-formed',
      sourceId: AU_HOLLOW_SOURCE.id,
    })),
  ),
];
