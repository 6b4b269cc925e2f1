/**
 * Section designations as exporters write them, read out of free text into one canonical key per section:
 * 'HE 360 A', 'HEA360' and 'HE360A' all give 'HEA|360'; '310UC96.8' and 'UC 310x96.8' give 'AU-UC|310|96.8';
 * 'HSS6x6x3/8' and 'HSS6X6X.375' give 'HSS|6|6|0.375'. Numbers are compared as numbers ('6.0' = '6'), never rounded
 * or abbreviated, so '310UC97' can never become '310UC96.8'.
 *
 * The parser also keeps the naming form it read when that form belongs to one region only: '100x6.0SHS',
 * '100x50x4.0RHS' and '168.3x7.1CHS' (size first, family letters last, wall with one decimal) are written the
 * Australian and New Zealand way, while 'SHS 100x100x6' is written alike everywhere and carries no form.
 */

/** A regional way of writing designations: 'as-nzs' is the AS/NZS makers' size-first hollow-section form. */
export type DesignationForm = 'as-nzs';

export interface DesignationMatch {
  /** Canonical key: series tag and the numbers of the designation, '|'-separated. */
  readonly key: string;
  /** The designation as it stands in the text. */
  readonly text: string;
  /** Where it starts in the text. */
  readonly index: number;
  /** The regional naming form the text is written in, when only one region writes it so. */
  readonly form?: DesignationForm;
}

// Separators between the parts of a designation, and the 'x' between dimensions ('×' and '*' are read as 'X').
const SEP = '[\\s_\\-]*';
const BY = `${SEP}X${SEP}`;
const NUM = '(\\d+(?:\\.\\d+)?)';
// US hollow-section sizes: '3/8', '.375', '0.280', '3-1/2' (the mixed form is tried first).
const INCH = '(\\d+-\\d+/\\d+|\\d+/\\d+|\\d*\\.\\d+|\\d+)';
// A designation must not be glued to letters or digits on either side: 'IPE2700', 'XIPE270', 'IPE270A'.
const START = '(?<![A-Z0-9.])';
const END = '(?![A-Z0-9]|\\.\\d)';

interface Grammar {
  readonly pattern: RegExp;
  readonly key: (groups: readonly string[]) => string | null;
  readonly form?: (groups: readonly string[]) => DesignationForm | undefined;
}

function grammar(source: string, key: Grammar['key'], form?: Grammar['form']): Grammar {
  return { pattern: new RegExp(`${START}${source}${END}`, 'g'), key, form };
}

/** Size-first hollow sections with the wall in one decimal ('6.0', '7.1') are the AS/NZS makers' form. */
const asNzsWall = (wall: string): DesignationForm | undefined => (/^\d+\.\d$/.test(wall) ? 'as-nzs' : undefined);

/** '6.0' → '6', '.375' → '0.375', '3/8' → '0.375', '3-1/2' → '3.5'; null for anything that is not a positive size. */
export function canonicalNumber(text: string): string | null {
  const mixed = /^(\d+)-(\d+)\/(\d+)$/.exec(text);
  const fraction = /^(\d+)\/(\d+)$/.exec(text);
  let value: number;
  if (mixed) value = Number(mixed[1]) + Number(mixed[2]) / Number(mixed[3]);
  else if (fraction) value = Number(fraction[1]) / Number(fraction[2]);
  else value = Number(text);
  if (!Number.isFinite(value) || value <= 0) return null;
  // Fractions of an inch have at most six decimals (1/64 = 0.015625).
  return String(Math.round(value * 1e6) / 1e6);
}

function keyOf(tag: string, numbers: readonly string[]): string | null {
  const canonical = numbers.map(canonicalNumber);
  return canonical.every((n) => n !== null) ? [tag, ...canonical].join('|') : null;
}

