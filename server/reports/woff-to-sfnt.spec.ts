import { readFileSync } from 'node:fs';
import path from 'node:path';
import { woffToSfnt } from './woff-to-sfnt';

const FONT = path.resolve(__dirname, '../../fonts/pdf/inter-latin-400-normal.woff');

describe('woffToSfnt', () => {
  const woff = readFileSync(FONT);
  const sfnt = woffToSfnt(woff);

  it('gives the size the WOFF header promises (totalSfntSize, WOFF 1.0 §3)', () => {
    expect(sfnt.length).toBe(woff.readUInt32BE(16));
  });

  it('writes the flavour and the table directory of the original font', () => {
    expect(sfnt.readUInt32BE(0)).toBe(woff.readUInt32BE(4));
    const numTables = woff.readUInt16BE(12);
    expect(sfnt.readUInt16BE(4)).toBe(numTables);
    // OpenType offset table: searchRange = 16 × 2^floor(log2 n), rangeShift = 16n − searchRange.
    expect(sfnt.readUInt16BE(6)).toBe(16 * 2 ** Math.floor(Math.log2(numTables)));
    expect(sfnt.readUInt16BE(10)).toBe(16 * numTables - sfnt.readUInt16BE(6));
    const tags = Array.from({ length: numTables }, (_, i) => sfnt.toString('latin1', 12 + 16 * i, 16 + 16 * i));
    expect(tags).toEqual(expect.arrayContaining(['cmap', 'glyf', 'head', 'hmtx', 'loca', 'name']));
    // The head table's magic number 0x5F0F3CF5 sits 12 bytes in (OpenType "head" table).
    const head = tags.indexOf('head');
    expect(sfnt.readUInt32BE(sfnt.readUInt32BE(12 + 16 * head + 8) + 12)).toBe(0x5f0f3cf5);
  });

  it('refuses anything that is not WOFF 1.0', () => {
    expect(() => woffToSfnt(Buffer.from('wOF2 not this one'))).toThrow('not a WOFF 1.0 font');
  });
});
