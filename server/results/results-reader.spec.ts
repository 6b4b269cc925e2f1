import fs from 'node:fs';
import v8 from 'node:v8';
import vm from 'node:vm';
import yazl from 'yazl';
import { fixturePath, SHEET_PER_COMBINATION, tempFiles } from '../../test/fixtures/results/result-files';
import { type ColumnMapping, guessMapping, parseColumnMapping } from './column-mapping';
import { type ReadResultsOptions, readResults } from './results-reader';
import { ResultsFileError } from './results-file-error';
import type { ResultRow } from './result-row';

const files = tempFiles();
afterAll(() => files.remove());

/** A full garbage collection, for measuring live memory (the flag can be set at run time; gc is then reachable in a new context). */
function collectGarbage(): void {
  v8.setFlagsFromString('--expose-gc');
  (vm.runInNewContext('gc') as () => void)();
}

const defaultMapping = (forceUnit = 'kN', extra: Record<string, unknown> = {}): ColumnMapping =>
  parseColumnMapping({ memberColumn: 'member', combinationColumn: 'combination', shearColumn: 'shear', forceUnit, ...extra });

async function readAll(path: string, mapping: ColumnMapping, options: ReadResultsOptions = {}) {
  const rows: ResultRow[] = [];
  const summary = await readResults(path, mapping, (batch) => void rows.push(...batch), options);
  return { rows, summary };
}

async function failureOf(promise: Promise<unknown>): Promise<ResultsFileError> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof ResultsFileError) return error;
    throw error;
  }
  throw new Error('expected a ResultsFileError');
}

describe('readResults: the default format', () => {
  it('reads member, combination, station and shear, with spreadsheet row numbers', async () => {
    const { rows, summary } = await readAll(fixturePath('default-format.csv'), defaultMapping('kN', { stationColumn: 'station', lengthUnit: 'mm' }));
    expect(rows[0]).toEqual({ row: 2, memberKey: '2Xq$9bTgT0uPq4u1dVc3Lk', combination: 'ULS-1', station_mm: 0, shear_N: -152500 });
    expect(rows[1]).toMatchObject({ row: 3, station_mm: 3000, shear_N: 148000 });
    expect(rows).toHaveLength(5);
    expect(summary).toMatchObject({
      kind: 'csv',
      csv: { delimiter: ',', decimalSeparator: '.', encoding: 'utf8', hasHeaderRow: true },
      headerRow: 1,
      rowCount: 5,
      combinations: ['ULS-1', 'ULS-2'],
    });
    expect(summary.memberKeys.map((key) => [key.memberKey, key.rows, key.firstRow])).toEqual([
      ['2Xq$9bTgT0uPq4u1dVc3Lk', 3, 2],
      ['B-104', 2, 5],
    ]);
  });

  it.each([
    ['semicolon-decimal-comma.csv', ';', ','],
    ['tab-delimited.tsv', '\t', '.'],
    ['pipe-delimited.csv', '|', '.'],
  ])('reads %s (delimiter %j, decimal %j)', async (name, delimiter, decimalSeparator) => {
    const mapping =
      name === 'semicolon-decimal-comma.csv'
        ? parseColumnMapping({ memberColumn: 'Element', combinationColumn: 'Load case', stationColumn: 'Pos [m]', shearColumn: 'V [kN]', forceUnit: 'kN', lengthUnit: 'm' })
        : defaultMapping();
    const { rows, summary } = await readAll(fixturePath(name), mapping);
    expect(summary.csv).toMatchObject({ delimiter, decimalSeparator });
    expect(rows.length).toBeGreaterThan(1);
    if (decimalSeparator === ',') {
      expect(rows[1]).toMatchObject({ station_mm: 1500, shear_N: 12250 });
    } else {
      expect(rows[0].shear_N).toBe(12500);
    }
  });

  it('reads UTF-16 text (the spreadsheet "Unicode text" export) and drops its byte-order mark', async () => {
    const path = files.write('utf16.txt', Buffer.from('\uFEFFmember\tcombination\tshear\nB-1\tULS\t2.5\n', 'utf16le'));
    const { rows, summary } = await readAll(path, defaultMapping());
    expect(summary.headers).toEqual(['member', 'combination', 'shear']);
    expect(rows).toEqual([{ row: 2, memberKey: 'B-1', combination: 'ULS', shear_N: 2500 }]);
  });

  it('drops a UTF-8 byte-order mark before a quoted header', async () => {
    const path = files.write('bom.csv', '\uFEFF"member","combination","shear"\nB-1,ULS,1\n');
    expect((await readAll(path, defaultMapping())).summary.headers[0]).toBe('member');
  });

  it('passes over blank lines but keeps counting them, as a spreadsheet numbers rows', async () => {
    const path = files.write('blank-lines.csv', 'member,combination,shear\nB-1,ULS,1\n\n,,\nB-2,ULS,2\n');
    const { rows, summary } = await readAll(path, defaultMapping());
    expect(rows.map((row) => row.row)).toEqual([2, 5]);
    expect(summary.blankRows).toBe(2);
  });

  it('keeps a quoted value with a line break as one row', async () => {
    const path = files.write('multiline.csv', 'member,combination,shear\n"B-1\nnorth",ULS,1\nB-2,ULS,2\n');
    const { rows } = await readAll(path, defaultMapping());
    expect(rows.map((row) => [row.row, row.memberKey])).toEqual([
      [2, 'B-1\nnorth'],
      [3, 'B-2'],
    ]);
  });
});

