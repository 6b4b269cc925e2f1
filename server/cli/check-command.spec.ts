/**
 * `taulens check`, spawned as a child process on a buildingSMART sample (test/fixtures/ifc/buildingsmart) and on
 * generated frames of our invented scenario. The child runs the TypeScript sources (as bin.js does when there is no
 * build), so the test sees this tree and not an older build in dist/.
 */
import { spawnSync } from 'node:child_process';
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import ExcelJS from 'exceljs';
import { schemaErrors, schemaForEntry } from '../../test/fixtures/bcf/bcf-schemas';
import { fixturePath, SHEET_PER_COMBINATION } from '../../test/fixtures/results/result-files';
import { buildingSmartSample } from '../../test/fixtures/ifc/buildingsmart-samples';
import { addAnalysisModel } from '../../test/generator/analysis-model-writer';
import { frameLayout } from '../../test/generator/frame-layout';
import { generateFrame, writeFrameFile } from '../../test/generator/generate-frame';
import { evaluateFamilyCheck, prepareFamilyCapacity } from '../engine/family-capacity';
import { fromNewtons } from '../engine/units';
import { type MemberProfile, sectionDimensionsOf } from '../ifc/model-read-result';
import { openArchive } from '../findings/bcf/bcf-archive-reader';
import { REPORT_CAUTIONS_TEXT } from '../reports/report-cautions';
import { dispatch } from './main';

const ROOT = path.resolve(__dirname, '../..');
const LAUNCH = `require('ts-node').register({ transpileOnly: true, project: ${JSON.stringify(path.join(ROOT, 'tsconfig.server.json'))} });
require(${JSON.stringify(path.join(__dirname, 'main.ts'))}).run(process.argv.slice(1));`;

const SPAWN_LIMIT_MS = 120_000;

function taulens(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, ['-e', LAUNCH, ...args], { cwd: ROOT, encoding: 'utf8', timeout: SPAWN_LIMIT_MS });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

// Each child compiles the sources with ts-node: seconds alone, past jest's 30 s when the whole suite loads the machine.
// A test spawns up to three children; spawnSync's own limit bounds each.
jest.setTimeout(3 * SPAWN_LIMIT_MS);

interface CheckedMember {
  globalId: string;
  tag: string | null;
  name: string | null;
  status: string;
  reason?: string;
  flags: string[];
  governing: PrintedCheck & { tauMax_MPa: number; tauAvgWeb_MPa: number } | null;
  checks: PrintedCheck[];
  profile: ({ name: string } & MemberProfile) | null;
}

interface PrintedCheck {
  axis: 'major' | 'minor';
  check: string;
  combination: string;
  station_m: number | null;
  VEd_kN: number;
  MEd_kNm: number | null;
  VRd_kN: number;
  utilisation: number;
}

