/**
 * Fonts and text for the PDF report. The embedded fonts are @fontsource subsets (fonts/pdf/README.md): a latin file
 * and a greek file per face, so a string is written as runs that switch face at Greek letters (τ, γ, η, φ, Ω, χ, λ).
 * Mathematical signs that none of the subsets carry (√ ≤ ≥ → ≈) are spelled out in ASCII rather than printed as
 * empty boxes.
 */
import path from 'node:path';
import { existsSync, readFileSync } from 'node:fs';
import { woffToSfnt } from './woff-to-sfnt';

export type FontRole = 'body' | 'bold' | 'mono';

const FONT_FILES: Readonly<Record<FontRole, { latin: string; greek: string }>> = {
  body: { latin: 'inter-latin-400-normal.woff', greek: 'inter-greek-400-normal.woff' },
  bold: { latin: 'inter-latin-600-normal.woff', greek: 'inter-greek-600-normal.woff' },
  mono: { latin: 'jetbrains-mono-latin-400-normal.woff', greek: 'jetbrains-mono-greek-400-normal.woff' },
};

/**
 * fonts/pdf, found by walking up from this file: the code runs from server/reports (ts-node, jest) and from
 * dist/server/server/reports (compiled), at different depths.
 */
function fontDirectory(from: string = __dirname): string {
  for (let dir = from; ; dir = path.dirname(dir)) {
    const candidate = path.join(dir, 'fonts', 'pdf');
    if (existsSync(path.join(candidate, FONT_FILES.body.latin))) return candidate;
    if (path.dirname(dir) === dir) throw new Error(`The report fonts were not found in a fonts/pdf folder above ${from}.`);
  }
}

export type Pdf = PDFKit.PDFDocument;

/** Unpacked once per process: font name → sfnt bytes. */
let fontBytes: Map<string, Buffer> | undefined;

function loadFonts(): Map<string, Buffer> {
  const directory = fontDirectory();
  const fonts = new Map<string, Buffer>();
  for (const [role, files] of Object.entries(FONT_FILES)) {
    for (const [script, file] of Object.entries(files)) {
      const full = path.join(directory, file);
      if (!existsSync(full)) throw new Error(`Report font ${file} is missing from ${directory}.`);
      fonts.set(`${role}-${script}`, woffToSfnt(readFileSync(full)));
    }
  }
  return fonts;
}

export function registerReportFonts(doc: Pdf): void {
  fontBytes ??= loadFonts();
  for (const [name, bytes] of fontBytes) doc.registerFont(name, bytes);
}

/** Code points of @fontsource's greek subset (its unicode-range: U+0370–03FF less a few unassigned ones). */
function isGreek(codePoint: number): boolean {
  return codePoint >= 0x0370 && codePoint <= 0x03ff;
}

/** The latin subset's unicode-range, as @fontsource declares it for Inter and JetBrains Mono 5.x. */
const LATIN_RANGES: readonly (readonly [number, number])[] = [
  [0x0000, 0x00ff], [0x0131, 0x0131], [0x0152, 0x0153], [0x02bb, 0x02bc], [0x02c6, 0x02c6], [0x02da, 0x02da],
  [0x02dc, 0x02dc], [0x0304, 0x0304], [0x0308, 0x0308], [0x0329, 0x0329], [0x2000, 0x206f], [0x20ac, 0x20ac],
  [0x2122, 0x2122], [0x2191, 0x2191], [0x2193, 0x2193], [0x2212, 0x2212], [0x2215, 0x2215], [0xfeff, 0xfeff],
  [0xfffd, 0xfffd],
];

function isLatin(codePoint: number): boolean {
  return LATIN_RANGES.some(([from, to]) => codePoint >= from && codePoint <= to);
}

/** Spelled-out forms of signs that no embedded subset has (√ is handled first, see spellOutRoots). */
const SPELLED_OUT: Readonly<Record<string, string>> = {
  '≤': '<=',
  '≥': '>=',
  '→': '->',
  '≈': '~',
  '∫': 'integral ',
  '⁴': '^4',
  '⁵': '^5',
  '⁶': '^6',
};

