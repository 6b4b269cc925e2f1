/**
 * Australian and New Zealand I-sections: universal beams and columns (AS/NZS 3679.1, hot-rolled) and welded beams
 * (AS/NZS 3679.2), named as the makers' tables name them: '310UC96.8', '460UB74.6', '1200WB455'.
 */
import type { CatalogueSection, CatalogueSource } from './catalogue-section';

export const AU_HOT_ROLLED_SOURCE: CatalogueSource = {
  id: 'asnzs-3679.1',
  title: 'AS/NZS 3679.1 universal beams and columns, d, bf, tf, tw, r1 and gross area Ag (as published in the makers\' section tables)',
  provenance:
    'd, bf, tf, tw and Ag transcribed from an open transcription (in a public GitHub repository) of Liberty / InfraBuild ' +
    '"Hot Rolled and Structural Steel Products", 9th edition 2019, Tables 9 and 11. Root radii r1 from memory, compared ' +
    'with a second open transcription of the same tables; each r1 is confirmed by the spec, where the area rebuilt from ' +
    'the dimensions meets the tabulated Ag. Verify against the current makers\' tables before relying on it.',
  fromMemory: true,
};

export const AU_WELDED_SOURCE: CatalogueSource = {
  id: 'asnzs-3679.2',
  title: 'AS/NZS 3679.2 welded beams, d, bf, tw, tf (as published in the makers\' section tables)',
  provenance:
    'Transcribed from two open transcriptions (public GitHub repositories) of the welded-beam tables, which disagree on ' +
    '1200WB342 and 800WB168; the rows kept are those whose web height matches the rest of their group and whose plate ' +
    'area gives the nominal mass in the name (see the spec). Fillet welds are not counted. Verify before relying on it.',
  fromMemory: true,
};

/** Hot-rolled rows: designation, d, bf, tf, tw, r1 (mm), Ag (mm²); Ag is kept only for the spec's cross-check. */
export type AuHotRolledRow = readonly [name: string, d: number, bf: number, tf: number, tw: number, r1: number, area_mm2: number];

// Source: AU_HOT_ROLLED_SOURCE (Table 9, universal beams).
export const AU_UB_ROWS: readonly AuHotRolledRow[] = [
  ['610UB125', 611.6, 229, 19.6, 11.9, 14.0, 16000],
  ['610UB113', 607.0, 228, 17.3, 11.2, 14.0, 14500],
  ['610UB101', 602.0, 228, 14.8, 10.6, 14.0, 13000],
  ['530UB92.4', 533.0, 209, 15.6, 10.2, 14.0, 11800],
  ['530UB82.0', 528.2, 209, 13.2, 9.6, 14.0, 10500],
  ['460UB82.1', 460.4, 191, 16.0, 9.9, 11.4, 10500],
  ['460UB74.6', 457.4, 190, 14.5, 9.1, 11.4, 9520],
  ['460UB67.1', 453.8, 190, 12.7, 8.5, 11.4, 8580],
  ['410UB59.7', 406.4, 178, 12.8, 7.8, 11.4, 7640],
  ['410UB53.7', 402.6, 178, 10.9, 7.6, 11.4, 6890],
  ['360UB56.7', 358.6, 172, 13.0, 8.0, 11.4, 7240],
  ['360UB50.7', 355.6, 171, 11.5, 7.3, 11.4, 6470],
  ['360UB44.7', 352.0, 171, 9.7, 6.9, 11.4, 5720],
  ['310UB46.2', 307.2, 166, 11.8, 6.7, 11.4, 5930],
  ['310UB40.4', 304.0, 165, 10.2, 6.1, 11.4, 5210],
  ['310UB32.0', 298.0, 149, 8.0, 5.5, 13.0, 4080],
  ['250UB37.3', 256.2, 146, 10.9, 6.4, 8.9, 4750],
  ['250UB31.4', 251.6, 146, 8.6, 6.1, 8.9, 4010],
  ['250UB25.7', 248.0, 124, 8.0, 5.0, 12.0, 3270],
  ['200UB29.8', 207.0, 134, 9.6, 6.3, 8.9, 3820],
  ['200UB25.4', 203.2, 133, 7.8, 5.8, 8.9, 3230],
  ['200UB22.3', 201.6, 133, 7.0, 5.0, 8.9, 2870],
  ['200UB18.2', 198.0, 99, 7.0, 4.5, 11.0, 2320],
  ['180UB22.2', 179.0, 90, 10.0, 6.0, 8.9, 2820],
  ['180UB18.1', 175.0, 90, 8.0, 5.0, 8.9, 2300],
  ['180UB16.1', 173.0, 90, 7.0, 4.5, 8.9, 2040],
  ['150UB18.0', 155.0, 75, 9.5, 6.0, 8.0, 2300],
  ['150UB14.0', 150.0, 75, 7.0, 5.0, 8.0, 1780],
];

