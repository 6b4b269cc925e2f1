import { cellNumber, cellText, isBlankCell, looksNumeric, parseDecimal } from './cell-values';

describe('parseDecimal', () => {
  it.each([
    ['12.5', 12.5],
    ['-12.5', -12.5],
    ['+3', 3],
    ['.5', 0.5],
    ['1.', 1],
    ['1.5e3', 1500],
    ['-2E-2', -0.02],
  ])('reads %s with a decimal point', (text, value) => {
    expect(parseDecimal(text, '.')).toBe(value);
  });

  it.each([
    ['12,5', 12.5],
    ['-0,25', -0.25],
    [',5', 0.5],
    ['7', 7],
  ])('reads %s with a decimal comma', (text, value) => {
    expect(parseDecimal(text, ',')).toBe(value);
  });

  it.each(['', 'abc', '12 kN', '0x10', 'Infinity', 'NaN', '1,234.5', '1.234,5', '--1', '1e'])(
    'refuses %j rather than guess',
    (text) => {
      expect(parseDecimal(text, '.')).toBeNaN();
      expect(parseDecimal(text, ',')).toBeNaN();
    },
  );

  it('does not read a decimal comma where the point is expected, nor the reverse', () => {
    expect(parseDecimal('12,5', '.')).toBeNaN();
    expect(parseDecimal('12.5', ',')).toBeNaN();
  });
});

describe('cell helpers', () => {
  it('passes numbers from a workbook through, but not infinities', () => {
    expect(cellNumber(42.5, ',')).toBe(42.5);
    expect(cellNumber(Number.POSITIVE_INFINITY, '.')).toBeNaN();
  });

  it('trims text cells and treats blanks alike', () => {
    expect(cellText('  B1 ')).toBe('B1');
    expect(cellNumber(' 3.5 ', '.')).toBe(3.5);
    expect(isBlankCell(null)).toBe(true);
    expect(isBlankCell('  ')).toBe(true);
    expect(isBlankCell(0)).toBe(false);
  });

  it('recognises numbers with either separator when telling a header from data', () => {
    expect(looksNumeric('12,5')).toBe(true);
    expect(looksNumeric('12.5')).toBe(true);
    expect(looksNumeric('shear')).toBe(false);
  });
});