export interface TextRun {
  text: string;
  greek: boolean;
}

/** √3 → sqrt(3), √kτ → sqrt(kτ), √(E/Fy) → sqrt(E/Fy): the operand keeps its extent without the radical bar. */
function spellOutRoots(text: string): string {
  return text.replace(/√(?!\()([\p{L}\p{N}.,]+)/gu, 'sqrt($1)').replace(/√/g, 'sqrt');
}

/** Splits text into runs of one font script, replacing what no font can show. */
export function textRuns(text: string): TextRun[] {
  const runs: TextRun[] = [];
  const push = (piece: string, greek: boolean): void => {
    const last = runs[runs.length - 1];
    if (last && last.greek === greek) last.text += piece;
    else runs.push({ text: piece, greek });
  };
  for (const char of spellOutRoots(text)) {
    const codePoint = char.codePointAt(0) as number;
    if (isGreek(codePoint)) push(char, true);
    else if (SPELLED_OUT[char] !== undefined) push(SPELLED_OUT[char], false);
    else push(isLatin(codePoint) ? char : '?', false);
  }
  return runs;
}

/**
 * Ligatures off: the subsets keep the ligature rules but not every ligature glyph (JetBrains Mono's "<=" fails to
 * lay out), and a sheet should show the characters as typed anyway. fontkit takes this object form; pdfkit's types
 * only know the array form.
 */
const NO_LIGATURES = { liga: false, calt: false } as unknown as PDFKit.Mixins.TextOptions['features'];

export interface TextOptions extends PDFKit.Mixins.TextOptions {
  size: number;
  color?: string;
}

/**
 * Writes text in one role at (x, y) (or the current position), switching to the greek face where needed; the runs
 * flow as one paragraph, so wrapping and width work as for a single call.
 */
export function writeText(doc: Pdf, text: string, role: FontRole, x: number | undefined, y: number | undefined, options: TextOptions): void {
  const { size, color, ...textOptions } = options;
  doc.fontSize(size);
  if (color !== undefined) doc.fillColor(color);
  const runs = textRuns(text);
  if (runs.length === 0) runs.push({ text: '', greek: false });
  // pdfkit aligns each run of a continued paragraph on its own, so mixed-script text is placed by hand instead.
  if (runs.length > 1 && x !== undefined && textOptions.width !== undefined && (textOptions.align === 'right' || textOptions.align === 'center')) {
    const free = Math.max(0, textOptions.width - textWidth(doc, text, role, size));
    x += textOptions.align === 'right' ? free : free / 2;
    textOptions.width -= free;
    textOptions.align = 'left';
  }
  runs.forEach((run, i) => {
    doc.font(`${role}-${run.greek ? 'greek' : 'latin'}`);
    const continued = i < runs.length - 1 || textOptions.continued === true;
    if (i === 0 && x !== undefined) doc.text(run.text, x, y, { ...textOptions, features: NO_LIGATURES, continued });
    else if (i === 0) doc.text(run.text, { ...textOptions, features: NO_LIGATURES, continued });
    else doc.text(run.text, { features: NO_LIGATURES, continued });
  });
}

function plainText(text: string): string {
  return textRuns(text)
    .map((run) => run.text)
    .join('');
}

/** Height the text takes in `width` (measured with the latin face; Greek letters are as wide). */
export function textHeight(doc: Pdf, text: string, role: FontRole, size: number, width: number): number {
  doc.font(`${role}-latin`).fontSize(size);
  return doc.heightOfString(plainText(text), { width, features: NO_LIGATURES });
}

export function textWidth(doc: Pdf, text: string, role: FontRole, size: number): number {
  doc.font(`${role}-latin`).fontSize(size);
  return doc.widthOfString(plainText(text), { features: NO_LIGATURES });
}
