/** `taulens members`, run as the package's bin would run it: a child process of server/cli/bin.js. */
import { spawnSync } from 'node:child_process';
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { WebIO } from '@gltf-transform/core';
import * as yazl from 'yazl';
import { writeFrameFile } from '../../test/generator/generate-frame';
import { REPORT_CAUTIONS_TEXT } from '../reports/report-cautions';

const BIN = path.resolve(__dirname, 'bin.js');

function taulens(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8', timeout: 60_000 });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

describe('taulens members', () => {
  let dir: string;
  let model: string;
  beforeAll(() => {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'taulens-cli-'));
    model = path.join(dir, 'frame-rev-C.ifc');
    writeFrameFile(model, { members: 100, schema: 'IFC2X3', unit: 'mm', defects: true });
  });
  afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

  it('prints the model and its members as JSON, with only the documented statuses', () => {
    const run = taulens('members', model, '--json');
    expect(run.status).toBe(0);
    const output = JSON.parse(run.stdout);
    expect(output.model).toMatchObject({ schema: 'IFC2X3', lengthUnit: 'millimetre', fileName: 'frame-rev-C.ifc', counts: { members: 100, ok: 97 } });
    expect(output.cautions).toBe(REPORT_CAUTIONS_TEXT);
    expect(new Set(output.members.map((m: { status: string }) => m.status))).toEqual(new Set(['ok', 'not-applicable']));
    const zeroWeb = output.members.find((m: { name: string }) => m.name === 'DEFECT zero-web');
    expect(zeroWeb).toMatchObject({ status: 'not-applicable', flags: ['needs-review', 'invalid-profile'], reason: expect.stringContaining('webThickness_mm') });
    const column = output.members.find((m: { tag: string }) => m.tag === 'T1');
    expect(Object.keys(column)).toEqual(expect.arrayContaining(['globalId', 'tag', 'name', 'ifcClass', 'storey', 'status', 'profile', 'section', 'material']));
    expect(column.profile).toMatchObject({ name: 'HE 300 B', family: 'I', source: 'ifc-profile', fabrication: 'rolled', depth_mm: 300, webThickness_mm: 11 });
    expect(Object.keys(column.section)).toEqual(['area_mm2', 'iMajor_mm4', 'qMax_mm3', 'neutralAxisFromBottom_mm']);
    expect(run.stderr).toBe('');
  });

  it('says for every member of a model of real-export patterns which family its section is and how it was found', () => {
    const realExports = path.join(dir, 'real-exports.ifc');
    writeFrameFile(realExports, { members: 120, schema: 'IFC4', unit: 'mm', patterns: 'real-exports' });
    const run = taulens('members', realExports, '--json');
    expect(run.status).toBe(0);
    const members: { status: string; reason?: string; profile: { family: string; source: string } | null }[] = JSON.parse(run.stdout).members;
    for (const member of members) {
      if (member.profile) expect(member.profile).toEqual(expect.objectContaining({ family: expect.any(String), source: expect.any(String) }));
      else expect(member.reason).toEqual(expect.any(String));
    }
    const sources = new Set(members.map((m) => m.profile?.source));
    const families = new Set(members.map((m) => m.profile?.family));
    for (const source of ['ifc-profile', 'outline', 'body-cut']) expect(sources).toContain(source);
    for (const family of ['I', 'channel', 'tee', 'angle', 'box', 'tube', 'plate', 'other']) expect(families).toContain(family);
  });

  it('prints a table with the reasons and the cautions without --json', () => {
    const run = taulens('members', model);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('GlobalId');
    expect(run.stdout).toContain('Not checked, and why:');
    expect(run.stdout).toContain('100 members: 97 ok, 0 not applicable, 3 need review.');
    expect(run.stdout.trimEnd().endsWith(REPORT_CAUTIONS_TEXT)).toBe(true);
  });

  it('writes the geometry with --glb and reads an .ifczip', async () => {
    const archive = path.join(dir, 'frame-rev-C.ifczip');
    await new Promise<void>((resolve) => {
      const zip = new yazl.ZipFile();
      zip.addFile(model, 'frame-rev-C.ifc');
      zip.end();
      zip.outputStream.pipe(fs.createWriteStream(archive)).on('close', () => resolve());
    });
    const glb = path.join(dir, 'frame.glb');
    const run = taulens('members', archive, '--json', '--glb', glb);
    expect(run.status).toBe(0);
    expect(JSON.parse(run.stdout).model.fileName).toBe('frame-rev-C.ifczip');
    const document = await new WebIO().readBinary(new Uint8Array(fs.readFileSync(glb)));
    expect(document.getRoot().listNodes().length).toBe(99 + 2);
  });

  it('exits with 2 and a plain message for a file that is not IFC', () => {
    const notIfc = path.join(dir, 'results.csv');
    fs.writeFileSync(notIfc, 'member;V_kN\nB1;120\n');
    const run = taulens('members', notIfc, '--json');
    expect(run).toEqual({ status: 2, stdout: '', stderr: 'taulens members: This is not an IFC file: an IFC (STEP) file starts with "ISO-10303-21;".\n' });
  });

  it('exits with 2 and the usage for bad arguments', () => {
    const unknown = taulens('members', model, '--format', 'xml');
    expect(unknown.status).toBe(2);
    expect(unknown.stderr).toMatch(/^taulens members: unknown option --format\n\nusage: taulens members/);
    expect(taulens('members').stderr).toContain('give the model file to read');
    expect(taulens('inspect', model)).toMatchObject({ status: 2, stderr: expect.stringContaining("unknown command 'inspect'") });
  });
});
