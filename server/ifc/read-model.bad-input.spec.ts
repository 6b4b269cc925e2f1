/**
 * Bad input gets a clear error (IfcReadError with a code) or, for a member that cannot be read, a flagged record with
 * its reason — never a crash, and never a half-written .glb.
 */
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { generateFrame } from '../../test/generator/generate-frame';
import { IfcReadError } from './ifc-read-error';
import { readModel } from './read-model';

const bytes = (text: string): Uint8Array => new TextEncoder().encode(text);
const frame = (): string => generateFrame({ members: 100, schema: 'IFC4', unit: 'mm' });

async function readError(source: Uint8Array | string): Promise<IfcReadError> {
  try {
    await readModel(source, { glb: 'none' });
  } catch (error) {
    if (error instanceof IfcReadError) return error;
    throw error;
  }
  throw new Error('expected readModel to fail');
}

describe('readModel with a bad file', () => {
  let dir: string;
  beforeAll(() => {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'taulens-bad-ifc-'));
  });
  afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

  it('refuses an empty file, given as bytes or as a path', async () => {
    expect(await readError(new Uint8Array())).toMatchObject({ code: 'empty-file' });
    const empty = path.join(dir, 'empty.ifc');
    fs.writeFileSync(empty, '');
    expect(await readError(empty)).toMatchObject({ code: 'empty-file' });
  });

  it('refuses a file that is not STEP', async () => {
    expect(await readError(bytes('Name;Profile;Grade\nB1;IPE 300;S355\n'))).toMatchObject({ code: 'not-step' });
  });

  it('refuses a truncated file, and writes no glb', async () => {
    const text = frame();
    const glb = path.join(dir, 'truncated.glb');
    await expect(readModel(bytes(text.slice(0, text.length / 2)), { glb: { path: glb } })).rejects.toMatchObject({ code: 'truncated' });
    expect(fs.existsSync(glb)).toBe(false);
  });

  it('refuses an unknown schema', async () => {
    const error = await readError(bytes(frame().replace("FILE_SCHEMA(('IFC4'))", "FILE_SCHEMA(('IFC5'))")));
    expect(error).toMatchObject({ code: 'unknown-schema' });
    expect(error.message).toContain('"IFC5"');
  });

  it('refuses a model without a length unit instead of guessing one', async () => {
    const withoutLength = frame().replace(/#(\d+)= IFCSIUNIT\(\*,\.LENGTHUNIT\.,\.MILLI\.,\.METRE\.\);/, '#$1= IFCSIUNIT(*,.AREAUNIT.,$,.SQUARE_METRE.);');
    const error = await readError(bytes(withoutLength));
    expect(error.code).toBe('no-length-unit');
    expect(error.message).toMatch(/no length unit/);
  });

  it('refuses a conversion-based length unit without a factor', async () => {
    const inch = generateFrame({ members: 100, schema: 'IFC2X3', unit: 'inch' }).replace(
      /IFCCONVERSIONBASEDUNIT\((#\d+),\.LENGTHUNIT\.,'INCH',#\d+\)/,
      "IFCCONVERSIONBASEDUNIT($1,.LENGTHUNIT.,'INCH',$)",
    );
    expect(await readError(bytes(inch))).toMatchObject({ code: 'no-length-unit', message: expect.stringContaining('"INCH"') });
  });
});

describe('readModel with members that cannot be read', () => {
  it('flags zero and negative profile dimensions and a member without representation, and reads the rest', async () => {
    const result = await readModel(bytes(generateFrame({ members: 100, schema: 'IFC4', unit: 'mm', defects: true })));
    const byName = (name: string) => result.members.find((m) => m.name === name)!;
    expect(byName('DEFECT zero-web')).toMatchObject({
      status: 'flagged',
      profile: null,
      section: null,
      flags: ['invalid-profile'],
      reason: "The profile 'IPE400 zero web' (IfcIShapeProfileDef) is not a valid I-section: webThickness_mm: must be greater than 0 mm, got 0.",
    });
    expect(byName('DEFECT negative-flange')).toMatchObject({ status: 'flagged', flags: ['invalid-profile'], reason: expect.stringContaining('must be greater than 0 mm, got -12.7') });
    expect(byName('DEFECT no-representation')).toMatchObject({
      status: 'flagged',
      length_mm: null,
      axis: null,
      flags: expect.arrayContaining(['no-representation']),
      reason: 'The member has no shape representation, so it has no axis, length or geometry.',
    });
    // The two braces (a tube and an angle) are read for checking like the I-sections.
    expect(result.model.counts).toMatchObject({ members: 100, flagged: 3, notApplicable: 0, ok: 97 });
    expect(result.glb!.byteLength).toBeGreaterThan(0);
  });

  it('flags a member whose representation points at a line that is not in the file', async () => {
    const text = frame().replace(/(IFCCOLUMN\('[^']+',#\d+,'C1',\$,'[^']+',#\d+,)#\d+/, '$1#9999999');
    const result = await readModel(bytes(text), { glb: 'none' });
    const column = result.members.find((m) => m.name === 'C1')!;
    expect(column).toMatchObject({
      status: 'flagged',
      flags: expect.arrayContaining(['no-representation']),
      reason: 'The member refers to representation #9999999, which is not in the file, so it has no axis, length or geometry.',
    });
    expect(result.members.filter((m) => m.status === 'ok')).toHaveLength(99);
  });
});