describe('readResults: units', () => {
  const file = () => files.write('units.csv', 'member,combination,station,shear\nB-1,ULS,1,1\n');

  // The pound-force is exactly 0.45359237 kg × 9.80665 m/s² = 4.4482216152605 N (NIST SP 811, Appendix B), so a kip is
  // exactly 4448.2216152605 N; the inch is exactly 25.4 mm and the foot 304.8 mm (International Yard and Pound Agreement, 1959).
  it.each([
    ['N', 1],
    ['kN', 1000],
    ['lbf', 4.4482216152605],
    ['kip', 4448.2216152605],
  ])('converts 1 %s to %s N', async (forceUnit, newtons) => {
    const { rows } = await readAll(file(), defaultMapping(forceUnit, { stationColumn: 'station', lengthUnit: 'mm' }));
    expect(rows[0].shear_N).toBeCloseTo(newtons, 9);
  });

  it.each([
    ['mm', 1],
    ['m', 1000],
    ['in', 25.4],
    ['ft', 304.8],
  ])('converts a station of 1 %s to %s mm', async (lengthUnit, millimetres) => {
    const { rows } = await readAll(file(), defaultMapping('kN', { stationColumn: 'station', lengthUnit }));
    expect(rows[0].station_mm).toBeCloseTo(millimetres, 9);
  });

  it('converts end coordinates for geometry matching', async () => {
    const path = files.write('ends.csv', 'member,combination,shear,x1,y1,z1,x2,y2,z2\nB-1,ULS,1,0,0,3,6,0,3\n');
    const ends = { x1: 'x1', y1: 'y1', z1: 'z1', x2: 'x2', y2: 'y2', z2: 'z2' };
    const { rows, summary } = await readAll(path, defaultMapping('kN', { endColumns: ends, lengthUnit: 'm' }));
    expect(rows[0]).toMatchObject({ end1_mm: [0, 0, 3000], end2_mm: [6000, 0, 3000] });
    expect(summary.memberKeys[0]).toMatchObject({ end1_mm: [0, 0, 3000], end2_mm: [6000, 0, 3000] });
  });
});

