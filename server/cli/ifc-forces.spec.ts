/**
 * The forces of an IFC analysis model as governing values, against the same forces read from CSV. The frame and its
 * forces are invented (test/generator/analysis-model-writer.ts writes both); what is checked is that the two sources
 * give the same governing table, entry by entry.
 */
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { addAnalysisModel } from '../../test/generator/analysis-model-writer';
import { frameLayout } from '../../test/generator/frame-layout';
import { generateFrame } from '../../test/generator/generate-frame';
import { readModel } from '../ifc/read-model';
import { governingShearAt } from '../results/governing-shear';
import { importResultsFile } from '../results/results-import';
import { forcesMapping } from './forces-mapping';
import { importIfcForces, isIfcForcesFile } from './ifc-forces';

describe('importIfcForces', () => {
  let dir: string;
  beforeAll(() => (dir = fs.mkdtempSync(path.join(os.tmpdir(), 'taulens-ifc-forces-'))));
  afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

  it('tells an IFC file by its name or its STEP header, and a CSV from both', () => {
    const step = path.join(dir, 'analysis.txt');
    fs.writeFileSync(step, 'ISO-10303-21;\nHEADER;\n');
    const csv = path.join(dir, 'forces.csv');
    fs.writeFileSync(csv, 'member,combination,shear\n');
    expect(isIfcForcesFile(step)).toBe(true);
    expect(isIfcForcesFile(csv)).toBe(false);
  });

  it.each([['mm'], ['m']] as const)('gives the governing values of the CSV of the same forces (model in %s)', async (unit) => {
    const analysis = addAnalysisModel(generateFrame({ members: 24, schema: 'IFC4', unit }), frameLayout(24), { schema: 'IFC4', unit });
    const ifc = path.join(dir, `frame-${unit}.ifc`);
    const csv = path.join(dir, `frame-${unit}.forces.csv`);
    fs.writeFileSync(ifc, analysis.ifc);
    fs.writeFileSync(csv, analysis.csv);
    expect(isIfcForcesFile(ifc)).toBe(true);
    const { members } = await readModel(ifc, { fileName: 'frame.ifc', glb: 'none', defaultGrade: 'S355', yieldRule: 'en10025-2' });
    const fromIfc = await importIfcForces(ifc, members);
    const fromCsv = await importResultsFile(csv, await forcesMapping({ forces: csv, sheets: [] }));

    expect(fromIfc.rowCount).toBe(analysis.forces.length);
    expect(fromIfc.stationsWithoutShear).toBe(0);
    expect(fromIfc.links.none).toBe(0);
    expect(fromIfc.links.coordinates).toBeGreaterThan(0);
    expect(fromIfc.combinations).toEqual(fromCsv.summary.combinations);
    expect(fromIfc.memberKeys.map((k) => k.memberKey)).toEqual(fromCsv.summary.memberKeys.map((k) => k.memberKey));
    expect(fromIfc.governing.shear_N.length).toBe(fromCsv.governing.shear_N.length);
    for (let entry = 0; entry < fromCsv.governing.shear_N.length; entry++) {
      const a = governingShearAt(fromIfc.governing, entry);
      const b = governingShearAt(fromCsv.governing, entry);
      expect([a.memberKey, a.combination, a.station_mm]).toEqual([b.memberKey, b.combination, b.station_mm]);
      // The CSV holds kN and kN·m to 9 decimals (forcesCsv): agreement to 1e-3 N and N·mm.
      expect(a.shear_N).toBeCloseTo(b.shear_N, 3);
      expect(a.minor?.shear_N).toBeCloseTo(b.minor!.shear_N, 3);
      expect(a.majorMoment_Nmm).toBeCloseTo(b.majorMoment_Nmm!, 0);
    }
  });
});
