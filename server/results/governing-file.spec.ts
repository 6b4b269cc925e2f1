import { decodeGoverningTable, encodeGoverningTable } from './governing-file';
import { GoverningShearCollector, governingShearAt } from './governing-shear';

function sampleTable() {
  const collector = new GoverningShearCollector();
  collector.add([
    { row: 2, memberKey: 'B-1', combination: 'ULS-1', shear_N: -180e3, station_mm: 3000 },
    { row: 3, memberKey: 'B-1', combination: 'ULS-2', shear_N: 50.25e3 },
    { row: 4, memberKey: 'Träger 7', combination: 'ULS-1', shear_N: 1e-3, station_mm: 0 },
  ]);
  return collector.table();
}

const entries = (table: ReturnType<typeof sampleTable>) => Array.from(table.key, (_, i) => governingShearAt(table, i));

describe('governing-shear file', () => {
  it('reads back exactly what was written, keys in any script', () => {
    const table = sampleTable();
    const decoded = decodeGoverningTable(encodeGoverningTable(table));
    expect(decoded.memberKeys).toEqual(['B-1', 'Träger 7']);
    expect(decoded.combinations).toEqual(['ULS-1', 'ULS-2']);
    expect(entries(decoded)).toEqual(entries(table));
  });

  it('reads a copy that does not start on an 8-byte boundary', () => {
    const bytes = encodeGoverningTable(sampleTable());
    const shifted = Buffer.alloc(bytes.length + 1);
    bytes.copy(shifted, 1);
    expect(entries(decodeGoverningTable(shifted.subarray(1)))).toEqual(entries(sampleTable()));
  });

  it('refuses a foreign or truncated file', () => {
    const bytes = encodeGoverningTable(sampleTable());
    expect(() => decodeGoverningTable(Buffer.from('member,combination,shear\n'))).toThrow('not a governing-shear file');
    expect(() => decodeGoverningTable(bytes.subarray(0, bytes.length - 4))).toThrow('truncated');
  });

  it('stores an empty table', () => {
    const decoded = decodeGoverningTable(encodeGoverningTable(new GoverningShearCollector().table()));
    expect(decoded.key.length).toBe(0);
    expect(decoded.memberKeys).toEqual([]);
  });
});