describe('readResults: layouts seen in practice, each read with the mapping guessed from its header', () => {
  /** The mapping the preview would propose, asserted complete and sure. */
  const guessed = (headers: string[], context = {}): ColumnMapping => {
    const guess = guessMapping(headers, context);
    expect(guess.missing).toEqual([]);
    expect(guess.unsure).toEqual([]);
    return parseColumnMapping(guess.mapping);
  };
  const combinationsOf = (rows: ResultRow[], member: string) => rows.filter((row) => row.memberKey === member).map((row) => [row.combination, row.station_mm, row.shear_N]);

  // 1 kN·m = 10^6 N·mm and 1 m = 1000 mm (SI definitions).
  it('a European export: semicolons, decimal commas, CRLF, three stations per member and combination, My in kNm', async () => {
    const path = fixturePath('european-export.csv');
    const { rows, summary } = await readAll(path, guessed(['Member', 'Load combination', 'x [m]', 'Vz [kN]', 'My [kNm]']));
    expect(summary).toMatchObject({ csv: { delimiter: ';', decimalSeparator: ',' }, rowCount: 18, combinations: ['CO1', 'CO2'] });
    expect(rows[0]).toEqual({ row: 2, memberKey: 'TopMid', combination: 'CO1', station_mm: 0, shear_N: -98400, majorMoment_Nmm: 0 });
    expect(rows[1]).toMatchObject({ row: 3, station_mm: 2500, shear_N: -4150, majorMoment_Nmm: 121.3e6 });
  });

  it('one row per member and station with a column per combination', async () => {
    const { rows, summary } = await readAll(fixturePath('wide-combinations.csv'), guessed(['Member', 'x [m]', 'Vz CO1 [kN]', 'Vz CO2 [kN]', 'Vz CO3 [kN]']));
    expect(summary).toMatchObject({ rowCount: 6, combinations: ['CO1', 'CO2', 'CO3'] });
    expect(combinationsOf(rows, 'TopMid').slice(0, 3)).toEqual([
      ['CO1', 0, -98400],
      ['CO2', 0, -143470],
      ['CO3', 0, -60000],
    ]);
  });

  it('a blank cell of a wide row is an error naming its row and column', async () => {
    const path = files.write('wide-blank.csv', 'Member,Vz CO1 [kN],Vz CO2 [kN]\nB-1,1,\n');
    const error = await failureOf(readAll(path, parseColumnMapping({ memberColumn: 'Member', combinationColumns: ['Vz CO1 [kN]', 'Vz CO2 [kN]'], forceUnit: 'kN' })));
    expect(error.details.issues).toEqual([{ row: 2, column: 'Vz CO2 [kN]', code: 'shear_missing', message: "Row 2 (column 'Vz CO2 [kN]'): the shear force is empty." }]);
  });

  it('envelope rows (max and min) instead of combinations, with both shear axes and both moments', async () => {
    const headers = ['Member', 'Envelope', 'Station [m]', 'Vz [kN]', 'Vy [kN]', 'My [kNm]', 'Mz [kNm]'];
    const { rows, summary } = await readAll(fixturePath('envelope-rows.tsv'), guessed(headers));
    expect(summary.combinations).toEqual(['envelope max', 'envelope min']);
    expect(rows[1]).toEqual({ row: 3, memberKey: 'TopMid', combination: 'envelope min', station_mm: 0, shear_N: -143470, minorShear_N: -2400, majorMoment_Nmm: 0, minorMoment_Nmm: -0.8e6 });
  });

  it('several sheets of one workbook, the sheet naming the combination', async () => {
    const path = await files.workbook('per-combination.xlsx', SHEET_PER_COMBINATION);
    const mapping = parseColumnMapping({ ...guessed(['Member', 'x [m]', 'Vz [kN]'], { severalSheets: true }), sheets: ['CO1', 'CO2'] });
    const { rows, summary } = await readAll(path, mapping);
    expect(summary).toMatchObject({ kind: 'xlsx', sheet: 'CO1, CO2', rowCount: 12, combinations: ['CO1', 'CO2'] });
    expect(combinationsOf(rows, 'TopMid')[3]).toEqual(['CO2', 0, -143470]);
  });

  it('several sheets: a problem names its sheet, a repeat names both', async () => {
    const path = await files.workbook('repeats.xlsx', {
      A: [['member', 'combination', 'shear'], ['B-1', 'ULS', 1]],
      B: [['member', 'combination', 'shear'], ['B-2', 'ULS', 'x'], ['B-1', 'ULS', 2]],
    });
    const error = await failureOf(readAll(path, defaultMapping('kN', { sheets: ['A', 'B'] })));
    expect(error.details.issues!.map((issue) => issue.message)).toEqual([
      "Sheet 'B', row 2 (column 'shear'): 'x' is not a number; expected a shear force in kN.",
      "Sheet 'B', row 3 repeats member 'B-1', combination 'ULS' of sheet 'A', row 2.",
    ]);
    expect(error.details.issues![0].sheet).toBe('B');
  });

  it('refuses the sheet name as the combination of a CSV file, and a sheet chosen outside the mapping', async () => {
    const csv = files.write('no-sheets.csv', 'member,shear\nB-1,1\n');
    const fromSheet = await failureOf(readAll(csv, parseColumnMapping({ memberColumn: 'member', shearColumn: 'shear', combinationFromSheet: true, forceUnit: 'kN' })));
    expect(fromSheet.message).toBe('The mapping takes the combination from the sheet name, but the file is CSV, which has no sheets. Map a combination column.');
    const path = await files.workbook('chosen.xlsx', SHEET_PER_COMBINATION);
    const outside = await failureOf(readAll(path, defaultMapping('kN', { sheets: ['CO1'] }), { sheet: 'CO2' }));
    expect(outside.message).toBe("The mapping reads the sheets CO1; the sheet chosen, 'CO2', is not among them.");
  });

  it('units in a second header row: read for the guess, never as data', async () => {
    const { rows, summary } = await readAll(fixturePath('units-row.csv'), guessed(['Member', 'Combination', 'Station', 'Shear', 'Moment'], { units: ['', '', 'm', 'kN', 'kNm'] }));
    expect(summary).toMatchObject({ headerRow: 1, unitsRow: 2, units: ['', '', 'm', 'kN', 'kNm'], rowCount: 6 });
    expect(rows[0]).toMatchObject({ row: 3, station_mm: 0, shear_N: -98400 });
  });

  it('a units row in a workbook', async () => {
    const path = await files.workbook('units.xlsx', { Forces: [['Member', 'Combination', 'x', 'Vz'], [null, null, 'm', 'kN'], ['B-1', 'ULS', 0.5, 12]] });
    const { rows, summary } = await readAll(path, guessed(['Member', 'Combination', 'x', 'Vz'], { units: ['', '', 'm', 'kN'] }));
    expect(summary.unitsRow).toBe(2);
    expect(rows).toEqual([{ row: 3, memberKey: 'B-1', combination: 'ULS', station_mm: 500, shear_N: 12000 }]);
  });
});

