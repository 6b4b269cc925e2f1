/**
 * Worker: computes a check run (every member against its governing shear per combination) and returns the rows to
 * store, so a run over 50,000 members × 50 combinations never holds up the server's event loop.
 */
import { defineJob } from '../jobs/job-worker';
import type { MemberRecord } from '../ifc/model-read-result';
import { decodeGoverningTable } from '../results/governing-file';
import { governingShearsByMember } from '../results/governing-shear';
import type { MemberMatch } from '../results/member-matching';
import type { CheckParameters } from './check-parameters';
import { type CheckRunSummary, computeCheckRun } from './check-run-compute';
import { memberResultRow, memberResultValues } from './member-result-row';

/** What the worker reads of a member: what the check needs and what the results table shows. */
export type CheckRunMember = Pick<MemberRecord, 'globalId' | 'status' | 'reason' | 'profile' | 'material' | 'flags' | 'tag' | 'name' | 'storey'>;

export interface CheckRunJobInput {
  members: CheckRunMember[];
  /** The result set's governing-shear file (governing-file.ts). */
  governing: Uint8Array;
  matches: MemberMatch[];
  parameters: CheckParameters;
}

export interface CheckRunJobOutput {
  /** Per member, the stored rows' values in MEMBER_RESULT_COLUMNS and MEMBER_DETAIL_COLUMNS order: flat, so they cross the thread cheaply. */
  results: unknown[][];
  details: unknown[][];
  /** The combination names the rows refer to by index. */
  combinations: string[];
  summary: CheckRunSummary;
}

/** Share of the progress bar the computation takes; building the rows takes the rest. */
const COMPUTE_SHARE = 0.9;

export default defineJob((input: CheckRunJobInput, report): CheckRunJobOutput => {
  const table = decodeGoverningTable(Buffer.from(input.governing.buffer, input.governing.byteOffset, input.governing.byteLength));
  const shears = governingShearsByMember(table, input.matches);
  const { members, summary } = computeCheckRun({
    members: input.members,
    shears,
    parameters: input.parameters,
    onProgress: ({ done, total }) => report({ fraction: (COMPUTE_SHARE * done) / total }),
  });
  const combinationIndex = new Map(table.combinations.map((name, index) => [name, index]));
  const results: unknown[][] = [];
  const details: unknown[][] = [];
  members.forEach((check, ordinal) => {
    const values = memberResultValues(memberResultRow(ordinal, input.members[ordinal], check, combinationIndex));
    results.push(values.result);
    details.push(values.detail);
  });
  report({ fraction: 1 });
  return { results, details, combinations: table.combinations, summary };
});
