import { recommendedParameters } from '../checks/check-parameters';
import { evaluateFamilyMember, familySectionOf, familyStressOf } from '../checks/family-member-sheet';
import { SectionInputError } from '../engine/section';
import { sampleCheckReport } from '../../test/fixtures/bcf/sample-check-report';
import { buildCheckReport } from './check-report';
import { pdfPageTexts } from './pdf-page-texts';
import { REPORT_CAUTIONS, REPORT_CAUTIONS_TEXT } from './report-cautions';

describe('buildCheckReport', () => {
  let pdf: Buffer;
  let pages: string[];

  beforeAll(async () => {
    pdf = await buildCheckReport(sampleCheckReport(), { compress: false });
    pages = pdfPageTexts(pdf);
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

  it('prints the justification of an accepted finding with who accepted it and when', async () => {
    const data = sampleCheckReport();
    const acceptance = { justification: 'Stiffener pair on the fabrication drawings carries the bearing (invented).', author: 'lead@example.com', date: '2026-02-07T07:30:00Z' };
    const findings = data.findings.map((finding) => (finding.status === 'accepted' ? { ...finding, acceptance } : finding));
    const text = pdfPageTexts(await buildCheckReport({ ...data, findings }, { compress: false })).join(' ');
    expect(text).toContain('Accepted findings and their justifications');
    expect(text).toContain(acceptance.justification);
    expect(text).toContain('lead@example.com');
    expect(text).toContain('2026-02-07 07:30 UTC');
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
    expect(pdfPageTexts(compressed)).toEqual(pages);
  });

  it('refuses a sheet whose section is not a real I-section, naming the field', async () => {
    const data = sampleCheckReport();
    const broken = { ...data.sheets[0], section: { ...data.sheets[0].section!, webThickness_mm: 0 } };
    await expect(buildCheckReport({ ...data, sheets: [broken] })).rejects.toThrow(SectionInputError);
    await expect(buildCheckReport({ ...data, sheets: [broken] })).rejects.toThrow(/webThickness_mm/);
  });

  it('draws a sheet of a box with its void and of a tube, with their dimensions and τ plot', async () => {
    const data = sampleCheckReport();
    const parameters = recommendedParameters('en1993-1-1');
    const base = data.sheets[0];
    // Invented members: a welded box 400 × 250 (webs 10, flanges 20) and a tube Ø 273 × 10, both S355 under 600 kN.
    const familySheet = (label: string, dimensions: Parameters<typeof familySectionOf>[0]['dimensions']) => {
      const member = {
        globalId: base.check.globalId,
        status: 'ok' as const,
        material: { name: 'S355', grade: 'S355' as const, fy_MPa: 355, assumed: false },
        profile: { ...dimensions, name: label, source: 'ifc-profile' as const, ifcType: 'IfcParameterizedProfileDef', fabrication: 'welded' as const },
      };
      const evaluation = evaluateFamilyMember(member as never, parameters, 'major', 600_000)!;
      const { section: _section, ...rest } = base;
      return { ...rest, memberLabel: label, profileName: label, family: { section: familySectionOf(evaluation), stress: familyStressOf(evaluation, 600_000) }, trace: evaluation.result.trace };
    };
    const sheets = [
      familySheet('BX-1', { family: 'box', depth_mm: 400, width_mm: 250, webThickness_mm: 10, flangeThickness_mm: 20 }),
      familySheet('CT-1', { family: 'tube', diameter_mm: 273, wallThickness_mm: 10 }),
    ];
    const text = pdfPageTexts(await buildCheckReport({ ...data, sheets }, { compress: false })).join(' ');
    for (const expected of ['Calculation sheet — BX-1', 'h = 400', 'b = 250', 'tw = 10', 'tf = 20', 'V/(2·hw·tw)', 'Calculation sheet — CT-1', 'd = 273', 't = 10', 'the total cut width']) {
      expect({ expected, found: text.includes(expected) }).toEqual({ expected, found: true });
    }
  });
});