describe('readResults: bad rows', () => {
  it('reports each bad row with its number and column, and nothing reaches the sink after the first', async () => {
    const batches: ResultRow[][] = [];
    const error = await failureOf(readResults(fixturePath('bad-rows.csv'), defaultMapping(), (batch) => void batches.push(batch), { batchSize: 1 }));
    expect(error.code).toBe('rows_invalid');
    expect(error.details.issues).toEqual([
      { row: 3, column: 'member', code: 'member_missing', message: "Row 3 (column 'member'): the member key is empty." },
      { row: 4, column: 'combination', code: 'combination_missing', message: "Row 4 (column 'combination'): the load combination is empty." },
      { row: 5, column: 'shear', code: 'shear_missing', message: "Row 5 (column 'shear'): the shear force is empty." },
      { row: 6, column: 'shear', code: 'not_numeric', message: "Row 6 (column 'shear'): 'twelve' is not a number; expected a shear force in kN." },
      { row: 7, code: 'duplicate_row', message: "Row 7 repeats member 'B-104', combination 'ULS-1' of row 2." },
    ]);
    expect(error.details.stoppedEarly).toBe(false);
    expect(error.message).toMatch(/^The results cannot be imported: 5 problems found\. The first: Row 3/);
    expect(batches.flat().map((row) => row.row)).toEqual([2]);
  });

  it('treats the same member and combination at different stations as different rows, and at the same station as a duplicate', async () => {
    const path = files.write('stations.csv', 'member,combination,station,shear\nB-1,ULS,0,1\nB-1,ULS,3,2\nB-1,ULS,3,2\n');
    const error = await failureOf(readAll(path, defaultMapping('kN', { stationColumn: 'station', lengthUnit: 'm' })));
    expect(error.details.issues).toEqual([
      { row: 4, code: 'duplicate_row', message: "Row 4 repeats member 'B-1', combination 'ULS' at station 3000 mm of row 3." },
    ]);
  });

  it('reports a bad station and incomplete or moving end points', async () => {
    const path = files.write(
      'bad-geometry.csv',
      'member,combination,station,shear,x1,y1,z1,x2,y2,z2\nB-1,ULS,0,1,0,0,0,6,0,0\nB-1,ULS2,0,1,0,0,0,7,0,0\nB-2,ULS,mid,1,,,,,,\nB-3,ULS,0,1,0,0,0,6,0,\nB-4,ULS,0,1,0,0,0,6,0,x\n',
    );
    const ends = { x1: 'x1', y1: 'y1', z1: 'z1', x2: 'x2', y2: 'y2', z2: 'z2' };
    const error = await failureOf(readAll(path, defaultMapping('kN', { stationColumn: 'station', endColumns: ends, lengthUnit: 'm' })));
    expect(error.details.issues?.map((issue) => [issue.row, issue.code, issue.column])).toEqual([
      [3, 'coordinates_inconsistent', undefined],
      [4, 'not_numeric', 'station'],
      [5, 'coordinates_incomplete', undefined],
      [6, 'not_numeric', 'z2'],
    ]);
  });

  it('stops after the error limit and says where', async () => {
    const lines = ['member,combination,shear', ...Array.from({ length: 500 }, (_, i) => `B-${i},ULS,n/a`)];
    const path = files.write('many-bad.csv', lines.join('\n'));
    const error = await failureOf(readAll(path, defaultMapping(), { maxIssues: 10 }));
    expect(error.details.issues).toHaveLength(10);
    expect(error.details).toMatchObject({ stoppedEarly: true, lastRow: 11 });
    expect(error.message).toContain('Reading stopped at row 11 after 10 problems');
  });

  it('names the column a mapping expects but the file lacks', async () => {
    const mapping = parseColumnMapping({ memberColumn: 'member', combinationColumn: 'combination', shearColumn: 'Vz', forceUnit: 'kN' });
    const error = await failureOf(readAll(fixturePath('tab-delimited.tsv'), mapping));
    expect(error.code).toBe('column_missing');
    expect(error.message).toContain("has no column 'Vz'");
  });
});

