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

  it('needs a source of the combination and, unless one column per combination is mapped, a shear column', () => {
    const error = errorOf(() => parseColumnMapping({ memberColumn: 'member', forceUnit: 'kN' }));
    expect(error.message).toContain('combinationColumn: choose the load combination column (or an envelope column, one column per combination, or combinationFromSheet)');
    expect(error.message).toContain('shearColumn: choose the shear force column');
    expect(parseColumnMapping({ memberColumn: 'member', combinationColumns: ['CO1', 'CO2'], forceUnit: 'kN' }).combinationColumns).toEqual(['CO1', 'CO2']);
    expect(parseColumnMapping({ ...minimal, combinationColumn: undefined, envelopeColumn: 'Envelope' }).envelopeColumn).toBe('Envelope');
  });

  it('refuses a shear column beside one column per combination, and moments without their unit', () => {
    const wide = errorOf(() => parseColumnMapping({ memberColumn: 'member', combinationColumns: ['CO1'], shearColumn: 'V', forceUnit: 'kN' }));
    expect(wide.message).toContain('shearColumn: leave it out: with one column per combination, those columns hold the shear along the web');
    const moment = errorOf(() => parseColumnMapping({ ...minimal, majorMomentColumn: 'My' }));
    expect(moment.message).toContain('momentUnit: choose the unit of the moment columns');
    expect(errorOf(() => parseColumnMapping({ ...minimal, majorMomentColumn: 'My', momentUnit: 'tm' })).message).toContain(
      'momentUnit: unknown moment unit "tm"; use one of Nmm, Nm, kNm, kip-in, kip-ft, lbf-in, lbf-ft',
    );
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

  it('names the combination of each wide column without its unit and shear word, and refuses two columns of one name', () => {
    const wide = parseColumnMapping({ memberColumn: 'member', combinationColumns: ['Vz CO1 [kN]', 'CO2 V', 'ULS 3'], forceUnit: 'kN' });
    expect(resolveColumns(wide, ['member', 'Vz CO1 [kN]', 'CO2 V', 'ULS 3']).wide).toEqual({ columns: [1, 2, 3], combinations: ['CO1', 'CO2', 'ULS 3'] });
    const twice = parseColumnMapping({ memberColumn: 'member', combinationColumns: ['Vz CO1', 'CO1'], forceUnit: 'kN' });
    expect(errorOf(() => resolveColumns(twice, ['member', 'Vz CO1', 'CO1'])).message).toBe("The columns 'Vz CO1' and 'CO1' both name combination 'CO1'. Map only one of them.");
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
      unsure: [],
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

  it('reads the European export: station x [m], Vz and My with their units', () => {
    expect(guessMapping(['Member', 'Load combination', 'x [m]', 'Vz [kN]', 'My [kNm]'])).toEqual({
      mapping: {
        memberColumn: 'Member',
        combinationColumn: 'Load combination',
        stationColumn: 'x [m]',
        shearColumn: 'Vz [kN]',
        majorMomentColumn: 'My [kNm]',
        forceUnit: 'kN',
        momentUnit: 'kNm',
        lengthUnit: 'm',
        memberKeyKind: 'auto',
      },
      missing: [],
      unsure: [],
    });
  });

  it.each(['x', 'pos', 'position', 'station', 'dist', 'distance', 'location', 's'])('reads %j as the station', (name) => {
    expect(guessMapping(['member', 'combination', `${name} [mm]`, 'shear [N]']).mapping).toMatchObject({ stationColumn: `${name} [mm]`, lengthUnit: 'mm' });
  });

  it.each([
    ['Vz', 'shearColumn'],
    ['Fz', 'shearColumn'],
    ['Q', 'shearColumn'],
    ['Shear', 'shearColumn'],
    ['Vy', 'minorShearColumn'],
    ['Fy', 'minorShearColumn'],
    ['My', 'majorMomentColumn'],
    ['Mz', 'minorMomentColumn'],
  ])('reads %j as %s', (name, field) => {
    const headers = field === 'shearColumn' ? ['member', 'combination', name] : ['member', 'combination', 'shear force', name];
    const { mapping } = guessMapping(headers);
    expect(mapping[field as keyof typeof mapping]).toBe(name);
  });

  it('reads both axes and both moments, each with its unit, kN·m spelt any way', () => {
    const { mapping, missing, unsure } = guessMapping(['Bar', 'Combo', 'Vz (kN)', 'Vy (kN)', 'My (kN·m)', 'Mz (kN-m)']);
    expect(mapping).toMatchObject({ shearColumn: 'Vz (kN)', minorShearColumn: 'Vy (kN)', majorMomentColumn: 'My (kN·m)', minorMomentColumn: 'Mz (kN-m)', momentUnit: 'kNm' });
    expect(missing).toEqual([]);
    expect(unsure).toEqual([]);
  });

  it('takes a load case column as the combination, and asks when there are both', () => {
    expect(guessMapping(['member', 'Load case', 'V [kN]']).mapping.combinationColumn).toBe('Load case');
    expect(guessMapping(['member', 'Load case', 'Combination', 'V [kN]']).unsure).toEqual([
      { field: 'combinationColumn', columns: ['Combination', 'Load case'], why: 'each could be the load combination' },
    ]);
  });

  it('reads envelope rows: an envelope column instead of a combination', () => {
    const { mapping, missing } = guessMapping(['Member', 'Envelope', 'Station [m]', 'Vz [kN]']);
    expect(mapping).toMatchObject({ envelopeColumn: 'Envelope', stationColumn: 'Station [m]' });
    expect(mapping.combinationColumn).toBeUndefined();
    expect(missing).toEqual([]);
  });

  it('reads one column of shear per combination when the columns name the shear, and asks when they do not', () => {
    const sure = guessMapping(['Member', 'x [m]', 'Vz CO1 [kN]', 'Vz CO2 [kN]']);
    expect(sure).toMatchObject({ mapping: { combinationColumns: ['Vz CO1 [kN]', 'Vz CO2 [kN]'], forceUnit: 'kN', stationColumn: 'x [m]' }, missing: [], unsure: [] });
    const bare = guessMapping(['Member', 'x [m]', 'CO1', 'CO2']);
    expect(bare.mapping.combinationColumns).toEqual(['CO1', 'CO2']);
    expect(bare.unsure).toEqual([{ field: 'combinationColumns', columns: ['CO1', 'CO2'], why: expect.stringContaining('one column of shear along the web per combination') }]);
  });

  it('takes the combination from the sheet names when several sheets are read and no column gives it', () => {
    expect(guessMapping(['Member', 'x [m]', 'Vz [kN]'], { severalSheets: true })).toMatchObject({ mapping: { combinationFromSheet: true }, missing: [], unsure: [] });
  });

  it('reads the units from a units row under the header', () => {
    const { mapping, missing } = guessMapping(['Member', 'Combination', 'Station', 'Shear', 'Moment'], { units: ['', '', 'm', 'kN', 'kNm'] });
    expect(mapping).toMatchObject({ forceUnit: 'kN', lengthUnit: 'm', momentUnit: 'kNm', majorMomentColumn: 'Moment' });
    expect(missing).toEqual([]);
  });

  it('asks when two columns could be the web shear, and proposes axis 2 for numbered axes', () => {
    expect(guessMapping(['member', 'combination', 'Shear', 'Vz', 'V [kN]']).unsure).toEqual([
      { field: 'shearColumn', columns: ['Shear', 'V [kN]', 'Vz'], why: 'each could be the shear along the web' },
    ]);
    const numbered = guessMapping(['Member', 'Combination', 'V2 [kN]', 'V3 [kN]', 'M2 [kNm]', 'M3 [kNm]']);
    expect(numbered.mapping).toMatchObject({ memberColumn: 'Member', shearColumn: 'V2 [kN]', minorShearColumn: 'V3 [kN]', majorMomentColumn: 'M3 [kNm]', minorMomentColumn: 'M2 [kNm]' });
    expect(numbered.unsure.map((question) => question.field)).toEqual(['shearColumn']);
    expect(numbered.unsure[0].why).toContain('numbered local axes do not say which shear runs along the web');
  });

  it('asks when x may be a coordinate, and when the station is not in a length unit', () => {
    expect(guessMapping(['member', 'combination', 'x', 'y', 'z', 'V [kN]']).unsure[0]).toMatchObject({ field: 'stationColumn', columns: ['x'] });
    const force = guessMapping(['member', 'combination', 'x [kN]', 'V [kN]']);
    expect(force.unsure).toEqual([{ field: 'lengthUnit', columns: ['x [kN]'], why: "'x [kN]' is in kN, not a length unit" }]);
    expect(force.missing).toContain('lengthUnit');
  });
});
