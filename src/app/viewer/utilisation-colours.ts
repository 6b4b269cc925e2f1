/**
 * The 3D view's colours, as sRGB 0xRRGGBB numbers so the engine can write them without allocating.
 *
 * Utilisation 0–100 % uses ten bins of the cividis scale (d3-scale-chromatic's `interpolateCividis`): its lightness
 * rises steadily and it reads the same with the common colour-vision deficiencies, so "more utilised" stays "lighter"
 * for everyone. Over 100 % is one bright magenta, chosen so that it stays far from every bin even when protan, deutan
 * or tritan vision is simulated (see utilisation-colours.spec.ts). Not-checked members are a light neutral grey:
 * a mid grey would be mistaken for the middle of cividis, which is itself nearly grey.
 */
import { interpolateCividis } from 'd3-scale-chromatic';
import type { MemberCheckStatus } from './viewer-member';

/** An sRGB colour as 0xRRGGBB. */
export type RgbHex = number;

export const UTILISATION_BIN_COUNT = 10;

export const OVER_CAPACITY_COLOUR: RgbHex = 0xf000f0;
export const NOT_CHECKED_COLOUR: RgbHex = 0xc8c8c8;
/** Slabs, walls and other context elements: pale grey, drawn see-through. */
export const CONTEXT_COLOUR: RgbHex = 0xe4e4e4;
export const CONTEXT_OPACITY = 0.22;

/** A swatch of the legend. */
export interface LegendEntry {
  key: string;
  label: string;
  colour: RgbHex;
}

/** Parses d3's "rgb(r, g, b)" strings. */
export function rgbStringToHex(rgb: string): RgbHex {
  const match = /^rgb\((\d+),\s*(\d+),\s*(\d+)\)$/.exec(rgb);
  if (match === null) throw new Error(`Expected a colour written as rgb(r, g, b), got "${rgb}".`);
  return (Number(match[1]) << 16) | (Number(match[2]) << 8) | Number(match[3]);
}

export function rgbHexToCss(colour: RgbHex): string {
  return `#${colour.toString(16).padStart(6, '0')}`;
}

/** Bin i takes the scale at i / (n − 1), so the first and last bins are the ends of cividis. */
export const UTILISATION_BIN_COLOURS: readonly RgbHex[] = Array.from({ length: UTILISATION_BIN_COUNT }, (_, bin) =>
  rgbStringToHex(interpolateCividis(bin / (UTILISATION_BIN_COUNT - 1))),
);

// Keeps 0.3 (stored as 0.29999…) in the bin its label "30–40 %" promises.
const BIN_EDGE_TOLERANCE = 1e-9;

/**
 * The bin of a utilisation ratio (1 = 100 %): 0 for [0, 0.1), …, 9 for [0.9, 1.0]. Returns −1 when the ratio is not
 * a valid utilisation (NaN, negative) and `UTILISATION_BIN_COUNT` above 100 %.
 */
export function utilisationBinIndex(utilisationRatio: number): number {
  if (Number.isNaN(utilisationRatio) || utilisationRatio < 0) return -1;
  if (utilisationRatio > 1) return UTILISATION_BIN_COUNT;
  return Math.min(UTILISATION_BIN_COUNT - 1, Math.floor(utilisationRatio * UTILISATION_BIN_COUNT + BIN_EDGE_TOLERANCE));
}

/** The colour of a utilisation ratio; null, NaN or a negative ratio mean "not checked". */
export function utilisationColour(utilisationRatio: number | null): RgbHex {
  if (utilisationRatio === null) return NOT_CHECKED_COLOUR;
  const bin = utilisationBinIndex(utilisationRatio);
  if (bin < 0) return NOT_CHECKED_COLOUR;
  return bin === UTILISATION_BIN_COUNT ? OVER_CAPACITY_COLOUR : UTILISATION_BIN_COLOURS[bin];
}

function percent(bin: number): number {
  return (bin * 100) / UTILISATION_BIN_COUNT;
}

/** Legend of the utilisation colouring, read from the top: over 100 %, the ten bins from high to low, not checked. */
export function utilisationLegend(): LegendEntry[] {
  const bins = UTILISATION_BIN_COLOURS.map((colour, bin) => ({
    key: `bin-${bin}`,
    label: `${percent(bin)}–${percent(bin + 1)} %`,
    colour,
  }));
  return [
    { key: 'over', label: 'over 100 %', colour: OVER_CAPACITY_COLOUR },
    ...bins.reverse(),
    { key: 'not-checked', label: 'not checked', colour: NOT_CHECKED_COLOUR },
  ];
}

/**
 * Status colours: blue, amber and the over-capacity magenta differ in hue and lightness for every common
 * colour-vision type; the two greys differ in lightness only, as "no result" should.
 */
export const STATUS_COLOURS: Readonly<Record<MemberCheckStatus, RgbHex>> = {
  pass: 0x4477aa,
  warning: 0xe69f00,
  fail: OVER_CAPACITY_COLOUR,
  'not-checked': NOT_CHECKED_COLOUR,
  'not-applicable': 0x6e6e6e,
};

export const STATUS_LABELS: Readonly<Record<MemberCheckStatus, string>> = {
  pass: 'passes',
  warning: 'close to capacity',
  fail: 'fails',
  'not-checked': 'not checked',
  'not-applicable': 'no web shear rule for this section',
};

const STATUS_ORDER: readonly MemberCheckStatus[] = ['pass', 'warning', 'fail', 'not-checked', 'not-applicable'];

export function statusLegend(): LegendEntry[] {
  return STATUS_ORDER.map((status) => ({ key: status, label: STATUS_LABELS[status], colour: STATUS_COLOURS[status] }));
}

/**
 * Categorical colours for sections: the Okabe–Ito palette without black (Okabe & Ito, "Color Universal Design",
 * 2008; values from memory), then the same hues lightened for the next seven sections.
 */
const SECTION_BASE_PALETTE: readonly RgbHex[] = [0xe69f00, 0x56b4e9, 0x009e73, 0xf0e442, 0x0072b2, 0xd55e00, 0xcc79a7];

function mixWithWhite(colour: RgbHex, whiteShare: number): RgbHex {
  const channel = (shift: number) => {
    const value = (colour >> shift) & 0xff;
    return Math.round(value + (255 - value) * whiteShare) << shift;
  };
  return channel(16) | channel(8) | channel(0);
}

export const SECTION_PALETTE: readonly RgbHex[] = [
  ...SECTION_BASE_PALETTE,
  ...SECTION_BASE_PALETTE.map((colour) => mixWithWhite(colour, 0.5)),
];

/** Sections in name order get the palette in order, so the same set of sections always gets the same colours. */
export function sectionColours(sections: Iterable<string>): Map<string, RgbHex> {
  const names = [...new Set(sections)].sort((a, b) => a.localeCompare(b, 'en', { numeric: true }));
  return new Map(names.map((name, i) => [name, SECTION_PALETTE[i % SECTION_PALETTE.length]]));
}

/** Legend of the section colouring; sections beyond the palette share colours, which the legend then says. */
export function sectionLegend(colours: ReadonlyMap<string, RgbHex>): LegendEntry[] {
  const entries = [...colours].map(([name, colour]) => ({ key: `section-${name}`, label: name, colour }));
  return [...entries, { key: 'not-checked', label: 'no section', colour: NOT_CHECKED_COLOUR }];
}
