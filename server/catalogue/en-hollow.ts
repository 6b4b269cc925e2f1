/**
 * European structural hollow sections: square hollow sections cold-formed to EN 10219 and hot-finished to EN 10210,
 * and hot-finished circular ones to EN 10210. The same size is made both ways with different corners, and the
 * Australian tables list some of the same sizes with their own corners: each name carries its standard
 * ('SHS 100x100x6.0 EN 10219') and the bare designation ('SHS 100x100x6'), naming two sections, finds none.
 */
import type { CatalogueEntry, CatalogueSource, SectionProcess } from './catalogue-section';
import { type CornerRadii, en10210Corners, en10219Corners, hollowBox, tube } from './hollow-corners';

const TRANSCRIPTION = 'an open transcription of the UK makers\' and SCI section tables (public GitHub repository waynemaranga/steelsnakes, src/steelsnakes/UK/data/';

export const EN_10219_SOURCE: CatalogueSource = {
  id: 'en-10219',
  title: 'EN 10219-2 cold-formed square hollow sections, sizes, walls and area A (as listed in the UK makers\' and SCI section tables)',
  provenance:
    `Sizes, walls and A transcribed from ${TRANSCRIPTION}CFSHS.json; sizes 40 to 140 mm only). Corner radii by the ` +
    'standard\'s rule, from memory (hollow-corners.ts), confirmed by every listed area in the spec. Verify before relying on it.',
  fromMemory: false,
};

export const EN_10210_SOURCE: CatalogueSource = {
  id: 'en-10210',
  title: 'EN 10210-2 hot-finished square and circular hollow sections, sizes, walls and area A (as listed in the UK makers\' and SCI section tables)',
  provenance:
    `Sizes, walls and A transcribed from ${TRANSCRIPTION}HFSHS.json, SHS 60 to 140 mm, and HFCHS.json, CHS 139.7 to ` +
    '323.9 mm). Corner radii by the standard\'s rule, from memory (hollow-corners.ts), confirmed by every listed area in ' +
    'the spec. Verify before relying on it.',
  fromMemory: false,
};

/** Side or diameter (mm) → [wall (mm), A (cm²)] pairs; A is kept only for the spec's cross-check. */
export type HollowRows = ReadonlyArray<readonly [size: number, walls: ReadonlyArray<readonly [t: number, area_cm2: number]>]>;

// Source: EN_10219_SOURCE, every row.
export const EN_10219_SHS: HollowRows = [
  [40, [[2.0, 2.94], [2.5, 3.59], [3.0, 4.21], [4.0, 5.35]]],
  [50, [[2.5, 4.59], [3.0, 5.41], [4.0, 6.95], [5.0, 8.36]]],
  [60, [[3.0, 6.61], [4.0, 8.55], [5.0, 10.4], [6.0, 12.0]]],
  [70, [[3.0, 7.81], [3.5, 8.99], [4.0, 10.1], [5.0, 12.4], [6.0, 14.4]]],
  [80, [[3.0, 9.01], [3.5, 10.4], [4.0, 11.7], [5.0, 14.4], [6.0, 16.8]]],
  [90, [[3.0, 10.2], [3.5, 11.8], [4.0, 13.3], [5.0, 16.4], [6.0, 19.2]]],
  [100, [[3.0, 11.4], [4.0, 14.9], [5.0, 18.4], [6.0, 21.6], [8.0, 27.2]]],
  [120, [[3.0, 13.8], [4.0, 18.1], [5.0, 22.4], [6.0, 26.4], [8.0, 33.6], [10.0, 40.6]]],
  [140, [[4.0, 21.3], [5.0, 26.4], [6.0, 31.2]]],
];

