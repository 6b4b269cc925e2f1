/** UK parallel flange channels (BS 4-1), named serial size × mass: '300x90x41 PFC'. */
import type { CatalogueEntry, CatalogueSource } from './catalogue-section';

export const UK_PFC_SOURCE: CatalogueSource = {
  id: 'bs-4-1-pfc',
  title: 'BS 4-1 parallel flange channels, h, b, tw, tf, r and area A (as listed in the UK makers\' and SCI section tables)',
  provenance:
    'Transcribed from an open transcription (public GitHub repository waynemaranga/steelsnakes, ' +
    'src/steelsnakes/EU/data/PFC.json) of the SCI section tables; every area rebuilt within 1 % in the spec. ' +
    'Verify against the current tables before relying on it.',
  fromMemory: false,
};

/** Serial size × mass, h, b, tw, tf, r (mm), A (cm²); A is kept only for the spec's cross-check. */
export type UkPfcRow = readonly [size: string, h: number, b: number, tw: number, tf: number, r: number, area_cm2: number];

// Source: UK_PFC_SOURCE, every row.
export const UK_PFC_ROWS: readonly UkPfcRow[] = [
  ['100x50x10', 100, 50, 5.0, 8.5, 9, 13.0],
  ['125x65x15', 125, 65, 5.5, 9.5, 12, 18.8],
  ['150x75x18', 150, 75, 5.5, 10.0, 12, 22.8],
  ['150x90x24', 150, 90, 6.5, 12.0, 12, 30.4],
  ['180x75x20', 180, 75, 6.0, 10.5, 12, 25.9],
  ['180x90x26', 180, 90, 6.5, 12.5, 12, 33.2],
  ['200x75x23', 200, 75, 6.0, 12.5, 12, 29.9],
  ['200x90x30', 200, 90, 7.0, 14.0, 12, 37.9],
  ['230x75x26', 230, 75, 6.5, 12.5, 12, 32.7],
  ['230x90x32', 230, 90, 7.5, 14.0, 12, 41.0],
  ['260x75x28', 260, 75, 7.0, 12.0, 12, 35.1],
  ['260x90x35', 260, 90, 8.0, 14.0, 12, 44.4],
  ['300x90x41', 300, 90, 9.0, 15.5, 12, 52.7],
  ['300x100x46', 300, 100, 9.0, 16.5, 15, 58.0],
  ['380x100x54', 380, 100, 9.5, 17.5, 15, 68.7],
  ['430x100x64', 430, 100, 11.0, 19.0, 15, 82.1],
];

export const UK_PFC_ENTRIES: readonly CatalogueEntry[] = UK_PFC_ROWS.map(([size, h, b, tw, tf, r]) => ({
  name: `${size} PFC`,
  series: 'UK PFC',
  family: 'channel',
  dimensions: { family: 'channel', depth_mm: h, width_mm: b, webThickness_mm: tw, flangeThickness_mm: tf, rootRadius_mm: r },
  process: 'hot-rolled',
  sourceId: UK_PFC_SOURCE.id,
}));
