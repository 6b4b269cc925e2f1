/**
 * Demo step: the shear forces of the invented Brindlecote frame analysis, imported for the depot's latest model
 * revision by the demo coordinator through the same path as an upload (preview, mapping, import, matching), with the
 * mapping saved as a template. Invented data, for the demo only.
 *
 * assets/brindlecote-frame-shear-forces.csv was made once with the engine: for each I-section member of revision D a
 * target utilisation (0.12–0.72 for most; 0.91–0.98 for two girders and three IPE 270 beams, so the warning band has
 * members; 1.04–1.24 for five PG600x250 girders with the thinner revision-D web, so a handful fail), turned into a
 * peak shear from the member's EN 1993-1-1 capacity, spread over three ULS combinations and three stations (both
 * ends and mid-span, opposite signs at the ends). The forces were made with the catalogue's HE 240 A (root fillets);
 * the model draws those beams as outlines without fillets, which are now measured as drawn, so two of them also reach
 * the warning band. The four wind braces (T134, T135, T269, T270) carry small end shears
 * (2.7–6.1 kN): the tubes are checked, the angles have no EN shear rule. Two analysis-only members (AN-901, AN-902)
 * match nothing.
 */
import { copyFileSync, createReadStream, existsSync, mkdtempSync, rmSync } from 'node:fs';
import { createHash } from 'node:crypto';
import os from 'node:os';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import type { ColumnMapping } from '../results/column-mapping';
import { latestReadyRevision } from '../models/model-queries';
import { ResultMatchingService } from '../results/result-matching.service';
import { ResultSet } from '../results/result-set.entity';
import { ResultSetService } from '../results/result-set.service';
import { ResultsUploadService } from '../results/results-upload.service';
import { type DemoStep, demoProject, demoUser } from './demo-context';

export const DEMO_FORCES_FILE = 'brindlecote-frame-shear-forces.csv';
export const DEMO_RESULTS_NAME = 'Frame analysis, ULS shear (revision D sections)';

const DEMO_MAPPING: ColumnMapping = {
  memberColumn: 'Member',
  combinationColumn: 'Load combination',
  stationColumn: 'Station [m]',
  shearColumn: 'Vz [kN]',
  forceUnit: 'kN',
  lengthUnit: 'm',
  memberKeyKind: 'tag',
};

/** Beside this file in the sources; the build (dist/server/server/demo) does not copy assets, so from there it is the sources' copy. */
function forcesAsset(): string {
  const candidates = [path.join(__dirname, 'assets', DEMO_FORCES_FILE), path.resolve(__dirname, '../../../../server/demo/assets', DEMO_FORCES_FILE)];
  const found = candidates.find((candidate) => existsSync(candidate));
  if (!found) throw new Error(`the demo shear forces ${DEMO_FORCES_FILE} were not found (looked in ${candidates.join(', ')})`);
  return found;
}

async function sha256Of(file: string): Promise<string> {
  const hash = createHash('sha256');
  await pipeline(createReadStream(file), hash);
  return hash.digest('hex');
}

export const demoResultsStep: DemoStep = {
  name: 'demo shear results',
  async run(ctx) {
    const project = demoProject(ctx, 'depot');
    const revision = await latestReadyRevision(ctx.dataSource, project.id);
    if (!revision) throw new Error('the demo shear results need a ready model revision: the demo model step must run first');
    const asset = forcesAsset();
    if (await ctx.dataSource.getRepository(ResultSet).existsBy({ projectId: project.id, sha256: await sha256Of(asset) })) return;

    const workDir = mkdtempSync(path.join(os.tmpdir(), 'taulens-demo-results-'));
    try {
      const coordinator = demoUser(ctx, 'coordinator');
      const uploads = new ResultsUploadService({ ...ctx, workDir });
      // upload() consumes its file as it does a request's temporary file.
      const received = path.join(workDir, DEMO_FORCES_FILE);
      copyFileSync(asset, received);
      const upload = await uploads.upload(project.id, coordinator.id, { path: received, originalName: DEMO_FORCES_FILE });
      const resultSets = new ResultSetService({ ...ctx, workDir, matching: ResultMatchingService.of(ctx.dataSource) });
      await resultSets.importResults(project.id, coordinator.id, {
        uploadId: upload.id,
        mapping: DEMO_MAPPING,
        modelRevisionId: revision.id,
        name: DEMO_RESULTS_NAME,
        saveTemplateAs: 'Frame analysis export (Vz in kN, stations in m)',
      });
    } finally {
      rmSync(workDir, { recursive: true, force: true });
    }
  },
};