describe('readResults: bad files', () => {
  it.each([
    ['an empty file', '', 'empty_file'],
    ['only blank lines', '\n \n\n', 'empty_file'],
    ['a header without rows', 'member,combination,shear\n', 'no_rows'],
  ])('refuses %s', async (_what, content, code) => {
    const error = await failureOf(readAll(files.write(`bad-${code}-${content.length}.csv`, content), defaultMapping()));
    expect(error.code).toBe(code);
  });

  it('refuses an unclosed quote with the line', async () => {
    const error = await failureOf(readAll(files.write('quote.csv', 'member,combination,shear\nB-1,"ULS,1\nB-2,ULS,2\n'), defaultMapping()));
    expect(error.code).toBe('unreadable_csv');
    expect(error.message).toMatch(/near line \d+: a quoted value is never closed/);
  });

  it('refuses an old-style .xls workbook, naming what to do', async () => {
    const xls = Buffer.concat([Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]), Buffer.alloc(504)]);
    const error = await failureOf(readAll(files.write('old.xls', xls), defaultMapping()));
    expect(error.code).toBe('unsupported_format');
    expect(error.message).toContain('Save it as .xlsx or CSV');
  });

  it('refuses a zip that is not a workbook', async () => {
    const zip = new yazl.ZipFile();
    zip.addBuffer(Buffer.from('not a workbook'), 'readme.txt');
    zip.end();
    const chunks: Buffer[] = [];
    for await (const chunk of zip.outputStream) chunks.push(chunk as Buffer);
    const error = await failureOf(readAll(files.write('other.zip', Buffer.concat(chunks)), defaultMapping()));
    expect(error.code).toBe('unreadable_xlsx');
    expect(error.message).toContain('it has no workbook part');
  });
});

