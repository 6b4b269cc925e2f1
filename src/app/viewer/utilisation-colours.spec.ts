import {
  NOT_CHECKED_COLOUR,
  OVER_CAPACITY_COLOUR,
  type RgbHex,
  SECTION_PALETTE,
  STATUS_COLOURS,
  UTILISATION_BIN_COLOURS,
  UTILISATION_BIN_COUNT,
  rgbHexToCss,
  rgbStringToHex,
  sectionColours,
  statusLegend,
  utilisationBinIndex,
  utilisationColour,
  utilisationLegend,
} from './utilisation-colours';

// Colour science for the checks below, written from the published definitions.

/** sRGB decoding, IEC 61966-2-1. */
function linearChannel(colour: RgbHex, shift: number): number {
  const c = ((colour >> shift) & 0xff) / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

function encodeChannel(linear: number): number {
  const v = Math.min(1, Math.max(0, linear));
  return 255 * (v <= 0.0031308 ? 12.92 * v : 1.055 * v ** (1 / 2.4) - 0.055);
}

type Rgb = readonly [number, number, number];

function linearRgb(colour: RgbHex): Rgb {
  return [linearChannel(colour, 16), linearChannel(colour, 8), linearChannel(colour, 0)];
}

/** Relative luminance, WCAG 2.x (Rec. 709 primaries, D65). */
function relativeLuminance(colour: RgbHex): number {
  const [r, g, b] = linearRgb(colour);
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** CIELAB (CIE 15) from linear sRGB, D65 white; sRGB → XYZ matrix of IEC 61966-2-1. */
function lab([r, g, b]: Rgb): Rgb {
  const x = (0.4124 * r + 0.3576 * g + 0.1805 * b) / 0.95047;
  const y = 0.2126 * r + 0.7152 * g + 0.0722 * b;
  const z = (0.0193 * r + 0.1192 * g + 0.9505 * b) / 1.08883;
  const f = (t: number) => (t > 216 / 24389 ? Math.cbrt(t) : ((24389 / 27) * t + 16) / 116);
  return [116 * f(y) - 16, 500 * (f(x) - f(y)), 200 * (f(y) - f(z))];
}

type Matrix3 = readonly [Rgb, Rgb, Rgb];

/**
 * Dichromacy simulation matrices for severity 1.0, applied to linear RGB: Machado, Oliveira & Fernandes,
 * "A physiologically-based model for simulation of color vision deficiency", IEEE TVCG 2009 (from memory).
 */
const VISION: Readonly<Record<string, Matrix3>> = {
  normal: [
    [1, 0, 0],
    [0, 1, 0],
    [0, 0, 1],
  ],
  protanopia: [
    [0.152286, 1.052583, -0.204868],
    [0.114503, 0.786281, 0.099216],
    [-0.003882, -0.048116, 1.051998],
  ],
  deuteranopia: [
    [0.367322, 0.860646, -0.227968],
    [0.280085, 0.672501, 0.047413],
    [-0.01182, 0.04294, 0.968881],
  ],
  tritanopia: [
    [1.255528, -0.076749, -0.178779],
    [-0.078411, 0.930809, 0.147602],
    [0.004733, 0.691367, 0.3039],
  ],
};

/** Simulates a vision type and re-quantises to 8-bit sRGB, as a screen would show it. */
function seenAs(colour: RgbHex, vision: Matrix3): Rgb {
  const rgb = linearRgb(colour);
  const encoded = vision.map((row) => Math.round(encodeChannel(row[0] * rgb[0] + row[1] * rgb[1] + row[2] * rgb[2])));
  return linearRgb((encoded[0] << 16) | (encoded[1] << 8) | encoded[2]);
}

/** CIE76 colour difference. */
function deltaE(a: RgbHex, b: RgbHex, vision: Matrix3): number {
  const [l1, a1, b1] = lab(seenAs(a, vision));
  const [l2, a2, b2] = lab(seenAs(b, vision));
  return Math.hypot(l1 - l2, a1 - a2, b1 - b2);
}

/** Pairs (one from each list) that some vision type sees closer than `minimum`, described for the failure message. */
function closePairs(colours: readonly RgbHex[], others: readonly RgbHex[], minimum: number): string[] {
  const close: string[] = [];
  for (const [name, vision] of Object.entries(VISION)) {
    for (const a of colours) {
      for (const b of others) {
        const difference = deltaE(a, b, vision);
        if (a !== b && difference < minimum) {
          close.push(`${name}: ${rgbHexToCss(a)} vs ${rgbHexToCss(b)}, ΔE ${difference.toFixed(1)}`);
        }
      }
    }
  }
  return close;
}

function channels(colour: RgbHex): Rgb {
  return [(colour >> 16) & 0xff, (colour >> 8) & 0xff, colour & 0xff];
}

describe('utilisation scale', () => {
  it('starts and ends where the published cividis map does', () => {
    // Cividis end points #00204D and #FFEA46 (Nuñez, Anderton & Renslow, PLOS ONE 2018; from memory). d3's
    // polynomial fit of the map is within a few levels of them; 8 levels per channel allowed.
    const [first, last] = [UTILISATION_BIN_COLOURS[0], UTILISATION_BIN_COLOURS[UTILISATION_BIN_COUNT - 1]];
    channels(first).forEach((value, i) => expect(Math.abs(value - channels(0x00204d)[i])).toBeLessThanOrEqual(8));
    channels(last).forEach((value, i) => expect(Math.abs(value - channels(0xffea46)[i])).toBeLessThanOrEqual(8));
  });

  it('gets lighter from each bin to the next', () => {
    const luminances = UTILISATION_BIN_COLOURS.map(relativeLuminance);
    for (let bin = 1; bin < luminances.length; bin++) {
      expect(luminances[bin]).toBeGreaterThan(luminances[bin - 1]);
    }
  });

  it('keeps over 100 % far from every bin, also for protan, deutan and tritan vision', () => {
    // A ΔE76 of 30 is a difference nobody misses side by side (common practice, no source).
    expect(closePairs([OVER_CAPACITY_COLOUR], UTILISATION_BIN_COLOURS, 30)).toEqual([]);
  });

  it('keeps "not checked" apart from every bin and from over 100 %', () => {
    expect(closePairs([NOT_CHECKED_COLOUR], [...UTILISATION_BIN_COLOURS, OVER_CAPACITY_COLOUR], 15)).toEqual([]);
  });

  it('puts ratios into the bins their labels name', () => {
    expect(utilisationBinIndex(0)).toBe(0);
    expect(utilisationBinIndex(0.0999)).toBe(0);
    expect(utilisationBinIndex(0.1)).toBe(1);
    expect(utilisationBinIndex(0.1 + 0.2)).toBe(3); // 0.30000000000000004
    expect(utilisationBinIndex(0.7 - 0.4)).toBe(3); // 0.29999999999999993
    expect(utilisationBinIndex(0.95)).toBe(9);
    expect(utilisationBinIndex(1)).toBe(9);
    expect(utilisationBinIndex(1.000001)).toBe(UTILISATION_BIN_COUNT);
  });

  it('draws exactly 100 % as the last bin and anything above as magenta', () => {
    expect(utilisationColour(1)).toBe(UTILISATION_BIN_COLOURS[9]);
    expect(utilisationColour(1.01)).toBe(OVER_CAPACITY_COLOUR);
    expect(utilisationColour(Number.POSITIVE_INFINITY)).toBe(OVER_CAPACITY_COLOUR);
  });

  it('treats null, NaN and negative ratios as not checked, never as 0 %', () => {
    expect(utilisationColour(null)).toBe(NOT_CHECKED_COLOUR);
    expect(utilisationColour(Number.NaN)).toBe(NOT_CHECKED_COLOUR);
    expect(utilisationColour(-0.2)).toBe(NOT_CHECKED_COLOUR);
    expect(utilisationBinIndex(Number.NaN)).toBe(-1);
  });
});

describe('utilisation legend', () => {
  it('reads from over 100 % at the top through the bins from high to low to not checked', () => {
    const legend = utilisationLegend();
    expect(legend.map((entry) => entry.label)).toEqual([
      'over 100 %',
      '90–100 %',
      '80–90 %',
      '70–80 %',
      '60–70 %',
      '50–60 %',
      '40–50 %',
      '30–40 %',
      '20–30 %',
      '10–20 %',
      '0–10 %',
      'not checked',
    ]);
    expect(legend.slice(1, 11).map((entry) => entry.colour)).toEqual([...UTILISATION_BIN_COLOURS].reverse());
  });

  it('shows each bin in the colour the scale gives a ratio inside it', () => {
    for (const entry of utilisationLegend().slice(1, 11)) {
      const lowerPercent = Number(entry.label.split('–')[0]);
      expect(utilisationColour(lowerPercent / 100 + 0.05)).toBe(entry.colour);
    }
  });
});

describe('status colours', () => {
  it('keeps every pair of statuses apart for each vision type', () => {
    const colours = Object.values(STATUS_COLOURS);
    expect(closePairs(colours, colours, 20)).toEqual([]);
  });

  it('uses the over-capacity magenta for failing members in both colourings', () => {
    expect(STATUS_COLOURS.fail).toBe(OVER_CAPACITY_COLOUR);
    expect(statusLegend().find((entry) => entry.key === 'fail')?.colour).toBe(OVER_CAPACITY_COLOUR);
  });
});

describe('section colours', () => {
  it('orders sections naturally so the same set always gets the same colours', () => {
    const colours = sectionColours(['IPE 300', 'HEA 200', 'IPE 80', 'IPE 300']);
    expect([...colours.keys()]).toEqual(['HEA 200', 'IPE 80', 'IPE 300']);
    expect(colours.get('HEA 200')).toBe(SECTION_PALETTE[0]);
    expect(sectionColours(['IPE 80', 'IPE 300', 'HEA 200'])).toEqual(colours);
  });

  it('repeats the palette beyond its length', () => {
    const names = Array.from({ length: SECTION_PALETTE.length + 1 }, (_, i) => `S${String(i).padStart(2, '0')}`);
    const colours = sectionColours(names);
    expect(colours.get(names[SECTION_PALETTE.length])).toBe(SECTION_PALETTE[0]);
  });
});

describe('colour notation', () => {
  it('reads d3 rgb() strings and writes CSS hex', () => {
    expect(rgbStringToHex('rgb(0, 32, 81)')).toBe(0x002051);
    expect(rgbHexToCss(0x002051)).toBe('#002051');
    expect(() => rgbStringToHex('#002051')).toThrow('rgb(r, g, b)');
  });
});
