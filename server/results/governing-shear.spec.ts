import { type GoverningTable, GoverningShearCollector, governingShearAt, governingShearsByMember } from './governing-shear';
import type { ResultRow } from './result-row';

const row = (r: number, memberKey: string, combination: string, shear_N: number, station_mm?: number): ResultRow => ({
  row: r,
  memberKey,
  combination,
  shear_N,
  station_mm,
});

const entriesOf = (table: GoverningTable) => Array.from(table.key, (_, entry) => governingShearAt(table, entry));

describe('GoverningShearCollector', () => {
  it('keeps the largest |V| over the stations of each member and combination, with its sign, station and row', () => {
    const collector = new GoverningShearCollector();
    collector.add([row(2, 'B-1', 'ULS-1', 120e3, 0), row(3, 'B-1', 'ULS-1', -180e3, 3000), row(4, 'B-1', 'ULS-2', 50e3, 0)]);
    collector.add([row(5, 'B-1', 'ULS-1', 179e3, 6000), row(6, 'B-2', 'ULS-1', -1e3, 0)]);
    const table = collector.table();
    expect(table.memberKeys).toEqual(['B-1', 'B-2']);
    expect(table.combinations).toEqual(['ULS-1', 'ULS-2']);
    expect(entriesOf(table)).toEqual([
      { combination: 'ULS-1', shear_N: -180e3, station_mm: 3000, row: 3, memberKey: 'B-1' },
      { combination: 'ULS-2', shear_N: 50e3, station_mm: 0, row: 4, memberKey: 'B-1' },
      { combination: 'ULS-1', shear_N: -1e3, station_mm: 0, row: 6, memberKey: 'B-2' },
    ]);
  });

  it('keeps the first of two equal magnitudes, whatever their signs', () => {
    const collector = new GoverningShearCollector();
    collector.add([row(2, 'B-1', 'ULS', 100, 0), row(3, 'B-1', 'ULS', -100, 1)]);
    expect(entriesOf(collector.table())[0].row).toBe(2);
  });

  it('leaves out the station of files without one', () => {
    const collector = new GoverningShearCollector();
    collector.add([row(2, 'B-1', 'ULS', 100)]);
    expect(entriesOf(collector.table())).toEqual([{ combination: 'ULS', shear_N: 100, row: 2, memberKey: 'B-1' }]);
  });
});

describe('governingShearsByMember', () => {
  it('gives each member the governing value per combination over all keys matched to it', () => {
    const collector = new GoverningShearCollector();
    collector.add([row(2, 'E1', 'ULS-1', 90e3), row(3, 'E2', 'ULS-1', -95e3), row(4, 'E2', 'ULS-2', 10e3), row(5, 'E9', 'ULS-1', 1)]);
    const byMember = governingShearsByMember(collector.table(), [
      { memberKey: 'E1', globalId: 'G1', method: 'geometry' },
      { memberKey: 'E2', globalId: 'G1', method: 'geometry' },
    ]);
    expect([...byMember.keys()]).toEqual(['G1']);
    expect(byMember.get('G1')?.map((shear) => [shear.combination, shear.shear_N, shear.memberKey])).toEqual([
      ['ULS-1', -95e3, 'E2'],
      ['ULS-2', 10e3, 'E2'],
    ]);
  });

  it('ignores matches whose key the file does not have', () => {
    const collector = new GoverningShearCollector();
    collector.add([row(2, 'E1', 'ULS-1', 90e3)]);
    expect(governingShearsByMember(collector.table(), [{ memberKey: 'E7', globalId: 'G7', method: 'tag' }]).size).toBe(0);
  });
});
