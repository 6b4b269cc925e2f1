/** Australian and New Zealand parallel flange channels (AS/NZS 3679.1), named '300PFC40.1' (depth, PFC, kg/m). */
import type { CatalogueEntry, CatalogueSource } from './catalogue-section';

export const AU_PFC_SOURCE: CatalogueSource = {
  id: 'asnzs-3679.1-pfc',
  title: 'AS/NZS 3679.1 parallel flange channels, d, bf, tf, tw, r1 and gross area Ag (as published in the makers\' section tables)',
  provenance:
    'd, bf, tf, tw, Ag and mass transcribed from an open transcription (public GitHub repository) of Liberty / InfraBuild ' +
    '"Hot Rolled and Structural Steel Products", 9th edition 2019, Table 15; r1 from a second open transcription of the ' +
    'makers\' design capacity tables, each confirmed by the spec (area rebuilt from the dimensions meets Ag). ' +
    'Verify against the current makers\' tables before relying on it.',
  fromMemory: false,
};

/** Designation, d, bf, tf, tw, r1 (mm), Ag (mm²); Ag is kept only for the spec's cross-check. */
export type AuPfcRow = readonly [name: string, d: number, bf: number, tf: number, tw: number, r1: number, area_mm2: number];

// Source: AU_PFC_SOURCE, every row.
export const AU_PFC_ROWS: readonly AuPfcRow[] = [
  ['380PFC55.2', 380, 100, 17.5, 10.0, 14, 7030],
  ['300PFC40.1', 300, 90, 16.0, 8.0, 14, 5110],
  ['250PFC35.5', 250, 90, 15.0, 8.0, 12, 4520],
  ['230PFC25.1', 230, 75, 12.0, 6.5, 12, 3200],
  ['200PFC22.9', 200, 75, 12.0, 6.0, 12, 2920],
  ['180PFC20.9', 180, 75, 11.0, 6.0, 12, 2660],
  ['150PFC17.7', 150, 75, 9.5, 6.0, 10, 2250],
  ['125PFC11.9', 125, 65, 7.5, 4.7, 8, 1520],
  ['100PFC8.33', 100, 50, 6.7, 4.2, 8, 1060],
  ['75PFC5.92', 75, 40, 6.1, 3.8, 8, 754],
];

export const AU_PFC_ENTRIES: readonly CatalogueEntry[] = AU_PFC_ROWS.map(([name, d, bf, tf, tw, r1]) => ({
  name,
  series: 'AU PFC',
  family: 'channel',
  dimensions: { family: 'channel', depth_mm: d, width_mm: bf, webThickness_mm: tw, flangeThickness_mm: tf, rootRadius_mm: r1 },
  process: 'hot-rolled',
  sourceId: AU_PFC_SOURCE.id,
}));
