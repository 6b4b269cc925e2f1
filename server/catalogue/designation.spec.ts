import { canonicalNumber, designationIn, designationKey, keysOf } from './designation';

// Forms seen in exported IFC files and their canonical keys (common practice, no source: how the makers' tables and
// the exporters write designations).
describe('designationIn', () => {
  it.each([
    ['Beam:IPE270:341211', 'IPE270', 'IPE|270'],
    ['HEA360-S355', 'HEA360', 'HEA|360'],
    ['HE 360 A', 'HE 360 A', 'HEA|360'],
    ['HE360A', 'HE360A', 'HEA|360'],
    ['UB 305x165x40 S355', 'UB 305x165x40', 'UK-UB|305|165|40'],
    ['305x165x40UB', '305x165x40UB', 'UK-UB|305|165|40'],
    ['Steel - 310UC96.8', '310UC96.8', 'AU-UC|310|96.8'],
    ['UC 310x96.8', 'UC 310x96.8', 'AU-UC|310|96.8'],
    ['300PFC40.1', '300PFC40.1', 'AU-PFC|300|40.1'],
    ['150PFC17.7', '150PFC17.7', 'AU-PFC|150|17.7'],
    ['PFC 300x90x41', 'PFC 300x90x41', 'UK-PFC|300|90|41'],
    ['100x6.0SHS', '100x6.0SHS', 'RHS|100|100|6'],
    ['SHS 100x100x6', 'SHS 100x100x6', 'RHS|100|100|6'],
    ['100x50x4RHS', '100x50x4RHS', 'RHS|100|50|4'],
    ['CHS 168.3x5', 'CHS 168.3x5', 'CHS|168.3|5'],
    ['W12X26', 'W12X26', 'W|12|26'],
    ['W 12 x 26', 'W 12 x 26', 'W|12|26'],
    ['w12×26', 'w12×26', 'W|12|26'],
    ['W12*26', 'W12*26', 'W|12|26'],
    ['HSS6x6x3/8', 'HSS6x6x3/8', 'HSS|6|6|0.375'],
    ['HSS6X6X.375', 'HSS6X6X.375', 'HSS|6|6|0.375'],
    ['HSS10X3-1/2X3/16', 'HSS10X3-1/2X3/16', 'HSS|10|3.5|0.1875'],
    ['HSS6.625x0.280', 'HSS6.625x0.280', 'HSSR|6.625|0.28'],
    ['C15x33.9', 'C15x33.9', 'C|15|33.9'],
    ['MC12x31', 'MC12x31', 'MC|12|31'],
    ['UPN 200', 'UPN 200', 'UPN|200'],
    ['upe_200', 'upe_200', 'UPE|200'],
    ['IPN 200', 'IPN 200', 'IPN|200'],
    ['HD 320x158', 'HD 320x158', 'HD|320|158'],
    ['1200WB455', '1200WB455', 'AU-WB|1200|455'],
  ])('finds %s', (text, found, key) => {
    expect(designationIn(text)).toMatchObject({ text: found, key });
  });

  it.each([
    'U200', // UPN 200 or UPE 200: not guessed
    'IPE270A', // IPE A 270 is a lighter section
    'IPE 270 A',
    'HE360AA', // HE AA is another series
    'HEAA360',
    'XIPE270', // glued to other letters
    'PL-GIRDER-7',
    'S355',
    'Beam 27',
    '',
  ])('finds nothing in %s', (text) => {
    expect(designationIn(text)).toBeNull();
  });

  it('keeps every digit: 96.8 and 97 are different masses, 6.0 and 6 the same wall', () => {
    expect(designationIn('310UC97')!.key).not.toBe(designationIn('310UC96.8')!.key);
    expect(designationIn('310UC96.85')!.key).toBe('AU-UC|310|96.85');
    expect(canonicalNumber('6.0')).toBe('6');
    expect(canonicalNumber('.375')).toBe(canonicalNumber('3/8'));
    expect(canonicalNumber('0')).toBeNull();
  });

  it.each([
    // Size first, family last, wall in one decimal: the AS/NZS makers' form (common practice, no source).
    ['100x6.0SHS', 'as-nzs'],
    ['100x50x4.0RHS', 'as-nzs'],
    ['168.3x7.1CHS', 'as-nzs'],
    ['100x100x6.0 SHS', 'as-nzs'],
    // Written so in every region, or without the one-decimal wall: no form kept.
    ['SHS 100x100x6', undefined],
    ['SHS 100x100x6.0', undefined],
    ['CHS 168.3x7.1', undefined],
    ['100x100x6SHS', undefined],
    ['100x6.05SHS', undefined],
    ['310UC96.8', undefined],
  ])('keeps the naming form of %s (%s)', (text, form) => {
    expect(designationIn(text)?.form).toBe(form);
  });

  it('reads a whole name as a designation only when the name is nothing else', () => {
    expect(designationKey('IPE 270')).toBe('IPE|270');
    expect(designationKey('Beam:IPE270')).toBeNull();
  });

  it('lets an AS/NZS PFC be found by its depth alone', () => {
    expect(keysOf('AU-PFC|300|40.1')).toEqual(['AU-PFC|300|40.1', 'AU-PFC|300']);
    expect(keysOf('AU-UC|310|96.8')).toEqual(['AU-UC|310|96.8']);
  });
});
