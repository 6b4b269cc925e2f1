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

  it('stores both axes, the moments and the sheets (version 2, its columns listed in the header)', () => {
    const collector = new GoverningShearCollector();
    collector.add([
      { row: 2, sheet: 1, memberKey: 'B-1', combination: 'CO1', station_mm: 0, shear_N: -90e3, minorShear_N: 4e3, majorMoment_Nmm: -1e6, minorMoment_Nmm: 2e6 },
      { row: 3, sheet: 0, memberKey: 'B-1', combination: 'CO1', station_mm: 2500, shear_N: 5e3, majorMoment_Nmm: 120e6 },
    ]);
    const table = collector.table(['Front', 'Back']);
    const bytes = encodeGoverningTable(table);
    expect(bytes.readUInt32LE(4)).toBe(2);
    const decoded = decodeGoverningTable(bytes);
    expect(decoded.sheets).toEqual(['Front', 'Back']);
    expect(entries(decoded)).toEqual(entries(table));
    expect(entries(decoded)[0]).toMatchObject({ sheet: 'Back', majorMoment_Nmm: -1e6, minor: { shear_N: 4e3, moment_Nmm: 2e6 }, majorMomentPeak: { moment_Nmm: 120e6, station_mm: 2500 } });
  });

  it('still reads a version 1 file, as Vz only', () => {
    // Version 1 layout written by hand: header, JSON padded to 8 bytes, shear_N, station_mm, key, combination, row.
    const json = Buffer.from(JSON.stringify({ memberKeys: ['B-1'], combinations: ['ULS-1'] }), 'utf8');
    const padded = Math.ceil(json.length / 8) * 8;
    const file = Buffer.alloc(16 + padded + 28);
    file.writeUInt32LE(0x56474c54, 0);
    file.writeUInt32LE(1, 4);
    file.writeUInt32LE(1, 8);
    file.writeUInt32LE(json.length, 12);
    json.copy(file, 16);
    file.writeDoubleLE(-180e3, 16 + padded);
    file.writeDoubleLE(3000, 24 + padded);
    file.writeUInt32LE(0, 32 + padded);
    file.writeUInt32LE(0, 36 + padded);
    file.writeUInt32LE(7, 40 + padded);
    const decoded = decodeGoverningTable(file);
    expect(decoded.minorShear_N).toBeUndefined();
    expect(entries(decoded)).toEqual([{ combination: 'ULS-1', shear_N: -180e3, station_mm: 3000, row: 7, memberKey: 'B-1' }]);
  });
});
