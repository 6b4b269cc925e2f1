import * as fs from 'node:fs';
import { buildingSmartSample } from '../../test/fixtures/ifc/buildingsmart-samples';
import { IfcReadError } from './ifc-read-error';
import { decodeStepString, readStepHeader } from './step-header';

const SAMPLE = buildingSmartSample('column-extruded-solid.ifc');

function check(text: string | Uint8Array): ReturnType<typeof readStepHeader> {
  const bytes = typeof text === 'string' ? new TextEncoder().encode(text) : text;
  return readStepHeader(bytes.subarray(0, 256 * 1024), bytes.subarray(Math.max(0, bytes.length - 4096)), bytes.length);
}

function failure(text: string | Uint8Array): IfcReadError {
  try {
    check(text);
  } catch (error) {
    if (error instanceof IfcReadError) return error;
    throw error;
  }
  throw new Error('expected an IfcReadError');
}

const minimal = (schema: string, tail = 'ENDSEC;\nEND-ISO-10303-21;\n'): string =>
  `ISO-10303-21;\nHEADER;\nFILE_DESCRIPTION((''),'2;1');\nFILE_NAME('frame.ifc','',(''),(''),'','Author tool 7','');\nFILE_SCHEMA(('${schema}'));\nENDSEC;\nDATA;\n#1=IFCPROJECT('0',$,$,$,$,$,$,$,$);\n${tail}`;

describe('readStepHeader', () => {
  it('reads the buildingSMART sample header (ISO 10303-21 header section, IFC4 schema)', () => {
    const header = check(fs.readFileSync(SAMPLE));
    // Source: the sample's own header (buildingSMART sample, CC BY 4.0; test/fixtures/ifc/buildingsmart/SOURCE.md).
    expect(header).toEqual({ fileSchema: 'IFC4', schema: 'IFC4', fileName: undefined, application: 'ggIFC - Exporter by Geometry Gym Pty Ltd' });
  });

  it.each([
    ['IFC2X3', 'IFC2X3'],
    ['IFC4', 'IFC4'],
    ['IFC4X3_ADD2', 'IFC4X3'],
    ['ifc4x3', 'IFC4X3'],
  ])('accepts schema %s as %s', (written, schema) => {
    expect(check(minimal(written)).schema).toBe(schema);
  });

  it.each(['IFC4X3_RC2', 'IFC4X3_RC4', 'IFC4X3_ADD1'])('reads the pre-release schema name %s as IFC4X3, and says so', (written) => {
    // Names of IFC 4.3 before its release (buildingSMART IFC 4.3 release candidates and addendum 1; common practice).
    expect(check(minimal(written))).toMatchObject({ fileSchema: written, schema: 'IFC4X3', readAs: true });
    expect(check(minimal('IFC4X3_ADD2'))).not.toHaveProperty('readAs');
  });

  it('takes the file name and originating system from FILE_NAME', () => {
    expect(check(minimal('IFC4'))).toMatchObject({ fileName: 'frame.ifc', application: 'Author tool 7' });
  });

  it('accepts a UTF-8 byte order mark and comments in the header', () => {
    const text = '\uFEFF' + minimal('IFC2X3').replace('FILE_SCHEMA', "/* FILE_SCHEMA(('IFC9')) */ FILE_SCHEMA");
    expect(check(text).schema).toBe('IFC2X3');
  });

  it('refuses an empty file', () => {
    expect(failure('')).toMatchObject({ code: 'empty-file', message: 'The file is empty (0 bytes).' });
    expect(failure('   \n\n').code).toBe('empty-file');
  });

  it('refuses a file that is not STEP, and names a zip for what it is', () => {
    expect(failure('<?xml version="1.0"?><ifcXML/>').message).toMatch(/not an IFC file.*ISO-10303-21;/);
    expect(failure(Uint8Array.of(0x50, 0x4b, 0x03, 0x04, 0, 0, 0, 0)).message).toMatch(/zip archive.*\.ifczip/);
  });

  it('refuses a truncated file', () => {
    const whole = minimal('IFC4');
    expect(failure(whole.slice(0, whole.length - 30))).toMatchObject({ code: 'truncated' });
    expect(failure(whole.slice(0, 40)).code).toBe('truncated');
  });

  it('refuses an unknown or missing schema and lists the supported ones', () => {
    const unknown = failure(minimal('IFC2X2_FINAL'));
    expect(unknown.code).toBe('unknown-schema');
    expect(unknown.message).toBe('The IFC schema "IFC2X2_FINAL" is not supported; supported schemas: IFC2X3, IFC4, IFC4X3, IFC4X3_ADD2.');
    expect(failure(minimal('')).code).toBe('unknown-schema');
  });

  it('refuses a file with no DATA section', () => {
    const text = "ISO-10303-21;\nHEADER;\nFILE_SCHEMA(('IFC4'));\nENDSEC;\nEND-ISO-10303-21;\n";
    expect(failure(text).message).toMatch(/no DATA section/);
  });
});

describe('decodeStepString', () => {
  // Encodings of ISO 10303-21 §6.4.3: '' for an apostrophe, \X2\…\X0\ UTF-16 code units, \S\ upper half, \X\ 8 bit.
  it.each([
    ["it''s", "it's"],
    ['St\\X2\\00FC\\X0\\tze', 'Stütze'],
    ['\\X2\\03C4\\X0\\ = VQ/It', 'τ = VQ/It'],
    ['Tr\\S\\dger', 'Träger'],
    ['\\X\\E9tage', 'étage'],
    ['a\\\\b', 'a\\b'],
  ])('decodes %s', (raw, text) => {
    expect(decodeStepString(raw)).toBe(text);
  });
});
