/**
 * The ingest worker: reads the IFC file off the server's event loop, writing the geometry to a .glb file and the
 * members to a member-lines file for the server to store. A file the reader cannot use comes back as a domain error
 * with the reader's message, so the revision shows what is wrong with the file.
 */
import type { CatalogueSection } from '../catalogue/catalogue-section';
import type { GradeId } from '../engine/grades';
import type { ModelInfo } from '../ifc/model-read-result';
import { readModel } from '../ifc/read-model';
import { defineJob } from '../jobs/job-worker';
import { type IngestPhase, overallFraction } from './ingest-phases';
import { readingIfc } from './ifc-file-errors';
import { writeMemberLines } from './member-lines';

export interface IngestJobInput {
  ifcPath: string;
  glbPath: string;
  membersPath: string;
  fileName: string;
  defaultGrade?: GradeId;
  projectCatalogue: readonly CatalogueSection[];
}

export interface IngestJobOutput {
  model: ModelInfo;
}

export default defineJob<IngestJobInput, IngestJobOutput>(async (input, report) => {
  const progress = (phase: IngestPhase, fraction: number) => report({ fraction: overallFraction(phase, fraction), message: phase });
  const result = await readingIfc(() =>
    readModel(input.ifcPath, {
      fileName: input.fileName,
      glb: { path: input.glbPath },
      defaultGrade: input.defaultGrade,
      projectCatalogue: input.projectCatalogue,
      onProgress: progress,
    }),
  );
  writeMemberLines(input.membersPath, result.members);
  return { model: result.model };
});
