import { parseColumnMapping } from '../../../server/results/column-mapping';
import { columnMappingOf, mappingFieldsFrom, mappingProblems, resultSetNameFor } from './mapping-fields';

// Invented headers of a made-up analysis export.
const headers = ['Bar', 'Load combo', 'Station [m]', 'V2 [kN]', 'x1', 'y1', 'z1', 'x2', 'y2', 'z2'];

describe('mapping fields', () => {
  it('keeps the guessed columns the file has and leaves unknown ones empty', () => {
    const fields = mappingFieldsFrom({ memberColumn: 'Bar', combinationColumn: 'Combination', shearColumn: 'V2 [kN]', forceUnit: 'kN' }, headers);
    expect(fields).toMatchObject({ memberColumn: 'Bar', combinationColumn: '', shearColumn: 'V2 [kN]', forceUnit: 'kN', memberKeyKind: 'auto', useEnds: false });
    expect(mappingProblems(fields)).toEqual(['Choose the load combination column.']);
  });

  it('turns matching by end points on only when all six columns are known', () => {
    const ends = { x1: 'x1', y1: 'y1', z1: 'z1', x2: 'x2', y2: 'y2', z2: 'z2' };
    expect(mappingFieldsFrom({ endColumns: ends }, headers).useEnds).toBe(true);
    expect(mappingFieldsFrom({ endColumns: { ...ends, z2: 'Z end' } }, headers).useEnds).toBe(false);
  });

  it('asks for the length unit once a station or end column is mapped, and refuses a column used twice', () => {
    const fields = mappingFieldsFrom(
      { memberColumn: 'Bar', combinationColumn: 'Load combo', stationColumn: 'Station [m]', shearColumn: 'Bar', forceUnit: 'kN' },
      headers,
    );
    expect(mappingProblems(fields)).toEqual(['Choose the length unit of the station and coordinate columns.', 'Column "Bar" is chosen twice.']);
  });

  it('sends only what is mapped, in the server schema (server/results/column-mapping.ts)', () => {
    const fields = mappingFieldsFrom(
      { memberColumn: 'Bar', memberKeyKind: 'tag', combinationColumn: 'Load combo', shearColumn: 'V2 [kN]', forceUnit: 'kN', lengthUnit: 'm' },
      headers,
    );
    expect(mappingProblems(fields)).toEqual([]);
    // No station and no end points: the length unit is not needed and is left out.
    expect(columnMappingOf(fields)).toEqual({ memberColumn: 'Bar', memberKeyKind: 'tag', combinationColumn: 'Load combo', shearColumn: 'V2 [kN]', forceUnit: 'kN' });
    expect(columnMappingOf({ ...fields, stationColumn: 'Station [m]' })).toMatchObject({ stationColumn: 'Station [m]', lengthUnit: 'm' });
  });

  describe('minor-axis shear and moments', () => {
    // Invented headers: web shear Vz, shear across the flanges Vy, moments My and Mz (EN 1993 member axes).
    const forces = ['Bar', 'Load combo', 'Vz [kN]', 'Vy [kN]', 'My [kNm]', 'Mz [kNm]'];
    const detected = {
      memberColumn: 'Bar',
      combinationColumn: 'Load combo',
      shearColumn: 'Vz [kN]',
      minorShearColumn: 'Vy [kN]',
      majorMomentColumn: 'My [kNm]',
      minorMomentColumn: 'Mz [kNm]',
      forceUnit: 'kN',
      momentUnit: 'kNm',
    } as const;

    it('fills Vy, My, Mz and the moment unit from the detected mapping', () => {
      expect(mappingFieldsFrom(detected, forces)).toMatchObject({
        minorShearColumn: 'Vy [kN]',
        majorMomentColumn: 'My [kNm]',
        minorMomentColumn: 'Mz [kNm]',
        momentUnit: 'kNm',
      });
      // A column the file does not have is left empty, as for the other fields.
      expect(mappingFieldsFrom({ ...detected, minorMomentColumn: 'M2' }, forces).minorMomentColumn).toBe('');
    });

    it('asks for the moment unit once a moment column is mapped, and refuses a force column used twice', () => {
      const fields = mappingFieldsFrom({ ...detected, momentUnit: undefined }, forces);
      expect(mappingProblems(fields)).toEqual(['Choose the unit of the moment columns.']);
      expect(mappingProblems({ ...fields, majorMomentColumn: '', minorMomentColumn: '' })).toEqual([]);
      expect(mappingProblems({ ...fields, momentUnit: 'kNm', minorShearColumn: 'Vz [kN]' })).toEqual(['Column "Vz [kN]" is chosen twice.']);
    });

    it('sends Vy, My, Mz and the moment unit in a mapping the server schema accepts (server/results/column-mapping.ts)', () => {
      const fields = mappingFieldsFrom(detected, forces);
      expect(mappingProblems(fields)).toEqual([]);
      const mapping = columnMappingOf(fields);
      expect(mapping).toEqual({ ...detected, memberKeyKind: 'auto' });
      expect(parseColumnMapping(mapping)).toEqual(mapping);
      // Without moment columns the moment unit is not needed and is left out.
      const shearOnly = columnMappingOf({ ...fields, majorMomentColumn: '', minorMomentColumn: '' });
      expect(shearOnly).not.toHaveProperty('momentUnit');
      expect(shearOnly).toMatchObject({ minorShearColumn: 'Vy [kN]' });
      expect(parseColumnMapping(shearOnly)).toEqual(shearOnly);
    });
  });

  it('names a result set after its file', () => {
    expect(resultSetNameFor('shears-rev-C.xlsx')).toBe('shears-rev-C');
    expect(resultSetNameFor('.csv')).toBe('.csv');
  });
});
