/**
 * Shared set-up for the shear-results and check-run integration tests (test/integration/results*.spec.ts,
 * checks*.spec.ts): a model revision ingested through the API, results files written per test, waits for runs, and
 * the counts that show nothing was half-stored.
 */
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { CheckMemberDetail } from '../../server/checks/check-member-detail.entity';
import { CheckMemberResult } from '../../server/checks/check-member-result.entity';
import { CheckRun } from '../../server/checks/check-run.entity';
import type { MemberRecord } from '../../server/ifc/model-read-result';
import { loadMemberRecords } from '../../server/models/model-queries';
import { ResultKey } from '../../server/results/result-key.entity';
import { ResultManualMatch } from '../../server/results/result-manual-match.entity';
import { ResultMappingTemplate } from '../../server/results/result-mapping-template.entity';
import { ResultSet } from '../../server/results/result-set.entity';
import { ResultsUpload } from '../../server/results/results-upload.entity';
import type { ApiAgent } from '../fixtures/api-agent';
import type { TestApp } from '../fixtures/test-app';

export const modelsUrl = (projectId: string) => `/api/projects/${projectId}/models`;
export const resultsUrl = (projectId: string) => `/api/projects/${projectId}/results`;
export const checksUrl = (projectId: string) => `/api/projects/${projectId}/checks`;
export const mappingsUrl = (projectId: string) => `/api/projects/${projectId}/result-mappings`;

/** The mapping of the default format (`member,combination,shear`, optional `station` in mm). */
export const DEFAULT_MAPPING = { memberColumn: 'member', combinationColumn: 'combination', shearColumn: 'shear', forceUnit: 'kN' } as const;

export interface Revision {
  id: string;
  number: number;
  status: string;
  error: string | null;
}

export async function ingestModel(agent: ApiAgent, projectId: string, content: string | Buffer, fileName: string): Promise<Revision> {
  const response = await agent.post(modelsUrl(projectId)).attach('file', Buffer.from(content), fileName);
  if (response.status !== 202) throw new Error(`model upload failed: ${response.status} ${JSON.stringify(response.body)}`);
  return until(async () => {
    const { body } = await agent.get(`${modelsUrl(projectId)}/${response.body.revision.id}`).expect(200);
    const revision = body.revision as Revision;
    return revision.status === 'ready' || revision.status === 'failed' ? revision : undefined;
  });
}

/** The revision's members as the ingest stored them. */
export function membersOf(app: TestApp, revisionId: string): Promise<MemberRecord[]> {
  return loadMemberRecords(app.dataSource, revisionId);
}

/** Results CSV text of the default format; a station column when any row has one. */
export function resultsCsv(rows: ReadonlyArray<readonly [member: string, combination: string, shear_kN: number | string, station_mm?: number]>): string {
  const stations = rows.some((row) => row[3] !== undefined);
  const header = stations ? 'member,combination,station,shear' : 'member,combination,shear';
  const lines = rows.map(([member, combination, shear, station]) => (stations ? [member, combination, station ?? '', shear] : [member, combination, shear]).join(','));
  return `${header}\n${lines.join('\n')}\n`;
}

export function uploadResults(agent: ApiAgent, projectId: string, content: string | Buffer, fileName = 'shear.csv') {
  return agent.post(`${resultsUrl(projectId)}/uploads`).attach('file', Buffer.from(content), fileName);
}

/** Uploads and imports a results file; returns the result set. */
export async function importResults(
  agent: ApiAgent,
  projectId: string,
  revisionId: string,
  content: string | Buffer,
  extra: Record<string, unknown> = {},
): Promise<ResultSetBody> {
  const uploaded = await uploadResults(agent, projectId, content);
  if (uploaded.status !== 201) throw new Error(`results upload failed: ${uploaded.status} ${JSON.stringify(uploaded.body)}`);
  const response = await agent
    .post(resultsUrl(projectId))
    .send({ uploadId: uploaded.body.upload.id, mapping: DEFAULT_MAPPING, modelRevisionId: revisionId, name: 'Frame analysis', ...extra });
  if (response.status !== 201) throw new Error(`results import failed: ${response.status} ${JSON.stringify(response.body)}`);
  return response.body.resultSet as ResultSetBody;
}

export interface ResultSetBody {
  id: string;
  sha256: string;
  rowCount: number;
  memberKeys: number;
  combinations: string[];
  matching: { matched: number; ambiguous: number; unmatchedResults: number; membersWithoutResults: number; warning: string | null };
  [field: string]: unknown;
}

export interface RunBody {
  id: string;
  status: 'queued' | 'running' | 'done' | 'failed';
  error: string | null;
  summary: { pass: number; warning: number; fail: number; notChecked: number; notApplicable: number; maxUtilisation: number | null; unmatchedResults: number } | null;
  [field: string]: unknown;
}

/** Starts a run as the given (engineer) agent and waits until it is done or failed. */
export async function runCheck(agent: ApiAgent, projectId: string, body: Record<string, unknown>): Promise<RunBody> {
  const started = await agent.post(checksUrl(projectId)).send(body);
  if (started.status !== 202) throw new Error(`starting a check failed: ${started.status} ${JSON.stringify(started.body)}`);
  return untilFinished(agent, projectId, started.body.run.id);
}

export function untilFinished(agent: ApiAgent, projectId: string, runId: string): Promise<RunBody> {
  return until(async () => {
    const { body } = await agent.get(`${checksUrl(projectId)}/${runId}`).expect(200);
    const run = body.run as RunBody;
    return run.status === 'done' || run.status === 'failed' ? run : undefined;
  });
}

async function until<T>(probe: () => Promise<T | undefined>, timeoutMs = 60_000): Promise<T> {
  const start = Date.now();
  for (;;) {
    const value = await probe();
    if (value !== undefined) return value;
    if (Date.now() - start > timeoutMs) throw new Error('gave up waiting');
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

/** Rows of every results and checks table, and the files stored for the project's results: equal before and after a refused request. */
export async function resultsFootprint(app: TestApp, projectId: string): Promise<Record<string, unknown>> {
  const ds = app.dataSource;
  const count = (entity: Parameters<typeof ds.getRepository>[0]) => ds.getRepository(entity).count();
  return {
    uploads: await ds.getRepository(ResultsUpload).countBy({ projectId }),
    resultSets: await ds.getRepository(ResultSet).countBy({ projectId }),
    keys: await count(ResultKey),
    manual: await ds.getRepository(ResultManualMatch).countBy({ projectId }),
    templates: await ds.getRepository(ResultMappingTemplate).countBy({ projectId }),
    runs: await ds.getRepository(CheckRun).countBy({ projectId }),
    memberResults: await count(CheckMemberResult),
    memberDetails: await count(CheckMemberDetail),
    files: storedResultFiles(app, projectId),
  };
}

export function storedResultFiles(app: TestApp, projectId: string): string[] {
  const root = path.join(app.config.dataDir, 'files', 'projects', projectId, 'results');
  try {
    return readdirSync(root, { recursive: true, withFileTypes: true })
      .filter((entry) => entry.isFile())
      .map((entry) => path.relative(root, path.join(entry.parentPath, entry.name)))
      .sort();
  } catch {
    return [];
  }
}
