/** Shared set-up for the findings integration tests (test/integration/findings*.spec.ts). */
import { randomUUID } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { Finding } from '../../server/findings/finding.entity';
import type { FindingStatus } from '../../server/findings/finding-fields';
import type { RunMemberResult } from '../../server/findings/finding-sync-plan';
import type { ApiAgent } from '../fixtures/api-agent';
import { MEMBER_IDS, TINY_PNG } from '../fixtures/bcf/sample-findings';

export { MEMBER_IDS, TINY_PNG };

export function findingsUrl(projectId: string, rest = ''): string {
  return `/api/projects/${projectId}/findings${rest}`;
}

/** Raises a manual finding through the API (as a coordinator or engineer) and returns its id. */
export async function raiseFinding(agent: ApiAgent, projectId: string, body: Record<string, unknown> = {}): Promise<string> {
  const response = await agent
    .post(findingsUrl(projectId))
    .send({ title: 'Notch at the east end of B-12', memberGlobalIds: [MEMBER_IDS.beamB12], ...body });
  if (response.status !== 201) throw new Error(`raising a finding failed: ${response.status} ${JSON.stringify(response.body)}`);
  return (response.body as { finding: { id: string } }).finding.id;
}

/** Puts a finding straight into a status, to test what may follow from it. */
export async function setStatus(dataSource: DataSource, findingId: string, status: FindingStatus): Promise<void> {
  await dataSource.getRepository(Finding).update(findingId, { status, justification: status === 'accepted' ? 'Set up by the test.' : null });
}

/** Inserts manual findings straight into the database, one per status given, numbered after the project's last. */
export async function insertFindings(dataSource: DataSource, projectId: string, statuses: readonly FindingStatus[]): Promise<string[]> {
  const repository = dataSource.getRepository(Finding);
  const last = (await repository.maximum('number', { projectId })) ?? 0;
  const rows = statuses.map((status, i) => ({
    id: randomUUID(),
    projectId,
    number: last + i + 1,
    guid: randomUUID(),
    kind: 'manual' as const,
    title: `Set-up finding ${last + i + 1}`,
    status,
    justification: status === 'accepted' ? 'Set up by the test.' : null,
    labels: [],
    memberGlobalIds: [MEMBER_IDS.beamB12],
    memberKey: null,
  }));
  for (let start = 0; start < rows.length; start += 100) await repository.insert(rows.slice(start, start + 100));
  return rows.map((row) => row.id);
}

/** One member's row of a check run; invented values (demo data, not a check). */
export function runResult(globalId: string, status: RunMemberResult['status'], utilisation: number | null, flags: string[] = []): RunMemberResult {
  return {
    globalId,
    tag: `T-${globalId.slice(0, 4)}`,
    name: null,
    storey: 'Level 2',
    profileName: 'IPE 300',
    status,
    utilisation,
    VEd_kN: utilisation === null ? null : 200 * utilisation,
    VRd_kN: utilisation === null ? null : 200,
    governingCombination: utilisation === null ? null : 'ULS-2',
    flags,
  };
}
