import { guessMapping, parseColumnMapping, resolveColumns } from './column-mapping';
import { ResultsFileError } from './results-file-error';

function errorOf(action: () => unknown): ResultsFileError {
  try {
    action();
  } catch (error) {
    if (error instanceof ResultsFileError) return error;
    throw error;
  }
  throw new Error('expected a ResultsFileError');
}

describe('parseColumnMapping', () => {
  const minimal = { memberColumn: 'member', combinationColumn: 'combination', shearColumn: 'shear', forceUnit: 'kN' };

  it('accepts the default format and fills in the key kind', () => {
    expect(parseColumnMapping(minimal)).toEqual({ ...minimal, memberKeyKind: 'auto' });
  });

  it('names an unknown force unit and the allowed ones', () => {
    const error = errorOf(() => parseColumnMapping({ ...minimal, forceUnit: 'kNm' }));
    expect(error.code).toBe('invalid_mapping');
    expect(error.message).toContain('forceUnit: unknown force unit "kNm"; use one of N, kN, kip, lbf');
  });

  it('names an unknown length unit', () => {
    const error = errorOf(() => parseColumnMapping({ ...minimal, stationColumn: 'x', lengthUnit: 'cm' }));
    expect(error.message).toContain('lengthUnit: unknown length unit "cm"; use one of mm, m, in, ft');
  });

  it('requires the length unit once a station or coordinates are mapped', () => {
    const error = errorOf(() => parseColumnMapping({ ...minimal, stationColumn: 'station' }));
    expect(error.message).toContain('lengthUnit: choose the length unit');
  });

  it('refuses one column in two roles, whatever its case', () => {
    const error = errorOf(() => parseColumnMapping({ ...minimal, shearColumn: 'Member' }));
    expect(error.message).toContain("shearColumn: column 'Member' is already used for memberColumn");
  });

  it('refuses fields it does not know (a template from elsewhere)', () => {
    expect(() => parseColumnMapping({ ...minimal, momentColumn: 'M' })).toThrow(/momentColumn/);
  });
});

describe('resolveColumns', () => {
  const mapping = parseColumnMapping({
    memberColumn: 'Member',
    combinationColumn: 'combination',
    shearColumn: 'V [kN]',
    forceUnit: 'kN',
  });

  it('finds columns ignoring case and spacing', () => {
    expect(resolveColumns(mapping, [' member ', 'COMBINATION', 'v  [kN]'])).toEqual({
      member: 0,
      combination: 1,
      station: undefined,
      shear: 2,
      ends: undefined,
    });
  });

  it('names a missing column and lists those present', () => {
    const error = errorOf(() => resolveColumns(mapping, ['member', 'combination', 'shear']));
    expect(error.code).toBe('column_missing');
    expect(error.message).toBe("The file has no column 'V [kN]'. Its columns are: member, combination, shear. Adjust the column mapping.");
    expect(error.details.columns).toEqual(['member', 'combination', 'shear']);
  });

  it('refuses a header that appears twice', () => {
    expect(errorOf(() => resolveColumns(mapping, ['member', 'member', 'combination', 'V [kN]'])).code).toBe('column_ambiguous');
  });
});

describe('guessMapping', () => {
  it('reads the default format; the unit stays to be chosen', () => {
    expect(guessMapping(['member', 'combination', 'shear'])).toEqual({
      mapping: { memberColumn: 'member', combinationColumn: 'combination', shearColumn: 'shear', memberKeyKind: 'auto' },
      missing: ['forceUnit'],
    });
  });

  it('reads the optional station of the default format', () => {
    const { mapping, missing } = guessMapping(['member', 'combination', 'station', 'shear']);
    expect(mapping.stationColumn).toBe('station');
    expect(missing).toEqual(['forceUnit', 'lengthUnit']);
  });

  it('reads common names with units in brackets and suffixes', () => {
    const { mapping, missing } = guessMapping(['Element', 'Load case', 'Pos [m]', 'V [kN]']);
    expect(mapping).toMatchObject({
      memberColumn: 'Element',
      combinationColumn: 'Load case',
      stationColumn: 'Pos [m]',
      shearColumn: 'V [kN]',
      forceUnit: 'kN',
      lengthUnit: 'm',
    });
    expect(missing).toEqual([]);
    expect(guessMapping(['beam', 'combo', 'shear_kip']).mapping.forceUnit).toBe('kip');
    expect(guessMapping(['beam', 'combo', 'Vz (kips)']).mapping.forceUnit).toBe('kip');
  });

  it('hints the key kind from the member column name', () => {
    expect(guessMapping(['GlobalId', 'combination', 'shear']).mapping.memberKeyKind).toBe('globalId');
    expect(guessMapping(['Mark', 'combination', 'shear']).mapping.memberKeyKind).toBe('tag');
    expect(guessMapping(['Name', 'combination', 'shear']).mapping.memberKeyKind).toBe('name');
  });

  it('prefers the more specific name when several columns could be the member', () => {
    expect(guessMapping(['id', 'tag', 'combination', 'shear']).mapping.memberColumn).toBe('tag');
  });

  it('maps end coordinates only when all six are there', () => {
    const all = guessMapping(['member', 'combination', 'shear [N]', 'x1 [mm]', 'y1 [mm]', 'z1 [mm]', 'x2 [mm]', 'y2 [mm]', 'z2 [mm]']);
    expect(all.mapping.endColumns).toEqual({ x1: 'x1 [mm]', y1: 'y1 [mm]', z1: 'z1 [mm]', x2: 'x2 [mm]', y2: 'y2 [mm]', z2: 'z2 [mm]' });
    expect(all.mapping.lengthUnit).toBe('mm');
    expect(guessMapping(['member', 'combination', 'shear', 'x1', 'y1']).mapping.endColumns).toBeUndefined();
  });

  it('says what it could not find', () => {
    expect(guessMapping(['a', 'b', 'c']).missing).toEqual(['memberColumn', 'combinationColumn', 'shearColumn', 'forceUnit']);
  });

  it('leaves a unit it does not know unchosen', () => {
    expect(guessMapping(['member', 'combination', 'V [tf]']).missing).toContain('forceUnit');
  });
});