// Source: EN_10210_SOURCE, every row.
export const EN_10210_SHS: HollowRows = [
  [60, [[3.6, 7.98], [4.0, 8.79], [5.0, 10.7], [6.3, 13.1], [8.0, 16.0]]],
  [70, [[3.2, 8.44], [3.6, 9.42], [4.0, 10.4], [5.0, 12.7], [6.3, 15.6], [8.0, 19.2], [10.0, 22.9]]],
  [80, [[3.2, 9.72], [3.6, 10.9], [4.0, 12.0], [5.0, 14.7], [6.3, 18.1], [8.0, 22.4], [10.0, 26.9]]],
  [90, [[3.6, 12.3], [4.0, 13.6], [5.0, 16.7], [6.3, 20.7], [8.0, 25.6], [10.0, 30.9]]],
  [100, [[3.6, 13.7], [4.0, 15.2], [5.0, 18.7], [6.3, 23.2], [8.0, 28.8], [10.0, 34.9]]],
  [120, [[4.0, 18.4], [5.0, 22.7], [6.3, 28.2], [8.0, 35.2], [10.0, 42.9], [12.5, 52.1]]],
  [140, [[5.0, 26.7], [6.3, 33.3], [8.0, 41.6], [10.0, 50.9], [12.5, 62.1], [14.2, 69.3], [16.0, 76.6]]],
];

// Source: EN_10210_SOURCE, every row.
export const EN_10210_CHS: HollowRows = [
  [139.7, [[4.0, 17.1], [5.0, 21.2], [6.3, 26.4], [8.0, 33.1]]],
  [168.3, [[5.0, 25.7], [6.3, 32.1], [8.0, 40.3], [10.0, 49.7], [12.5, 61.2]]],
  [193.7, [[5.0, 29.6], [6.3, 37.1], [8.0, 46.7], [10.0, 57.7], [12.5, 71.2], [14.2, 80.1], [16.0, 89.3]]],
  [219.1, [[5.0, 33.6], [6.3, 42.1], [8.0, 53.1], [10.0, 65.7], [12.5, 81.1], [14.2, 91.4], [16.0, 102]]],
  [244.5, [[5.0, 37.6], [6.3, 47.1], [8.0, 59.4], [10.0, 73.7], [12.5, 91.1], [14.2, 103], [16.0, 115]]],
  [273.0, [[5.0, 42.1], [6.3, 52.8], [8.0, 66.6], [10.0, 82.6], [12.5, 102], [14.2, 115], [16.0, 129], [17.5, 140]]],
  [323.9, [[5.0, 50.1], [6.3, 62.9], [8.0, 79.4], [10.0, 98.6], [12.5, 122], [14.2, 138], [16.0, 155]]],
];

const fmt = (t: number): string => t.toFixed(1);

function shs(rows: HollowRows, standard: string, process: SectionProcess, corners: (t: number) => CornerRadii, sourceId: string): CatalogueEntry[] {
  return rows.flatMap(([side, walls]) =>
    walls.map(([t]): CatalogueEntry => {
      const designation = `SHS ${side}x${side}x${fmt(t)}`;
      return { name: `${designation} ${standard}`, designation, series: `${standard} SHS`, family: 'box', dimensions: hollowBox(side, side, t, corners(t)), process, sourceId };
    }),
  );
}

export const EN_HOLLOW_ENTRIES: readonly CatalogueEntry[] = [
  ...shs(EN_10219_SHS, 'EN 10219', 'cold-formed', en10219Corners, EN_10219_SOURCE.id),
  ...shs(EN_10210_SHS, 'EN 10210', 'hot-finished', en10210Corners, EN_10210_SOURCE.id),
  ...EN_10210_CHS.flatMap(([d, walls]) =>
    walls.map(([t]): CatalogueEntry => {
      const designation = `CHS ${d.toFixed(1)}x${fmt(t)}`;
      return { name: `${designation} EN 10210`, designation, series: 'EN 10210 CHS', family: 'tube', dimensions: tube(d, t), process: 'hot-finished', sourceId: EN_10210_SOURCE.id };
    }),
  ),
];
