/**
 * European channels: UPN (sloped inner flange faces) and UPE (parallel flanges), named 'UPN 200', 'UPE 200'.
 * Dimensions are converted to the shared channel convention of section-family.ts: the flange thickness is the one
 * half-way along the outstand, (b + tw)/2 from the back of the web.
 */
import type { ChannelDimensions } from '../engine/section-family';
import type { CatalogueEntry, CatalogueSource } from './catalogue-section';

const STEELSNAKES = 'open transcription of a steel maker\'s section tables (public GitHub repository waynemaranga/steelsnakes, src/steelsnakes/EU/data/';

export const EN_UPN_SOURCE: CatalogueSource = {
  id: 'en-upn',
  title: 'UPN channels with sloped flanges (DIN 1026-1 / EN 10279 tolerances), h, b, tw, t, r1, r2 and area A',
  provenance:
    `h, b, tw, t, r1, r2 and A transcribed from an ${STEELSNAKES}UPN.json). Flange slope 8 % up to h = 300 and 5 % above, ` +
    'and t measured at b/2 from the back of the web, from memory; the spec confirms both by rebuilding every tabulated ' +
    'area within 1 %. Verify against your supplier\'s current table before relying on it.',
  fromMemory: false,
};

export const EN_UPE_SOURCE: CatalogueSource = {
  id: 'en-upe',
  title: 'UPE parallel flange channels (DIN 1026-2), h, b, tw, tf, r and area A',
  provenance: `h, b, tw, tf, r and A transcribed from an ${STEELSNAKES}UPE.json); every area rebuilt within 1 % in the spec. Verify before relying on it.`,
  fromMemory: false,
};

/** Size, h, b, tw, t (at b/2 from the back of the web), r1, r2 (mm), A (cm²); A is kept only for the spec. */
export type UpnRow = readonly [size: number, h: number, b: number, tw: number, t: number, r1: number, r2: number, area_cm2: number];
/** Size, h, b, tw, tf, r (mm), A (cm²); A is kept only for the spec. */
export type UpeRow = readonly [size: number, h: number, b: number, tw: number, tf: number, r: number, area_cm2: number];

// Source: EN_UPN_SOURCE, every row.
export const UPN_ROWS: readonly UpnRow[] = [
  [50, 50, 38, 5.0, 7.0, 7.0, 3.5, 7.1],
  [65, 65, 42, 5.5, 7.5, 7.5, 4.0, 9.0],
  [80, 80, 45, 6.0, 8.0, 8.0, 4.0, 11.0],
  [100, 100, 50, 6.0, 8.5, 8.5, 4.5, 13.5],
  [120, 120, 55, 7.0, 9.0, 9.0, 4.5, 17.0],
  [140, 140, 60, 7.0, 10.0, 10.0, 5.0, 20.4],
  [160, 160, 65, 7.5, 10.5, 10.5, 5.5, 24.0],
  [180, 180, 70, 8.0, 11.0, 11.0, 5.5, 28.0],
  [200, 200, 75, 8.5, 11.5, 11.5, 6.0, 32.2],
  [220, 220, 80, 9.0, 12.5, 12.5, 6.5, 37.4],
  [240, 240, 85, 9.5, 13.0, 13.0, 6.5, 42.3],
  [260, 260, 90, 10.0, 14.0, 14.0, 7.0, 48.3],
  [280, 280, 95, 10.0, 15.0, 15.0, 7.5, 53.3],
  [300, 300, 100, 10.0, 16.0, 16.0, 8.0, 58.8],
  [320, 320, 100, 14.0, 17.5, 17.5, 9.0, 75.8],
  [350, 350, 100, 14.0, 16.0, 16.0, 8.0, 77.3],
  [380, 380, 102, 13.5, 16.0, 16.0, 8.0, 80.4],
  [400, 400, 110, 14.0, 18.0, 18.0, 9.0, 91.5],
];

// Source: EN_UPE_SOURCE, every row.
export const UPE_ROWS: readonly UpeRow[] = [
  [80, 80, 50, 4.0, 7.0, 10, 10.1],
  [100, 100, 55, 4.5, 7.5, 10, 12.5],
  [120, 120, 60, 5.0, 8.0, 12, 15.4],
  [140, 140, 65, 5.0, 9.0, 12, 18.4],
  [160, 160, 70, 5.5, 9.5, 12, 21.7],
  [180, 180, 75, 5.5, 10.5, 12, 25.1],
  [200, 200, 80, 6.0, 11.0, 13, 29.0],
  [220, 220, 85, 6.5, 12.0, 13, 33.9],
  [240, 240, 90, 7.0, 12.5, 15, 38.5],
  [270, 270, 95, 7.5, 13.5, 15, 44.8],
  [300, 300, 100, 9.5, 15.0, 15, 56.6],
  [330, 330, 105, 11.0, 16.0, 18, 67.8],
  [360, 360, 110, 12.0, 17.0, 18, 77.9],
  [400, 400, 115, 13.5, 18.0, 18, 91.9],
];

/** UPN inner flange slope: 8 % up to 300 mm deep, 5 % above (from memory; confirmed by the areas in the spec). */
export function upnSlope_rad(h_mm: number): number {
  return Math.atan(h_mm <= 300 ? 0.08 : 0.05);
}

/** UPN dimensions in the shared convention: t moves tw/2 outwards along a face falling at the slope. */
export function upnDimensions([, h, b, tw, t, r1, r2]: UpnRow): ChannelDimensions {
  const slope = upnSlope_rad(h);
  return {
    family: 'channel',
    depth_mm: h,
    width_mm: b,
    webThickness_mm: tw,
    flangeThickness_mm: t - (Math.tan(slope) * tw) / 2,
    rootRadius_mm: r1,
    edgeRadius_mm: r2,
    slope_rad: slope,
  };
}

export const EN_CHANNEL_ENTRIES: readonly CatalogueEntry[] = [
  ...UPN_ROWS.map((row): CatalogueEntry => ({
    name: `UPN ${row[0]}`,
    series: 'UPN',
    family: 'channel',
    dimensions: upnDimensions(row),
    process: 'hot-rolled',
    sourceId: EN_UPN_SOURCE.id,
  })),
  ...UPE_ROWS.map(([size, h, b, tw, tf, r]): CatalogueEntry => ({
    name: `UPE ${size}`,
    series: 'UPE',
    family: 'channel',
    dimensions: { family: 'channel', depth_mm: h, width_mm: b, webThickness_mm: tw, flangeThickness_mm: tf, rootRadius_mm: r },
    process: 'hot-rolled',
    sourceId: EN_UPE_SOURCE.id,
  })),
];
