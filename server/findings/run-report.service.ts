/**
 * The PDF report of one finished check run: gathers what server/reports/check-report.ts prints from the run record,
 * its member results, the findings for the conditions it found and a calculation sheet (recomputed by the engine, see
 * server/checks/member-sheet.ts) for every member that fails or passes at or above the warning ratio.
 */
import type { DataSource } from 'typeorm';
import { finishedRun, listRunMemberResults, memberSheet } from '../checks/check-results.query';
import { Project } from '../projects/project.entity';
import type { CalculationSheetData, CheckReportData } from '../reports/check-report-data';
import { buildCheckReport } from '../reports/check-report';
import { acceptanceRecords } from './finding-acceptance';
import { toFindingExport } from './finding-export-view';
import { type RunMemberResult, conditionHolds, memberLabelOf } from './finding-sync-plan';
import { Finding } from './finding.entity';

export interface ReportFile {
  fileName: string;
  body: Buffer;
}

/** The findings a run raises or keeps: its members' conditions per kind, and any finding last updated by it. */
function raisedBy(finding: Finding, runId: string, results: ReadonlyMap<string, RunMemberResult>): boolean {
  if (finding.runId === runId) return true;
  const result = finding.memberKey === null ? undefined : results.get(finding.memberKey);
  return finding.kind !== 'manual' && result !== undefined && conditionHolds(finding.kind, result);
}

export class RunReportService {
  constructor(private readonly dataSource: DataSource) {}

  async data(projectId: string, runId: string, generatedBy: string, now = new Date()): Promise<CheckReportData> {
    const run = await finishedRun(this.dataSource, projectId, runId);
    const project = await this.dataSource.getRepository(Project).findOneByOrFail({ id: projectId });
    const results = await listRunMemberResults(this.dataSource, runId);
    const resultsById = new Map(results.map((result) => [result.globalId, result]));
    const findings = (await this.dataSource.getRepository(Finding).find({ where: { projectId }, relations: { assignee: true, createdBy: true }, order: { number: 'ASC' } })).filter(
      (finding) => raisedBy(finding, runId, resultsById),
    );
    const acceptances = await acceptanceRecords(this.dataSource.manager, findings);
    const highest = results.find((result) => result.globalId === run.summary?.maxUtilisationGlobalId);
    const sheets: CalculationSheetData[] = [];
    for (const result of results) {
      if (result.status !== 'fail' && result.status !== 'warning') continue;
      const sheet = await memberSheet({ dataSource: this.dataSource }, projectId, runId, result.globalId);
      if (!sheet.section && !sheet.familySection) continue;
      sheets.push({
        memberLabel: memberLabelOf(result),
        profileName: sheet.member.profile?.name ?? result.profileName ?? '',
        storey: sheet.member.storey ?? undefined,
        section: sheet.section?.input,
        ...(sheet.familySection && sheet.familyStress && { family: { section: sheet.familySection, stress: sheet.familyStress } }),
        ...(sheet.sectionNote ? { sectionNote: sheet.sectionNote } : {}),
        check: sheet.check,
        trace: sheet.trace,
        elasticLimit_MPa: sheet.stress?.elasticLimit_MPa,
      });
    }
    if (!run.summary) throw new Error(`finished run ${run.id} has no summary`);
    return {
      project: { name: project.name, reference: project.code },
      revision: { label: String(run.modelRevisionNumber), fileName: run.modelFileName },
      parameters: run.parameters,
      run: {
        id: run.id,
        startedBy: run.createdByName,
        startedAt: run.createdAt.toISOString(),
        finishedAt: run.finishedAt?.toISOString(),
        engineVersion: run.engineVersion,
        inputFiles: [
          { role: 'IFC model', fileName: run.modelFileName, sha256: run.modelSha256 },
          { role: 'Shear results', fileName: run.resultSetName, sha256: run.resultsSha256 },
        ],
      },
      summary: run.summary,
      highestMemberLabel: highest && memberLabelOf(highest),
      findings: findings.map((finding) => toFindingExport({ finding, comments: [], accepted: acceptances.get(finding.id) })),
      sheets,
      signOff: { prepared: { name: run.createdByName, date: run.finishedAt?.toISOString() } },
      generatedAt: now.toISOString(),
      generatedBy,
    };
  }

  async pdf(projectId: string, runId: string, generatedBy: string): Promise<ReportFile> {
    const data = await this.data(projectId, runId, generatedBy);
    const code = data.project.reference ?? 'project';
    return { fileName: `${code}-check-revision-${data.revision.label}-${runId.slice(0, 8)}.pdf`, body: await buildCheckReport(data) };
  }
}
