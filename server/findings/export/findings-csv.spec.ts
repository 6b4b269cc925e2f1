import { parse } from 'csv-parse/sync';
import { SAMPLE_FINDINGS } from '../../../test/fixtures/bcf/sample-findings';
import { REPORT_CAUTIONS_TEXT } from '../../reports/report-cautions';
import type { FindingExport } from './finding-export';
import { FINDINGS_CSV_COLUMNS, findingsCsv } from './findings-csv';

/** Read back with csv-parse, an independent RFC 4180 reader. */
function readBack(csv: string): string[][] {
  return parse(csv, { bom: true, relax_column_count: true, skip_empty_lines: false }) as string[][];
}

describe('findingsCsv', () => {
  it('writes a header and one row per finding that an RFC 4180 reader gives back unchanged', () => {
    const rows = readBack(findingsCsv(SAMPLE_FINDINGS, { cautions: false }));
    expect(rows[0]).toEqual([...FINDINGS_CSV_COLUMNS]);
    expect(rows).toHaveLength(1 + SAMPLE_FINDINGS.length);
    const first = Object.fromEntries(FINDINGS_CSV_COLUMNS.map((column, i) => [column, rows[1][i]]));
    expect(first).toMatchObject({
      Reference: 'F-0001',
      Title: 'B-12 web over capacity <EN 1993-1-1 §6.2.6> & "check"',
      Kind: 'Web shear failure',
      Status: 'Open',
      Priority: 'High',
      Assignee: 'eng.one@example.com',
      'Due date': '2026-03-20',
      Labels: 'Level 2; Transfer beams',
      'Utilisation (%)': '112',
      'Created (UTC)': '2026-02-02 09:15:00',
      Comments: '2',
      'Last comment': 'eng.one@example.com: Looking into a thicker web plate.',
      'BCF topic GUID': 'ed3df4a9-3705-4406-a2a8-fb1b66196adc',
    });
    expect(first.Description).toBe(SAMPLE_FINDINGS[0].description);
  });

  it('carries the justification of an accepted finding with who accepted it and when', () => {
    const acceptance = { justification: 'Bearing stiffener pair shown on the fabrication drawings (invented scenario).', author: 'reviewer@example.com', date: '2026-02-06T11:00:00Z' };
    const [header, row] = readBack(findingsCsv([{ ...SAMPLE_FINDINGS[2], acceptance }], { cautions: false }));
    const cells = Object.fromEntries(header.map((column, i) => [column, row[i]]));
    expect(cells).toMatchObject({
      Status: 'Accepted',
      'Accepted because': acceptance.justification,
      'Accepted by': 'reviewer@example.com',
      'Accepted (UTC)': '2026-02-06 11:00:00',
    });
  });

  it('uses CRLF line ends and a UTF-8 byte order mark', () => {
    const csv = findingsCsv(SAMPLE_FINDINGS.slice(1, 2), { cautions: false });
    expect(csv.charCodeAt(0)).toBe(0xfeff);
    expect(csv.split('\r\n')).toHaveLength(3);
  });

  it.each(['=HYPERLINK("http://example.com","open")', '+1+2', '-3', '@SUM(A1)', '\tcmd', '\rcmd'])(
    'shows a cell starting like a formula (%j) as text',
    (title) => {
      const finding: FindingExport = { ...SAMPLE_FINDINGS[1], title, description: title };
      const [, row] = readBack(findingsCsv([finding], { cautions: false }));
      expect(row[1]).toBe(`'${title}`);
      expect(row[FINDINGS_CSV_COLUMNS.indexOf('Description')]).toBe(`'${title}`);
    },
  );

  it('only looks at the first character: text with = or - further in is kept as written', () => {
    const finding: FindingExport = { ...SAMPLE_FINDINGS[1], title: 'B-14 at 1-2 =112 %' };
    const [, row] = readBack(findingsCsv([finding], { cautions: false }));
    expect(row[1]).toBe('B-14 at 1-2 =112 %');
  });

  it('closes with the cautions after an empty row', () => {
    const rows = readBack(findingsCsv(SAMPLE_FINDINGS));
    expect(rows[rows.length - 1]).toEqual(['Cautions', REPORT_CAUTIONS_TEXT]);
    expect(rows[rows.length - 2]).toEqual(['']);
  });
});