const GRAMMARS: readonly Grammar[] = [
  // EN 10365 I and H. IPE A / IPE O / HE AA variants are other sections: the letters after the size are refused.
  grammar(`IPE${SEP}${NUM}(?!${SEP}(?:AA|A|O|V)(?![A-Z]))`, ([size]) => keyOf('IPE', [size])),
  grammar(`HE${SEP}([ABM])${SEP}${NUM}`, ([letter, size]) => keyOf(`HE${letter}`, [size])),
  grammar(`HE${SEP}${NUM}${SEP}([ABM])`, ([size, letter]) => keyOf(`HE${letter}`, [size])),
  grammar(`HD${SEP}${NUM}${BY}${NUM}`, ([size, mass]) => keyOf('HD', [size, mass])),
  grammar(`(?:IPN|INP)${SEP}${NUM}`, ([size]) => keyOf('IPN', [size])),
  // 'U 200' alone is not read: UPN 200 and UPE 200 are different sections.
  grammar(`(UPN|UPE)${SEP}${NUM}`, ([series, size]) => keyOf(series, [size])),
  // BS 4-1 (UK): three numbers, series before or after.
  grammar(`(UB|UC|PFC)${SEP}${NUM}${BY}${NUM}${BY}${NUM}`, ([series, a, b, c]) => keyOf(`UK-${series}`, [a, b, c])),
  grammar(`${NUM}${BY}${NUM}${BY}${NUM}${SEP}(UB|UC|PFC)`, ([a, b, c, series]) => keyOf(`UK-${series}`, [a, b, c])),
  // AS/NZS 3679 (AU/NZ): depth, series, mass per metre ('310UC96.8', 'UC 310x96.8'); a PFC's mass may be left out.
  grammar(`${NUM}${SEP}(UB|UC|WB|WC)${SEP}${NUM}`, ([depth, series, mass]) => keyOf(`AU-${series}`, [depth, mass])),
  grammar(`(UB|UC|WB|WC)${SEP}${NUM}${BY}${NUM}`, ([series, depth, mass]) => keyOf(`AU-${series}`, [depth, mass])),
  grammar(`${NUM}${SEP}PFC(?:${SEP}${NUM})?`, ([depth, mass]) => keyOf('AU-PFC', mass ? [depth, mass] : [depth])),
  grammar(`PFC${SEP}${NUM}(?:${BY}${NUM})?`, ([depth, mass]) => keyOf('AU-PFC', mass ? [depth, mass] : [depth])),
  // Metric hollow sections: 'SHS 100x100x6', '100x100x6SHS', '100x6.0SHS' (square: one side written), 'CHS 168.3x5'.
  // Size first with a one-decimal wall is the AS/NZS form.
  grammar(`(SHS|RHS)${SEP}${NUM}${BY}${NUM}${BY}${NUM}`, ([, d, b, t]) => keyOf('RHS', [d, b, t])),
  grammar(`${NUM}${BY}${NUM}${BY}${NUM}${SEP}(SHS|RHS)`, ([d, b, t]) => keyOf('RHS', [d, b, t]), ([, , t]) => asNzsWall(t)),
  grammar(`SHS${SEP}${NUM}${BY}${NUM}`, ([b, t]) => keyOf('RHS', [b, b, t])),
  grammar(`${NUM}${BY}${NUM}${SEP}SHS`, ([b, t]) => keyOf('RHS', [b, b, t]), ([, t]) => asNzsWall(t)),
  grammar(`CHS${SEP}${NUM}${BY}${NUM}`, ([d, t]) => keyOf('CHS', [d, t])),
  grammar(`${NUM}${BY}${NUM}${SEP}CHS`, ([d, t]) => keyOf('CHS', [d, t]), ([, t]) => asNzsWall(t)),
  // AISC: HSS rectangular (three sizes) before round (two), then the rolled shapes; MC and HP before M, C and H.
  grammar(`HSS${SEP}${INCH}${BY}${INCH}${BY}${INCH}`, ([d, b, t]) => keyOf('HSS', [d, b, t])),
  grammar(`HSS${SEP}${INCH}${BY}${INCH}`, ([d, t]) => keyOf('HSSR', [d, t])),
  grammar(`(MC|HP|W|S|M|C)${SEP}${NUM}${BY}${NUM}`, ([series, depth, weight]) => keyOf(series, [depth, weight])),
];

function normalised(text: string): string {
  return String(text).toUpperCase().replace(/[×*]/g, 'X');
}

/**
 * The first section designation in `text` ('IPE270' in 'Beam:IPE270:341211', 'HEA360' in 'HEA360-S355'), or null.
 * When designations start at the same place the longest wins ('UB 305x165x40' over a shorter reading).
 */
export function designationIn(text: string): DesignationMatch | null {
  const upper = normalised(text);
  let best: DesignationMatch | null = null;
  for (const { pattern, key, form } of GRAMMARS) {
    pattern.lastIndex = 0;
    for (let m = pattern.exec(upper); m; m = pattern.exec(upper)) {
      const groups = m.slice(1);
      const k = key(groups);
      if (k && (!best || m.index < best.index || (m.index === best.index && m[0].length > best.text.length))) {
        const written = form?.(groups);
        best = { key: k, text: String(text).slice(m.index, m.index + m[0].length), index: m.index, ...(written ? { form: written } : {}) };
      }
      if (m[0].length === 0) pattern.lastIndex++;
    }
  }
  return best;
}

/** Canonical key of a whole name that is a designation, null when the name is not one (a project's own names). */
export function designationKey(name: string): string | null {
  const match = designationIn(name);
  return match && match.text.trim().length === String(name).trim().length ? match.key : null;
}

/**
 * Every key a catalogue name answers to: an AS/NZS PFC is also found by its depth alone ('300PFC' is '300PFC40.1'),
 * as each depth is rolled in one mass only.
 */
export function keysOf(key: string): string[] {
  const parts = key.split('|');
  return parts[0] === 'AU-PFC' && parts.length === 3 ? [key, parts.slice(0, 2).join('|')] : [key];
}
