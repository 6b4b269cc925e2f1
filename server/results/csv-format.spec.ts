import { detectEncoding, firstRecordIsHeader, sniffCsvFormat, sniffDelimiter } from './csv-format';

describe('sniffDelimiter', () => {
  it.each([
    [',', 'member,combination,shear\nB1,ULS-1,12.5\nB2,ULS-1,-3\n'],
    [';', 'member;combination;shear\nB1;ULS-1;12.5\nB2;ULS-1;-3\n'],
    ['\t', 'member\tcombination\tshear\nB1\tULS-1\t12.5\nB2\tULS-1\t-3\n'],
    ['|', 'member|combination|shear\nB1|ULS-1|12.5\nB2|ULS-1|-3\n'],
  ])('finds %j', (delimiter, text) => {
    expect(sniffDelimiter(text)).toBe(delimiter);
  });

  it('is not fooled by decimal commas in a semicolon file', () => {
    const text = 'member;combination;station;shear\nB1;ULS-1;0,5;12,5\nB1;ULS-2;1,5;-3,25\nB2;ULS-1;0;7,5\n';
    expect(sniffDelimiter(text)).toBe(';');
  });

  it('is not fooled by commas inside quoted names', () => {
    const text = 'member,combination,shear\n"Beam, grid A",ULS-1,12.5\n"Beam, grid B",ULS-1,-3\n';
    expect(sniffDelimiter(text)).toBe(',');
  });

  it('still finds the format when an unclosed quote breaks the sample', () => {
    expect(sniffCsvFormat('member;combination;shear\nB1;"ULS;1,5\nB2;ULS;2,5\n', true)).toEqual({
      delimiter: ';',
      decimalSeparator: ',',
      hasHeaderRow: true,
    });
  });

  it('falls back to a comma for a single column', () => {
    expect(sniffDelimiter('member\nB1\nB2\n')).toBe(',');
  });
});

describe('sniffCsvFormat', () => {
  it('reads decimal commas where the delimiter is a semicolon', () => {
    const format = sniffCsvFormat('member;combination;shear\nB1;ULS-1;12,5\nB2;ULS-1;-3,0\n', true);
    expect(format).toEqual({ delimiter: ';', decimalSeparator: ',', hasHeaderRow: true });
  });

  it('keeps decimal points in a semicolon file that uses them', () => {
    const format = sniffCsvFormat('member;combination;shear\nB1;ULS-1;12.5\nB2;ULS-1;-3.0\n', true);
    expect(format.decimalSeparator).toBe('.');
  });

  it('never reads decimal commas in a comma-delimited file', () => {
    expect(sniffCsvFormat('member,combination,shear\nB1,ULS-1,"12,5"\n', true).decimalSeparator).toBe('.');
  });

  it('ignores a last line cut off by the sample size', () => {
    const sample = 'member;combination;shear\nB1;ULS-1;12,5\nB2;ULS-1;-3,25\nB3;UL';
    expect(sniffCsvFormat(sample, false)).toEqual({ delimiter: ';', decimalSeparator: ',', hasHeaderRow: true });
  });

  it('tells a file without a header row', () => {
    expect(sniffCsvFormat('B1,ULS-1,12.5\nB2,ULS-1,-3\n', true).hasHeaderRow).toBe(false);
  });
});

describe('firstRecordIsHeader', () => {
  it('takes a first record without numbers as the header when data rows have numbers', () => {
    expect(firstRecordIsHeader([['member', 'shear'], ['B1', '3']])).toBe(true);
  });

  it('does not when the first record holds a number', () => {
    expect(firstRecordIsHeader([['B1', '3'], ['B2', '4']])).toBe(false);
  });

  it('does when it is the only record (a header without rows)', () => {
    expect(firstRecordIsHeader([['member', 'shear']])).toBe(true);
  });

  it('does when no record holds a number (all text cannot tell, and exports usually have a header)', () => {
    expect(firstRecordIsHeader([['member', 'shear'], ['B1', 'n/a']])).toBe(true);
  });
});

describe('detectEncoding', () => {
  it('reads UTF-8 with and without a byte-order mark', () => {
    expect(detectEncoding(Buffer.from('member,shear\n'))).toBe('utf8');
    expect(detectEncoding(Buffer.from('\uFEFFmember,shear\n'))).toBe('utf8');
  });

  it('reads UTF-16 little-endian by its byte-order mark (the spreadsheet "Unicode text" export)', () => {
    expect(detectEncoding(Buffer.from('\uFEFFmember\tshear\n', 'utf16le'))).toBe('utf16le');
  });

  it('refuses big-endian UTF-16 with a clear message', () => {
    expect(() => detectEncoding(Buffer.from([0xfe, 0xff, 0, 0x6d]))).toThrow(/big-endian UTF-16/);
  });

  it('refuses binary content', () => {
    expect(() => detectEncoding(Buffer.from([0x6d, 0, 1, 2, 3]))).toThrow(
      expect.objectContaining({ name: 'ResultsFileError', code: 'unsupported_format' }),
    );
  });
});
