/**
 * Demo step: two revisions of the structural model of the invented Brindlecote depot (project BRD-17), uploaded by
 * the demo coordinator and read as an upload would be, so the members table, the 3D view and the revision compare
 * have something to show. Invented data, for the demo only.
 *
 * The files in assets/ were written by the test generator (test/generator/generate-frame.ts, 400 members, IFC4, mm)
 * with the project, site and building renamed for the scenario. Revision D then changes two sections: the IPE 300
 * beams (and their type) become IPE 270, and the welded PG600x250 girders get an 8 mm web instead of 10 mm.
 */
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ConflictError } from '../http/errors';
import { checkIfcFile } from '../models/model-upload';
import { ModelService } from '../models/model.service';
import { type DemoStep, demoProject, demoUser } from './demo-context';

export const DEMO_MODEL_FILES = [
  { fileName: 'brindlecote-frame-rev-C.ifc', note: 'Revision C: issued for coordination.' },
  { fileName: 'brindlecote-frame-rev-D.ifc', note: 'Revision D: lighter secondary beams, thinner girder webs over the loading bays.' },
] as const;

/** The assets folder, found by walking up, so the step runs from the sources and from the build (dist/server/…). */
function assetPath(fileName: string): string {
  for (let dir = __dirname; ; dir = path.dirname(dir)) {
    const candidate = path.join(dir, 'server', 'demo', 'assets', fileName);
    if (existsSync(candidate)) return candidate;
    if (path.dirname(dir) === dir) throw new Error(`demo model ${fileName} was not found in server/demo/assets above ${__dirname}`);
  }
}

export const demoModelStep: DemoStep = {
  name: 'demo model revisions',
  async run(ctx) {
    const project = demoProject(ctx, 'depot');
    const coordinator = demoUser(ctx, 'coordinator');
    const workDir = mkdtempSync(path.join(os.tmpdir(), 'taulens-demo-ingest-'));
    try {
      const models = new ModelService({ ...ctx, workDir });
      for (const { fileName, note } of DEMO_MODEL_FILES) {
        const ifc = await checkIfcFile(assetPath(fileName), fileName);
        let ingested;
        try {
          ({ ingested } = await models.accept(project.id, coordinator.id, ifc, note, false));
        } catch (error) {
          // Seeded on an earlier start.
          if (error instanceof ConflictError && error.code === 'duplicate_file') continue;
          throw error;
        }
        const revision = await ingested;
        if (revision?.status !== 'ready') throw new Error(`the demo model ${fileName} could not be read: ${revision?.error}`);
      }
    } finally {
      rmSync(workDir, { recursive: true, force: true });
    }
  },
};