describe('taulens check', () => {
  let dir: string;
  let frame: string;
  const write = (name: string, content: string | Buffer): string => {
    const file = path.join(dir, name);
    fs.writeFileSync(file, content);
    return file;
  };

  beforeAll(() => {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'taulens-check-cli-'));
    frame = path.join(dir, 'canteen-frame.ifc');
    writeFrameFile(frame, { members: 40, unit: 'inch', fileName: 'canteen-frame.ifc' });
  });
  afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

  // EN 1993-1-1 §6.2.6 (6.18) with the sample's IPE200 (EN 10365 dimensions 200/100/5.6/8.5/12, S355JR):
  // A = 2·b·tf + (h − 2tf)·tw + (4 − π)·r² = 2848.4 mm² and Av = A − 2b·tf + (tw + 2r)·tf = 1400.0 mm² (section
  // tables list 28.48 cm² and 14.00 cm², from memory), above η·hw·tw = 1229.8 mm²; fy = 355 MPa (tf ≤ 16 mm), so
  // Vpl,Rd = 1400 × 355/√3 = 286.94 kN [calc].
  it('checks the IPE200 beams of a buildingSMART sample by Name against Vpl,Rd = 286.9 kN (EN 1993-1-1)', () => {
    const forces = write('sample-forces.csv', 'member,combination,shear\nTopMid,ULS-1,143.47\nBotMid,ULS-1,-200\nBotLeft,ULS-1,300\n');
    const run = taulens('check', buildingSmartSample('beam-varying-cardinal-points.ifc'), '--forces', forces, '--force-unit', 'kN', '--standard', 'en1993-1-1', '--json');
    expect(run.stderr).toBe('');
    expect(run.status).toBe(1);
    const output = JSON.parse(run.stdout);
    expect(output).toMatchObject({ cautions: REPORT_CAUTIONS_TEXT, standard: 'en1993-1-1', unmatchedForces: [], forces: { rows: 3, keys: 3, forceUnit: 'kN' } });
    const byName = new Map<string, CheckedMember>(output.members.map((m: CheckedMember) => [m.name, m]));
    const topMid = byName.get('TopMid')!;
    expect(topMid.status).toBe('pass');
    expect(Math.abs(topMid.governing!.VRd_kN - 286.94)).toBeLessThan(0.01);
    expect(topMid.governing!.utilisation).toBeCloseTo(0.5, 3);
    expect(byName.get('BotMid')!.governing!.VEd_kN).toBe(-200);
    expect(byName.get('BotLeft')!.status).toBe('fail');
    expect(byName.get('TopRight')).toMatchObject({ status: 'not-checked', governing: null, reason: 'No shear results were matched to this member.', flags: ['no-results'] });
  });

  // AISC Design Examples (v15.0) G.1A quoting Manual Table 3-2: W24x62, Fy = 50 ksi: φvVn = 306 kips (±0.5).
  it('checks a generated frame by Tag in kips: W24x62 carries the published φvVn = 306 kips, and a failure exits 1', () => {
    const forces = write('frame-forces.csv', 'member,combination,station,shear\nT17,ULS-1,0,153\nT17,ULS-1,144,-12\nT17,ULS-2,0,-100\nT23,ULS-1,0,320\nNOT-IN-MODEL,ULS-1,0,5\n');
    const run = taulens('check', frame, '--forces', forces, '--force-unit', 'kip', '--length-unit', 'in', '--standard', 'aisc360-22-lrfd', '--json');
    expect(run.status).toBe(1);
    expect(run.stderr).toBe('taulens check: 1 force key(s) match no single member: NOT-IN-MODEL.\n');
    const output = JSON.parse(run.stdout);
    expect(output.unmatchedForces).toEqual(['NOT-IN-MODEL']);
    expect(output.model).toMatchObject({ fileName: 'canteen-frame.ifc', lengthUnit: 'inch' });
    const byTag = new Map<string, CheckedMember>(output.members.map((m: CheckedMember) => [m.tag, m]));
    const beam = byTag.get('T17')!;
    expect(beam).toMatchObject({ status: 'pass', profile: { name: 'W24x62' }, governing: { combination: 'ULS-1' } });
    expect(Math.abs(fromNewtons(beam.governing!.VRd_kN * 1000, 'kip') - 306)).toBeLessThanOrEqual(0.5);
    expect(fromNewtons(beam.governing!.VEd_kN * 1000, 'kip')).toBeCloseTo(153, 9);
    expect(beam.governing!.tauMax_MPa).toBeGreaterThan(beam.governing!.tauAvgWeb_MPa * 0.9);
    expect(byTag.get('T23')!.status).toBe('fail');
    expect(new Set(output.members.map((m: CheckedMember) => m.status))).toEqual(new Set(['pass', 'fail', 'not-checked']));
    expect(Object.keys(beam)).toEqual(expect.arrayContaining(['globalId', 'tag', 'name', 'ifcClass', 'storey', 'status', 'profile', 'section', 'material', 'governing', 'flags']));
  });

  it('exits 0 when every checked member passes, and prints a table with the cautions without --json', () => {
    const forces = write('passing.csv', 'member;combination;V [kN]\nT17;ULS-1;100,5\n');
    const run = taulens('check', frame, '--forces', forces, '--standard', 'aisc360-22-asd');
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('shear on both axes and shear with bending by AISC 360-22 §G2.1, ASD');
    expect(run.stdout).toContain('40 members: 1 pass (0 near the limit), 0 fail, 39 not checked, 0 not applicable.');
    expect(run.stdout.trimEnd().endsWith(REPORT_CAUTIONS_TEXT)).toBe(true);
  });

  it('writes one BCF 2.1 topic per failing member, valid against the buildingSMART schemas', async () => {
    const forces = write('failing.csv', 'member,combination,shear\nT17,ULS-1,400\nT20,ULS-1,500\nT23,ULS-1,10\n');
    const bcf = path.join(dir, 'failures.bcf');
    const run = taulens('check', frame, '--forces', forces, '--force-unit', 'kip', '--standard', 'aisc360-22-lrfd', '--json', '--bcf', bcf);
    expect(run.status).toBe(1);
    const archive = await openArchive(fs.readFileSync(bcf));
    try {
      const topics = archive.names.filter((name) => name.endsWith('/markup.bcf'));
      expect(topics).toHaveLength(2);
      for (const name of archive.names) {
        const schema = schemaForEntry(name);
        if (schema) expect(await schemaErrors('2.1', schema, name, await archive.read(name))).toEqual([]);
      }
      const markups = await Promise.all(topics.map(async (name) => (await archive.read(name)).toString('utf8')));
      const viewpoints = await Promise.all(archive.names.filter((name) => name.endsWith('.bcfv')).map(async (name) => (await archive.read(name)).toString('utf8')));
      const output = JSON.parse(run.stdout);
      const failing = output.members.filter((m: CheckedMember) => m.status === 'fail').map((m: CheckedMember) => m.globalId);
      expect(failing).toHaveLength(2);
      for (const globalId of failing) expect(viewpoints.filter((viewpoint) => viewpoint.includes(`IfcGuid="${globalId}"`))).toHaveLength(1);
      expect(markups.join('\n')).toContain('Web shear over capacity: T17');
    } finally {
      archive.close();
    }
    // The same check exports the same topic GUIDs, so a re-import finds them again.
    const again = path.join(dir, 'failures-again.bcf');
    taulens('check', frame, '--forces', forces, '--force-unit', 'kip', '--standard', 'aisc360-22-lrfd', '--bcf', again);
    const [first, second] = await Promise.all([openArchive(fs.readFileSync(bcf)), openArchive(fs.readFileSync(again))]);
    expect(second.names).toEqual(first.names);
    first.close();
    second.close();
  });

  it('warns loudly on stderr when the forces are for another model', () => {
    const rows = Array.from({ length: 12 }, (_, i) => `E${i},ULS-1,10`).join('\n');
    const run = taulens('check', frame, '--forces', write('other-model.csv', `member,combination,shear\n${rows}\nT17,ULS-1,10\n`), '--force-unit', 'kN', '--standard', 'en1993-1-1', '--json');
    expect(run.status).toBe(0);
    expect(run.stderr).toContain('WARNING: only 1 of 13 force keys match a member of canteen-frame.ifc. These forces are probably for another model');
  });

  it('reads an XLSX, asking for the sheet when it has several', async () => {
    const book = new ExcelJS.Workbook();
    book.addWorksheet('Read me').addRow(['Invented demo data']);
    book.addWorksheet('Shear').addRows([['member', 'combination', 'shear'], ['T17', 'ULS-1', 150]]);
    const xlsx = path.join(dir, 'forces.xlsx');
    await book.xlsx.writeFile(xlsx);
    const ask = taulens('check', frame, '--forces', xlsx, '--force-unit', 'kip', '--standard', 'aisc360-22-lrfd');
    expect(ask.status).toBe(2);
    expect(ask.stderr).toContain('The workbook has 2 sheets (Read me, Shear). Choose the sheet that holds the shear results.');
    const chosen = taulens('check', frame, '--forces', xlsx, '--sheet', 'Shear', '--force-unit', 'kip', '--standard', 'aisc360-22-lrfd', '--json');
    expect(chosen.status).toBe(0);
    expect(JSON.parse(chosen.stdout).forces).toMatchObject({ rows: 1, keys: 1 });
  });

  describe('forces files in the layouts analysis exports use', () => {
    const sample = buildingSmartSample('beam-varying-cardinal-points.ifc');
    /** In this process through the same dispatch as the bin: one spawned run (below) covers the process itself. */
    const check = async (forces: string, ...extra: string[]) => {
      let stdout = '';
      let stderr = '';
      const status = await dispatch(['check', sample, '--forces', forces, '--standard', 'en1993-1-1', '--json', ...extra], { out: (t) => (stdout += t), err: (t) => (stderr += t) });
      return { status, stderr, output: stdout ? JSON.parse(stdout) : undefined };
    };
    const governingOf = (output: { members: CheckedMember[] }, name: string) => output.members.find((m) => m.name === name)!.governing;

    // VRd = 286.94 kN for the sample's IPE200 by EN 1993-1-1 §6.2.6, derived in the first test of this file; the forces
    // are invented, so each governing value is simply the largest |Vz| the file gives the member.
    it('a European export (semicolons, decimal commas, CRLF, x [m]) checks without a mapping, at the right station and combination', () => {
      const run = taulens('check', sample, '--forces', fixturePath('european-export.csv'), '--force-unit', 'kN', '--standard', 'en1993-1-1', '--json');
      expect(run.stderr).toBe('');
      expect(run.status).toBe(1);
      const output = JSON.parse(run.stdout);
      expect(output.forces).toMatchObject({ rows: 18, keys: 3, combinations: ['CO1', 'CO2'], mapping: { stationColumn: 'x [m]', shearColumn: 'Vz [kN]', lengthUnit: 'm' } });
      expect(governingOf(output, 'TopMid')).toMatchObject({ combination: 'CO2', station_m: 0, VEd_kN: -143.47 });
      expect(governingOf(output, 'TopMid')!.utilisation).toBeCloseTo(143.47 / 286.94, 4);
      expect(governingOf(output, 'BotMid')).toMatchObject({ combination: 'CO1', station_m: 5, VEd_kN: -200 });
      expect(governingOf(output, 'BotLeft')).toMatchObject({ combination: 'CO2', station_m: 0, VEd_kN: 300 });
      expect(output.members.find((m: CheckedMember) => m.name === 'BotLeft').status).toBe('fail');
      // The file gives My: the interaction is checked at the largest |Vz| (My = 0 there), and the larger My at
      // midspan, whose shear is not kept, is said.
      const topMid = output.members.find((m: CheckedMember) => m.name === 'TopMid') as CheckedMember & { reason: string };
      expect(topMid.governing).toMatchObject({ axis: 'major', check: 'major-axis shear' });
      expect(topMid.checks.map((c) => c.check)).toEqual(['major-axis shear', 'shear with bending']);
      expect(topMid.checks[1]).toMatchObject({ combination: 'CO1', MEd_kNm: 0, utilisation: 0 });
      expect(topMid.flags).toContain('moment-peak-elsewhere');
      expect(topMid.reason).toContain('another station');
    });

    it('one column per combination', async () => {
      const run = await check(fixturePath('wide-combinations.csv'));
      expect(run.status).toBe(0);
      expect(run.output.forces.combinations).toEqual(['CO1', 'CO2', 'CO3']);
      expect(governingOf(run.output, 'TopMid')).toMatchObject({ combination: 'CO2', station_m: 0, VEd_kN: -143.47 });
      expect(governingOf(run.output, 'BotMid')).toMatchObject({ combination: 'CO1', station_m: 5, VEd_kN: -200 });
    });

    it('envelope rows', async () => {
      const run = await check(fixturePath('envelope-rows.tsv'));
      expect(run.status).toBe(1);
      expect(governingOf(run.output, 'TopMid')).toMatchObject({ combination: 'envelope min', station_m: 0, VEd_kN: -143.47 });
      expect(governingOf(run.output, 'BotLeft')).toMatchObject({ combination: 'envelope max', station_m: 0, VEd_kN: 300 });
    });

    it('several sheets of one workbook, one per combination', async () => {
      const book = new ExcelJS.Workbook();
      for (const [name, rows] of Object.entries(SHEET_PER_COMBINATION)) book.addWorksheet(name).addRows(rows);
      const xlsx = path.join(dir, 'per-combination.xlsx');
      await book.xlsx.writeFile(xlsx);
      const run = await check(xlsx, '--sheet', 'CO1', '--sheet', 'CO2');
      expect(run.stderr).toBe('');
      expect(run.output.forces).toMatchObject({ rows: 12, combinations: ['CO1', 'CO2'], mapping: { combinationFromSheet: true, sheets: ['CO1', 'CO2'] } });
      expect(governingOf(run.output, 'TopMid')).toMatchObject({ combination: 'CO2', station_m: 0, VEd_kN: -143.47 });
    });

    it('units in a second header row', async () => {
      const run = await check(fixturePath('units-row.csv'));
      expect(run.output.forces.mapping).toMatchObject({ forceUnit: 'kN', lengthUnit: 'm', momentUnit: 'kNm' });
      expect(governingOf(run.output, 'TopMid')).toMatchObject({ combination: 'CO1', station_m: 5, VEd_kN: 143.47 });
    });

    it('stops when detection is unsure, printing the mapping to write; that mapping, passed with --mapping, checks', async () => {
      const forces = write('bare-combinations.csv', 'Member,x [m],CO1,CO2\nTopMid,0,-98.4,-143.47\nTopMid,5,91.2,137.95\n');
      const unsure = await check(forces, '--force-unit', 'kN');
      expect(unsure.status).toBe(2);
      expect(unsure.output).toBeUndefined();
      expect(unsure.stderr).toContain("the columns of bare-combinations.csv cannot be told apart for certain:\n  combinationColumns: 'CO1', 'CO2': no column names the combination or the shear");
      expect(unsure.stderr).not.toContain('usage:');
      const json = unsure.stderr.slice(unsure.stderr.indexOf('{'));
      expect(JSON.parse(json)).toEqual({ memberColumn: 'Member', combinationColumns: ['CO1', 'CO2'], stationColumn: 'x [m]', forceUnit: 'kN', lengthUnit: 'm', memberKeyKind: 'auto' });
      const mapped = await check(forces, '--mapping', write('bare.mapping.json', json));
      expect(mapped.status).toBe(0);
      expect(governingOf(mapped.output, 'TopMid')).toMatchObject({ combination: 'CO2', station_m: 0, VEd_kN: -143.47 });
    });

    it('reads a mapping as the web lists a template, and refuses an option that contradicts it', async () => {
      const mapping = { memberColumn: 'Member', combinationColumn: 'Load combination', stationColumn: 'x [m]', shearColumn: 'Vz [kN]', forceUnit: 'kN', lengthUnit: 'm' };
      const template = write('template.json', JSON.stringify({ id: 'x', name: 'European export', mapping, createdAt: '2026-12-01T00:00:00Z' }));
      const run = await check(fixturePath('european-export.csv'), '--mapping', template);
      expect(run.output.forces.mapping).toEqual({ ...mapping, memberKeyKind: 'auto' });
      const contradiction = await check(fixturePath('european-export.csv'), '--mapping', template, '--force-unit', 'kip');
      expect(contradiction.status).toBe(2);
      expect(contradiction.stderr).toContain('the option for forceUnit ("kip") contradicts the mapping file\'s "kN"; give only one');
      const broken = await check(fixturePath('european-export.csv'), '--mapping', write('broken.json', JSON.stringify({ ...mapping, shearColumn: undefined })));
      expect(broken.status).toBe(2);
      expect(broken.stderr).toMatch(/broken\.json: The column mapping is not usable: shearColumn: choose the shear force column\./);
    });
  });

  describe('bad input exits 2 with one clear message', () => {
    // Run in this process through the same dispatch as the bin (spawning each case would only repeat the start-up).
    const check = async (forces: string, ...extra: string[]) => {
      let stdout = '';
      let stderr = '';
      const status = await dispatch(['check', frame, '--forces', forces, '--standard', 'en1993-1-1', ...extra], { out: (t) => (stdout += t), err: (t) => (stderr += t) });
      return { status, stdout, stderr };
    };
    const cases: Array<[what: string, content: string, extra: string[], message: string | RegExp]> = [
      ['an unknown force unit', 'member,combination,shear\nT17,ULS-1,1\n', ['--force-unit', 'tonne'], "--force-unit must be one of N, kN, kip, lbf, got 'tonne'"],
      ['no force unit where the header gives none', 'member,combination,shear\nT17,ULS-1,1\n', [], "--force-unit is required: the header does not say the unit of 'shear'"],
      ['a non-numeric shear', 'member,combination,shear\nT17,ULS-1,lots\n', ['--force-unit', 'kN'], "Row 2 (column 'shear'): 'lots' is not a number; expected a shear force in kN."],
      ['a missing shear', 'member,combination,shear\nT17,ULS-1,\n', ['--force-unit', 'kN'], "Row 2 (column 'shear'): the shear force is empty."],
      ['a repeated row', 'member,combination,shear\nT17,ULS-1,1\nT17,ULS-1,2\n', ['--force-unit', 'kN'], "Row 3 repeats member 'T17', combination 'ULS-1' of row 2."],
      ['an empty file', '', ['--force-unit', 'kN'], 'The file is empty: it holds no header and no rows.'],
      ['a header without a shear column', 'member,combination,moment\nT17,ULS-1,1\n', ['--force-unit', 'kN'], 'the forces file has no shear column (its columns: member, combination, moment)'],
    ];
    it.each(cases)('%s', async (_what, content, extra, message) => {
      const run = await check(write(`bad-${Math.random().toString(36).slice(2)}.csv`, content), ...extra);
      expect(run.status).toBe(2);
      expect(run.stdout).toBe('');
      expect(run.stderr).toMatch(typeof message === 'string' ? new RegExp(message.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')) : message);
      expect(run.stderr).not.toMatch(/\n\s+at /);
    });

    it('a model that is not IFC, a missing forces file, and no standard (spawned: the exit status of the process)', () => {
      const forces = write('ok.csv', 'member,combination,shear\nT1,U,1\n');
      const notIfc = taulens('check', write('notes.ifc', 'hello'), '--forces', forces, '--force-unit', 'kN', '--standard', 'en1993-1-1');
      expect(notIfc.status).toBe(2);
      expect(notIfc.stderr).toMatch(/^taulens check: /);
      expect(notIfc.stderr).not.toMatch(/\n\s+at /);
      const missing = taulens('check', frame, '--forces', path.join(dir, 'nowhere.csv'), '--standard', 'en1993-1-1');
      expect(missing.status).toBe(2);
      expect(missing.stderr).toContain('no such file');
      const noStandard = taulens('check', frame, '--forces', forces, '--force-unit', 'kN');
      expect(noStandard.status).toBe(2);
      expect(noStandard.stderr).toContain('--standard is required: one of aisc360-22-lrfd, aisc360-22-asd, en1993-1-1');
    });
  });

  describe('both shear axes and shear with bending (forces with Vz, Vy, My and Mz)', () => {
    // Invented forces (test/fixtures/results/both-axes.csv) on an I (IPE 270 read from its outline), a channel
    // (UPE 200) and a tube (CHS 219.1x6.3) of a generated frame; expected values from the engine's own capacities.
    let output: { members: CheckedMember[] };
    beforeAll(async () => {
      const model = path.join(dir, 'real-exports.ifc');
      writeFrameFile(model, { members: 120, schema: 'IFC4', unit: 'mm', patterns: 'real-exports' });
      let stdout = '';
      await dispatch(['check', model, '--forces', fixturePath('both-axes.csv'), '--standard', 'en1993-1-1', '--json'], { out: (t) => (stdout += t), err: () => undefined });
      output = JSON.parse(stdout);
    });
    const byTag = (tag: string) => output.members.find((m) => m.tag === tag)!;
    const preparedFor = (member: CheckedMember) =>
      prepareFamilyCapacity(sectionDimensionsOf(member.profile!), { grade: 'S355' }, 'en1993-1-1', { fabrication: member.profile!.fabrication, momentBasis: 'elastic' });

    it('names each member’s family and lists the governing result per axis and check, with the governing one', () => {
      expect(['T34', 'T38', 'T44'].map((tag) => byTag(tag).profile!.family)).toEqual(['I', 'channel', 'tube']);
      for (const tag of ['T34', 'T38', 'T44']) {
        const member = byTag(tag);
        expect(member.checks.map((c) => `${c.axis} ${c.check}`)).toEqual(['major major-axis shear', 'major shear with bending', 'minor minor-axis shear', 'minor shear with bending']);
        const top = member.checks.reduce((a, b) => (b.utilisation > a.utilisation ? b : a));
        expect(member.governing).toMatchObject({ axis: top.axis, check: top.check, utilisation: top.utilisation });
      }
      const ipe = byTag('T34');
      expect(ipe.checks[0]).toMatchObject({ combination: 'CO2', station_m: 0, VEd_kN: 180, MEd_kNm: null });
      expect(ipe.checks[1]).toMatchObject({ combination: 'CO2', station_m: 0, VEd_kN: 180, MEd_kNm: 40 });
      expect(ipe.checks[2]).toMatchObject({ combination: 'CO2', station_m: 5, VEd_kN: -60 });
      expect(ipe.checks[3]).toMatchObject({ combination: 'CO2', station_m: 5, VEd_kN: -60, MEd_kNm: 8 });
    });

    it('gives every utilisation the engine gives for the same forces', () => {
      for (const tag of ['T34', 'T38', 'T44']) {
        const member = byTag(tag);
        const prepared = preparedFor(member);
        for (const c of member.checks) {
          const capacity = prepared[c.axis];
          if (!capacity.applicable) throw new Error(`${tag} ${c.axis} must be checkable`);
          // check.ts gives the major axis of an I; the family engine's I capacity equals it (family-capacity.spec.ts).
          expect(c.VRd_kN * 1000).toBeCloseTo(capacity.VRd_N, 6);
          const expected =
            c.MEd_kNm === null
              ? Math.abs(c.VEd_kN * 1000) / capacity.VRd_N
              : evaluateFamilyCheck(prepared, c.axis, { shear_N: c.VEd_kN * 1000, moment_Nmm: c.MEd_kNm * 1e6 }).bendingUtilisation;
          expect(c.utilisation).toBeCloseTo(expected!, 12);
        }
      }
    });

    // EN 1993-1-1 §6.2.8(2) by hand for IPE 270 in S355: Av = 22.14 cm² and Wel,y = 429 cm³ (EN 10365 section tables,
    // from memory), so Vpl,Rd = 2214 × 355/√3 = 453.8 kN; VEd = 180 kN ≤ 0.5·Vpl,Rd, so ρ = 0 and MV,Rd = Mel,Rd =
    // 429e3 × 355 = 152.3 kNm; MEd = 40 kNm uses 0.2626 of it [calc]. The run measures the outline as drawn: 1 %.
    it('matches a hand-worked §6.2.8 case where the shear is too small to reduce the moment resistance', () => {
      const bending = byTag('T34').checks[1];
      expect(Math.abs(bending.utilisation - 40 / 152.3) / (40 / 152.3)).toBeLessThan(0.01);
      expect(Math.abs(byTag('T34').checks[0].VRd_kN - 453.8) / 453.8).toBeLessThan(0.01);
    });
  });

  describe('forces from an IFC structural analysis model', () => {
    // Invented frames with an invented analysis model (test/generator/analysis-model-writer.ts), which writes the same
    // forces as CSV in the default format: the check is that both sources give the same result, member by member.
    const check = async (model: string, forces: string, ...extra: string[]) => {
      let stdout = '';
      let stderr = '';
      const status = await dispatch(['check', model, '--forces', forces, '--standard', 'en1993-1-1', ...extra], { out: (t) => (stdout += t), err: (t) => (stderr += t) });
      return { status, stdout, stderr };
    };
    const analysisFrame = (name: string, options: { schema: 'IFC4' | 'IFC4X3'; unit: 'mm' | 'm'; members: number; defect?: 'no-results' }) => {
      const analysis = addAnalysisModel(generateFrame({ members: options.members, schema: options.schema, unit: options.unit, fileName: name }), frameLayout(options.members), options);
      return { ifc: write(name, analysis.ifc), csv: write(name.replace(/\.ifc$/, '.forces.csv'), analysis.csv), forces: analysis.forces };
    };
    const governingOf = (member: CheckedMember) => ({
      status: member.status,
      combination: member.governing?.combination,
      check: member.governing && `${member.governing.axis} ${member.governing.check}`,
      station_m: member.governing?.station_m,
      utilisation: member.governing?.utilisation,
    });
    /** The members of both --json outputs, with the same governing result and checks; returns the IFC run's. */
    const expectSameChecks = (ifcJson: string, csvJson: string): CheckedMember[] => {
      const ifcMembers: CheckedMember[] = JSON.parse(ifcJson).members;
      const csvMembers: CheckedMember[] = JSON.parse(csvJson).members;
      expect(ifcMembers.map((m) => m.globalId)).toEqual(csvMembers.map((m) => m.globalId));
      ifcMembers.forEach((member, i) => {
        const ifc = governingOf(member);
        const csv = governingOf(csvMembers[i]);
        expect({ ...ifc, utilisation: undefined }).toEqual({ ...csv, utilisation: undefined });
        // The CSV carries the IFC's numbers to 9 decimals of kN and kN·m (forcesCsv), so the results agree to rounding.
        if (csv.utilisation !== undefined) expect(ifc.utilisation).toBeCloseTo(csv.utilisation, 9);
        expect(member.checks.map((c) => [c.axis, c.check, c.combination, c.station_m])).toEqual(csvMembers[i].checks.map((c) => [c.axis, c.check, c.combination, c.station_m]));
      });
      return ifcMembers;
    };

    it.each([
      ['IFC4 in mm, the model file holding its own analysis', 'IFC4', 'mm'],
      ['IFC4X3 in m (forces in kN, moments in kN·m)', 'IFC4X3', 'm'],
    ] as const)('%s: the same governing combination, check, station and utilisation per member as the CSV', async (_what, schema, unit) => {
      const generated = analysisFrame(`quay-shed-${schema}-${unit}.ifc`, { schema, unit, members: 30 });
      const fromIfc = await check(generated.ifc, generated.ifc, '--json');
      const fromCsv = await check(generated.ifc, generated.csv, '--json');
      expect(fromIfc.stderr).toBe('');
      expect(fromCsv.stderr).toBe('');
      expect(fromIfc.status).toBe(fromCsv.status);
      const ifcMembers = expectSameChecks(fromIfc.stdout, fromCsv.stdout);
      // Every beam and column has forces (braces have no analysis member); some are linked by coordinates only.
      const withForces = new Set(generated.forces.map((f) => f.globalId));
      expect(generated.forces.some((f) => f.link === 'coordinates')).toBe(true);
      expect(ifcMembers.filter((m) => m.governing).map((m) => m.globalId).sort()).toEqual([...withForces].sort());
      const forcesJson = JSON.parse(fromIfc.stdout).forces;
      expect(forcesJson.source).toBe('ifc-analysis-model');
      expect(forcesJson.combinations).toEqual(JSON.parse(fromCsv.stdout).forces.combinations);
      expect(JSON.parse(fromIfc.stdout).cautions).toBe(REPORT_CAUTIONS_TEXT);
    });

    it('reads the forces from a separate analysis file', async () => {
      const generated = analysisFrame('depot-analysis.ifc', { schema: 'IFC4', unit: 'mm', members: 20 });
      const physical = write('depot.ifc', generateFrame({ members: 20, schema: 'IFC4', unit: 'mm', fileName: 'depot.ifc' }));
      const fromIfc = await check(physical, generated.ifc, '--json');
      const fromCsv = await check(physical, generated.csv, '--json');
      expect(fromIfc.stderr).toBe('');
      expect(fromIfc.status).toBe(fromCsv.status);
      expect(expectSameChecks(fromIfc.stdout, fromCsv.stdout).filter((m) => m.governing).length).toBeGreaterThan(0);
    });

    it('a model with analysis members but no results exits 2 with one plain message', async () => {
      const generated = analysisFrame('yard-no-results.ifc', { schema: 'IFC4', unit: 'mm', members: 12, defect: 'no-results' });
      const run = await check(generated.ifc, generated.ifc);
      expect(run.status).toBe(2);
      expect(run.stdout).toBe('');
      expect(run.stderr).toMatch(/^taulens check: .*yard-no-results\.ifc: The file holds \d+ analysis members \(IfcStructuralCurveMember\) but no results/);
      expect(run.stderr.trim().split('\n')).toHaveLength(1);
      expect(run.stderr).not.toMatch(/\n\s+at /);
    });

    it('a model without analysis members, and options that only describe a CSV, exit 2', async () => {
      const noAnalysis = await check(frame, frame);
      expect(noAnalysis.status).toBe(2);
      expect(noAnalysis.stderr).toContain('The file holds no analysis members (IfcStructuralCurveMember)');
      const generated = analysisFrame('pier-shed.ifc', { schema: 'IFC4', unit: 'mm', members: 12 });
      const withUnit = await check(generated.ifc, generated.ifc, '--force-unit', 'kN');
      expect(withUnit.status).toBe(2);
      expect(withUnit.stderr).toContain('--force-unit describes a CSV or XLSX forces file');
    });
  });
});
