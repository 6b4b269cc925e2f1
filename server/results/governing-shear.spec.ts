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

describe('both shear axes and the moments', () => {
  const full = (r: number, memberKey: string, station_mm: number, forces: Partial<ResultRow>): ResultRow => ({ row: r, memberKey, combination: 'CO1', station_mm, shear_N: 0, ...forces });

  it('keeps the largest |Vz| with the My at its station, the largest |Vy| with its Mz, and the largest |My| and |Mz|', () => {
    const collector = new GoverningShearCollector();
    collector.add([
      full(2, 'B-1', 0, { shear_N: -90e3, minorShear_N: 4e3, majorMoment_Nmm: -10e6, minorMoment_Nmm: 1e6 }),
      full(3, 'B-1', 2500, { shear_N: 5e3, minorShear_N: -7e3, majorMoment_Nmm: 120e6, minorMoment_Nmm: -3e6 }),
      full(4, 'B-1', 5000, { shear_N: 80e3, minorShear_N: 1e3, majorMoment_Nmm: 0, minorMoment_Nmm: 0 }),
    ]);
    expect(entriesOf(collector.table())).toEqual([
      {
        combination: 'CO1',
        shear_N: -90e3,
        station_mm: 0,
        row: 2,
        memberKey: 'B-1',
        majorMoment_Nmm: -10e6,
        minor: { shear_N: -7e3, station_mm: 2500, moment_Nmm: -3e6, row: 3, memberKey: 'B-1' },
        majorMomentPeak: { moment_Nmm: 120e6, station_mm: 2500 },
        minorMomentPeak: { moment_Nmm: -3e6, station_mm: 2500 },
      },
    ]);
  });

  it('leaves out what the file does not give: no Vy is no minor axis, not a zero one; a larger Vz without My drops the earlier My', () => {
    const collector = new GoverningShearCollector();
    collector.add([full(2, 'B-1', 0, { shear_N: 10e3, majorMoment_Nmm: 5e6 }), full(3, 'B-1', 1000, { shear_N: 20e3 }), full(4, 'B-2', 0, { shear_N: 1e3, minorMoment_Nmm: 2e6 })]);
    const table = collector.table();
    expect(table.minorShear_N).toBeUndefined();
    expect(entriesOf(table)).toEqual([
      { combination: 'CO1', shear_N: 20e3, station_mm: 1000, row: 3, memberKey: 'B-1', majorMomentPeak: { moment_Nmm: 5e6, station_mm: 0 } },
      { combination: 'CO1', shear_N: 1e3, station_mm: 0, row: 4, memberKey: 'B-2', minorMomentPeak: { moment_Nmm: 2e6, station_mm: 0 } },
    ]);
  });

  it('names the worksheet of each row when several were read', () => {
    const collector = new GoverningShearCollector();
    collector.add([{ ...full(2, 'B-1', 0, { shear_N: 1e3 }), sheet: 0 }, { ...full(2, 'B-1', 5000, { shear_N: 3e3, minorShear_N: 1 }), sheet: 1 }]);
    const [entry] = entriesOf(collector.table(['Front', 'Back']));
    expect(entry).toMatchObject({ sheet: 'Back', minor: { sheet: 'Back', row: 2 } });
  });

  it('gives a member fed by several keys the largest value of each set, each from its own key', () => {
    const collector = new GoverningShearCollector();
    collector.add([
      full(2, 'E1', 0, { shear_N: 90e3, minorShear_N: 1e3, majorMoment_Nmm: 1e6 }),
      full(3, 'E2', 0, { shear_N: 10e3, minorShear_N: -8e3, majorMoment_Nmm: 50e6, minorMoment_Nmm: 2e6 }),
    ]);
    const byMember = governingShearsByMember(collector.table(), [
      { memberKey: 'E1', globalId: 'G1', method: 'geometry' },
      { memberKey: 'E2', globalId: 'G1', method: 'geometry' },
    ]);
    expect(byMember.get('G1')).toEqual([
      {
        combination: 'CO1',
        shear_N: 90e3,
        station_mm: 0,
        row: 2,
        memberKey: 'E1',
        majorMoment_Nmm: 1e6,
        minor: { shear_N: -8e3, station_mm: 0, moment_Nmm: 2e6, row: 3, memberKey: 'E2' },
        majorMomentPeak: { moment_Nmm: 50e6, station_mm: 0 },
        minorMomentPeak: { moment_Nmm: 2e6, station_mm: 0 },
      },
    ]);
  });
});
