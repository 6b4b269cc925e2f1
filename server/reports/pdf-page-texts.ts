/**
 * For tests: reads the text of a pdfkit file without a PDF library (not imported by the app). Each page's content
 * stream, its fonts' ToUnicode maps (pdfkit writes Identity-H glyph codes) and the hex strings of every TJ operator;
 * deflated streams (the default) are inflated first.
 */
import { inflateSync } from 'node:zlib';

const STREAM_START = /(\d+) 0 obj\s*<<([\s\S]*?)>>\s*stream\r?\n/g;

/** The file as latin1 text with every FlateDecode stream replaced by its inflated bytes (pdfkit writes direct /Length). */
function inflatedSource(pdf: Buffer): string {
  const source = pdf.toString('latin1');
  const parts: string[] = [];
  let copied = 0;
  for (const match of source.matchAll(STREAM_START)) {
    const dictionary = match[2];
    const length = Number(/\/Length (\d+)/.exec(dictionary)?.[1]);
    if (!dictionary.includes('/FlateDecode') || !Number.isFinite(length)) continue;
    const dataStart = match.index + match[0].length;
    parts.push(source.slice(copied, dataStart), inflateSync(pdf.subarray(dataStart, dataStart + length)).toString('latin1'));
    copied = dataStart + length;
  }
  parts.push(source.slice(copied));
  return parts.join('');
}

export function pdfPageTexts(pdf: Buffer): string[] {
  const source = inflatedSource(pdf);
  const objects = new Map<string, string>();
  for (const match of source.matchAll(/(\d+) 0 obj\s*([\s\S]*?)endobj/g)) objects.set(match[1], match[2]);
  const ref = (body: string, key: string): string => {
    const match = new RegExp(`/${key} (\\d+) 0 R`).exec(body);
    if (!match) throw new Error(`no /${key} reference`);
    return objects.get(match[1]) ?? '';
  };
  const unicodeMaps = new Map<string, Map<number, string>>();
  const unicodeMapOf = (fontBody: string): Map<number, string> => {
    const cmap = ref(fontBody, 'ToUnicode');
    const cached = unicodeMaps.get(cmap);
    if (cached) return cached;
    const map = new Map<number, string>();
    const fromHex = (hex: string): string => String.fromCharCode(...(hex.match(/.{4}/g) ?? []).map((unit) => parseInt(unit, 16)));
    for (const range of cmap.matchAll(/<([0-9a-f]{4})> <([0-9a-f]{4})> \[([^\]]*)\]/gi)) {
      [...range[3].matchAll(/<([0-9a-f]+)>/gi)].forEach((target, i) => map.set(parseInt(range[1], 16) + i, fromHex(target[1])));
    }
    unicodeMaps.set(cmap, map);
    return map;
  };
  const pages = [...objects.values()].filter((body) => /\/Type \/Page\n/.test(body));
  return pages.map((page) => {
    const fonts = new Map<string, Map<number, string>>();
    const fontDictionary = /\/Font <<([\s\S]*?)>>/.exec(ref(page, 'Resources'))?.[1] ?? '';
    for (const font of fontDictionary.matchAll(/\/(F\d+) (\d+) 0 R/g)) fonts.set(font[1], unicodeMapOf(objects.get(font[2]) ?? ''));
    const content = ref(page, 'Contents');
    const pieces: string[] = [];
    let current = new Map<number, string>();
    for (const token of content.matchAll(/\/(F\d+) [\d.]+ Tf|\[([^\]]*)\] TJ/g)) {
      if (token[1]) current = fonts.get(token[1]) ?? new Map();
      else {
        const codes = [...token[2].matchAll(/<([0-9a-f]+)>/gi)].flatMap((hex) => hex[1].match(/.{4}/g) ?? []);
        pieces.push(codes.map((code) => current.get(parseInt(code, 16)) ?? '\uFFFD').join(''));
      }
    }
    return pieces.join(' ').replace(/\s+/g, ' ');
  });
}

