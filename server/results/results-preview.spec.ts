import { fixturePath, tempFiles } from '../../test/fixtures/results/result-files';
import { previewResultsFile } from './results-preview';
import { ResultsFileError } from './results-file-error';

const files = tempFiles();
afterAll(() => files.remove());

describe('previewResultsFile', () => {
  it('shows the sniffed format, the header, the first rows as text and a guessed mapping', async () => {
    const preview = await previewResultsFile(fixturePath('semicolon-decimal-comma.csv'));
    expect(preview).toMatchObject({
      kind: 'csv',
      csv: { delimiter: ';', decimalSeparator: ',', encoding: 'utf8', hasHeaderRow: true },
      headerRow: 1,
      headers: ['Element', 'Load case', 'Pos [m]', 'V [kN]'],
      rows: [
        { row: 2, cells: ['B-104', 'ULS-1', '0', '-152,5'] },
        { row: 3, cells: ['B-104', 'ULS-1', '1,5', '12,25'] },
        { row: 4, cells: ['B-105', 'ULS-1', '0', '48'] },
      ],
      guess: { mapping: { memberColumn: 'Element', shearColumn: 'V [kN]', forceUnit: 'kN', lengthUnit: 'm' }, missing: [] },
    });
  });

  it('stops after the row limit, whatever the file size', async () => {
    const lines = ['member,combination,shear', ...Array.from({ length: 5000 }, (_, i) => `B-${i},ULS,${i}`)];
    const preview = await previewResultsFile(files.write('long.csv', lines.join('\n')), { rowLimit: 3 });
    expect(preview.rows.map((row) => row.row)).toEqual([2, 3, 4]);
  });

  it('names columns of a file without a header', async () => {
    const preview = await previewResultsFile(files.write('no-header.csv', 'B-1,ULS,12.5\nB-2,ULS,3\n'));
    expect(preview.headerRow).toBeNull();
    expect(preview.headers).toEqual(['Column 1', 'Column 2', 'Column 3']);
    expect(preview.rows[0]).toEqual({ row: 1, cells: ['B-1', 'ULS', '12.5'] });
  });

  it('lets the caller override the sniffed format', async () => {
    const preview = await previewResultsFile(files.write('override.csv', 'a;b,c\n1;2,3\n'), { csv: { delimiter: ';', decimalSeparator: '.' } });
    expect(preview.headers).toEqual(['a', 'b,c']);
  });

  it('previews a workbook sheet, and asks which one when there are several', async () => {
    const single = await files.workbook('single.xlsx', { Results: [['member', 'combination', 'shear'], ['B-1', 'ULS', 12.5]] });
    expect(await previewResultsFile(single)).toMatchObject({
      kind: 'xlsx',
      sheets: ['Results'],
      sheet: 'Results',
      rows: [{ row: 2, cells: ['B-1', 'ULS', '12.5'] }],
    });
    const several = await files.workbook('several.xlsx', { A: [['x']], B: [['y']] });
    await expect(previewResultsFile(several)).rejects.toEqual(
      expect.objectContaining({ code: 'sheet_required', details: { sheets: ['A', 'B'] } }),
    );
    await expect(previewResultsFile(several, { sheet: 'B' })).resolves.toMatchObject({ sheet: 'B', headers: ['y'] });
  });

  it('refuses an empty file', async () => {
    await expect(previewResultsFile(files.write('empty.csv', ''))).rejects.toBeInstanceOf(ResultsFileError);
  });
});