// Source: AU_HOT_ROLLED_SOURCE (Table 11, universal columns).
export const AU_UC_ROWS: readonly AuHotRolledRow[] = [
  ['310UC158', 327.2, 311, 25.0, 15.7, 16.5, 20100],
  ['310UC137', 320.6, 309, 21.7, 13.8, 16.5, 17500],
  ['310UC118', 314.6, 307, 18.7, 11.9, 16.5, 15000],
  ['310UC96.8', 308.0, 305, 15.4, 9.9, 16.5, 12400],
  ['250UC89.5', 260.0, 256, 17.3, 10.5, 14.0, 11400],
  ['250UC72.9', 253.8, 254, 14.2, 8.6, 14.0, 9320],
  ['200UC59.5', 209.8, 205, 14.2, 9.3, 11.4, 7620],
  ['200UC52.2', 206.4, 204, 12.5, 8.0, 11.4, 6660],
  ['200UC46.2', 203.4, 203, 11.0, 7.3, 11.4, 5900],
  ['150UC37.2', 161.8, 154, 11.5, 8.1, 8.9, 4730],
  ['150UC30.0', 157.6, 153, 9.4, 6.6, 8.9, 3860],
  ['150UC23.4', 152.4, 152, 6.8, 6.1, 8.9, 2980],
  ['100UC14.8', 97.0, 99, 7.0, 5.0, 10.0, 1890],
];

/** Welded rows: designation, d, bf, tw, tf (mm). */
export type AuWeldedRow = readonly [name: string, d: number, bf: number, tw: number, tf: number];

// Source: AU_WELDED_SOURCE.
export const AU_WB_ROWS: readonly AuWeldedRow[] = [
  ['1200WB455', 1200, 500, 16, 40],
  ['1200WB423', 1192, 500, 16, 36],
  ['1200WB392', 1184, 500, 16, 32],
  ['1200WB342', 1184, 400, 16, 32],
  ['1200WB317', 1176, 400, 16, 28],
  ['1200WB278', 1170, 350, 16, 25],
  ['1200WB249', 1170, 275, 16, 25],
  ['1000WB322', 1024, 400, 16, 32],
  ['1000WB296', 1016, 400, 16, 28],
  ['1000WB258', 1010, 350, 16, 25],
  ['1000WB215', 1000, 300, 16, 20],
  ['900WB282', 924, 400, 12, 32],
  ['900WB257', 916, 400, 12, 28],
  ['900WB218', 910, 350, 12, 25],
  ['900WB175', 900, 300, 12, 20],
  ['800WB192', 816, 300, 10, 28],
  ['800WB168', 810, 275, 10, 25],
  ['800WB146', 800, 275, 10, 20],
  ['800WB122', 792, 250, 10, 16],
  ['700WB173', 716, 275, 10, 28],
  ['700WB150', 710, 250, 10, 25],
  ['700WB130', 700, 250, 10, 20],
  ['700WB115', 692, 250, 10, 16],
];

/** '310UC96.8' → '310UC': the nominal-depth group, as the W tables group by 'W18'. */
function groupOf(name: string): string {
  return /^\d+[A-Z]+/.exec(name)![0];
}

function hotRolled(rows: readonly AuHotRolledRow[]): CatalogueSection[] {
  return rows.map(([name, d, bf, tf, tw, r1]) => ({
    name,
    series: groupOf(name),
    depth_mm: d,
    width_mm: bf,
    webThickness_mm: tw,
    flangeThickness_mm: tf,
    rootRadius_mm: r1,
    sourceId: AU_HOT_ROLLED_SOURCE.id,
  }));
}

export const AU_SECTIONS: readonly CatalogueSection[] = [
  ...hotRolled(AU_UB_ROWS),
  ...hotRolled(AU_UC_ROWS),
  ...AU_WB_ROWS.map(([name, d, bf, tw, tf]): CatalogueSection => ({
    name,
    series: groupOf(name),
    depth_mm: d,
    width_mm: bf,
    webThickness_mm: tw,
    flangeThickness_mm: tf,
    rootRadius_mm: 0,
    fabrication: 'welded',
    sourceId: AU_WELDED_SOURCE.id,
  })),
];