describe('readResults: XLSX', () => {
  const header = ['member', 'combination', 'shear'];

  it('reads a workbook with one sheet, numeric cells as numbers and sheet row numbers', async () => {
    const path = await files.workbook('one.xlsx', {
      Shear: [header, ['B-1', 'ULS', 12.5], [], ['B-2', 'ULS', { formula: 'C2*2', result: 25 }], ['B-3', 'ULS', '7.5']],
    });
    const { rows, summary } = await readAll(path, defaultMapping());
    expect(summary).toMatchObject({ kind: 'xlsx', sheets: ['Shear'], sheet: 'Shear', headerRow: 1 });
    expect(rows.map((row) => [row.row, row.memberKey, row.shear_N])).toEqual([
      [2, 'B-1', 12500],
      [4, 'B-2', 25000],
      [5, 'B-3', 7500],
    ]);
  });

  it('asks which sheet when there are several, with their names', async () => {
    const path = await files.workbook('several.xlsx', { Notes: [['read me']], 'Shear ULS': [header, ['B-1', 'ULS', 1]] });
    const error = await failureOf(readAll(path, defaultMapping()));
    expect(error.code).toBe('sheet_required');
    expect(error.details.sheets).toEqual(['Notes', 'Shear ULS']);
    expect(error.message).toContain('Notes, Shear ULS');
  });

  it('reads the chosen sheet of several, and names the sheets when the choice is not there', async () => {
    const path = await files.workbook('chosen.xlsx', { Notes: [['read me']], 'Shear ULS': [header, ['B-1', 'ULS', 1]], Other: [header, ['X', 'Y', 9]] });
    const { rows } = await readAll(path, defaultMapping(), { sheet: 'shear uls' });
    expect(rows).toEqual([{ row: 2, memberKey: 'B-1', combination: 'ULS', shear_N: 1000 }]);
    const error = await failureOf(readAll(path, defaultMapping(), { sheet: 'Moments' }));
    expect(error.code).toBe('sheet_not_found');
    expect(error.details.sheets).toEqual(['Notes', 'Shear ULS', 'Other']);
  });

  it('reports bad cells of a sheet by their row', async () => {
    const path = await files.workbook('bad.xlsx', { Shear: [header, ['B-1', 'ULS', 'twelve'], ['B-2', 'ULS', { formula: 'C9/0' }]] });
    const error = await failureOf(readAll(path, defaultMapping()));
    expect(error.details.issues?.map((issue) => issue.message)).toEqual([
      "Row 2 (column 'shear'): 'twelve' is not a number; expected a shear force in kN.",
      "Row 3 (column 'shear'): '=C9/0' is not a number; expected a shear force in kN.",
    ]);
  });
});

describe('readResults: streaming', () => {
  it('streams a large file in bounded batches without holding its rows', async () => {
    const members = 10_000;
    const combinations = 40;
    const path = `${files.dir}/large.csv`;
    const out = fs.openSync(path, 'w');
    fs.writeSync(out, 'member,combination,shear\n');
    for (let m = 0; m < members; m++) {
      let block = '';
      for (let c = 0; c < combinations; c++) block += `B-${m},ULS-${c},${((m * 7 + c * 13) % 500) / 10}\n`;
      fs.writeSync(out, block);
    }
    fs.closeSync(out);

    const batchSize = 2000;
    let rows = 0;
    let largestBatch = 0;
    let peakLive = 0;
    let probes = 0;
    collectGarbage();
    const startLive = process.memoryUsage().heapUsed;
    const summary = await readResults(
      path,
      defaultMapping(),
      (batch) => {
        rows += batch.length;
        largestBatch = Math.max(largestBatch, batch.length);
        // Live memory (after a full collection) every 40 batches, so garbage not yet collected does not count.
        if ((rows / batchSize) % 40 === 0) {
          collectGarbage();
          probes++;
          peakLive = Math.max(peakLive, process.memoryUsage().heapUsed - startLive);
        }
      },
      { batchSize },
    );
    expect(rows).toBe(members * combinations);
    expect(summary.rowCount).toBe(members * combinations);
    expect(summary.memberKeys).toHaveLength(members);
    expect(largestBatch).toBe(batchSize);
    // Measured: a sink that keeps the rows makes 66 MB live by the last probe; streaming stays near 6 MB
    // (the key index and a batch or two).
    expect(probes).toBe(5);
    expect(peakLive).toBeLessThan(20 * 1024 * 1024);
  });
});
