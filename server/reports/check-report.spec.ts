import { SectionInputError } from '../engine/section';
import { sampleCheckReport } from '../../test/fixtures/bcf/sample-check-report';
import { buildCheckReport } from './check-report';
import { REPORT_CAUTIONS, REPORT_CAUTIONS_TEXT } from './report-cautions';

/**
 * Reads the text of an uncompressed pdfkit file without a PDF library: each page's content stream, its fonts'
 * ToUnicode maps (pdfkit writes Identity-H glyph codes), and the hex strings of every TJ operator.
 */
function pageTexts(pdf: Buffer): string[] {
  const source = pdf.toString('latin1');
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

describe('buildCheckReport', () => {
  let pdf: Buffer;
  let pages: string[];

  beforeAll(async () => {
    pdf = await buildCheckReport(sampleCheckReport(), { compress: false });
    pages = pageTexts(pdf);
  });

  it('writes a complete PDF file with a plausible number of pages', () => {
    expect(pdf.subarray(0, 8).toString('latin1')).toMatch(/^%PDF-1\.\d/);
    expect(pdf.subarray(-6).toString('latin1')).toContain('%%EOF');
    const count = Number(/\/Type \/Pages\s*\/Count (\d+)/.exec(pdf.toString('latin1'))?.[1]);
    // Cover, parameters and summary, findings, then at least one page per calculation sheet.
    expect(count).toBe(pages.length);
    expect(count).toBeGreaterThanOrEqual(2 + 2);
    expect(count).toBeLessThanOrEqual(4 + 2 * 2);
  });

  it('prints the cautions on every page, and lists them on the cover', () => {
    for (const [i, text] of pages.entries()) {
      expect({ page: i + 1, has: text.includes(REPORT_CAUTIONS_TEXT) }).toEqual({ page: i + 1, has: true });
    }
    for (const caution of REPORT_CAUTIONS) expect(pages[0]).toContain(caution);
  });

  it('embeds its own fonts and uses none of the standard PDF fonts', () => {
    const source = pdf.toString('latin1');
    expect(source).toMatch(/\/BaseFont \/[A-Z]{6}\+Inter-Regular/);
    expect(source).toMatch(/\/BaseFont \/[A-Z]{6}\+JetBrainsMono-Regular/);
    expect(source).toContain('/FontFile2');
    expect(source).not.toMatch(/\/BaseFont \/(Helvetica|Times|Courier)/);
  });

  it('holds the project, run record, summary, findings, sheets and sign-off', () => {
    const all = pages.join(' ');
    for (const expected of [
      'Harbour Lane depot & offices',
      'Model revision B · depot-rev-B.ifc',
      'EN 1993-1-1 §6.2.6 with EN 1993-1-5 §5',
      '4f1c0d8e2b7a95c3e6d1f0a2b4c6d8e0',
      'Engine version',
      'Findings by status',
      'F-0001',
      'Calculation sheet — B-12',
      'Calculation sheet — G-3',
      'Clause by clause',
      'Load combinations',
      'ULS-2 (governing)',
      'Prepared by',
      'Eng One',
      'Approved by',
    ]) {
      expect({ expected, found: all.includes(expected) }).toEqual({ expected, found: true });
    }
  });

  it('writes Greek symbols with the Greek face instead of dropping them', () => {
    const sheetPage = pages.find((text) => text.includes('Calculation sheet — B-12')) ?? '';
    expect(sheetPage).toContain('γ');
    expect(sheetPage).toContain('τ');
    expect(sheetPage).not.toContain('\uFFFD');
  });

  it('compresses by default', async () => {
    const compressed = await buildCheckReport(sampleCheckReport());
    expect(compressed.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(compressed.length).toBeLessThan(pdf.length);
    expect(compressed.toString('latin1')).toContain('/FlateDecode');
  });

  it('refuses a sheet whose section is not a real I-section, naming the field', async () => {
    const data = sampleCheckReport();
    const broken = { ...data.sheets[0], section: { ...data.sheets[0].section, webThickness_mm: 0 } };
    await expect(buildCheckReport({ ...data, sheets: [broken] })).rejects.toThrow(SectionInputError);
    await expect(buildCheckReport({ ...data, sheets: [broken] })).rejects.toThrow(/webThickness_mm/);
  });
});
