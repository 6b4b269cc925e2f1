/**
 * Findings leaving and coming back: BCF 2.1 / 3.0 archives, CSV, and the BCF round trip (statuses and comments).
 * An import reads the whole file first, then applies it in one transaction; any problem leaves everything as it was.
 */
import { type DataSource, In } from 'typeorm';
import { type Action, can } from '../auth/permissions';
import { runTransaction } from '../data-source';
import { ConflictError, ValidationError } from '../http/errors';
import { latestReadyRevision, loadMemberRecords } from '../models/model-queries';
import type { FindingNotice, NoticeSink } from '../notifications/finding-notifier';
import { Project } from '../projects/project.entity';
import type { FileStorage } from '../storage/file-storage';
import { exportBcf } from './bcf/bcf-export';
import { importBcf, rejectUnknown } from './bcf/bcf-import';
import { importedCommentRow } from './bcf/bcf-imported-comment';
import type { BcfVersion } from './bcf/bcf-version';
import type { BcfImportSummary } from './finding-api-types';
import { planBcfImport } from './bcf-import-plan';
import type { FindingExport } from './export/finding-export';
import { findingsCsv } from './export/findings-csv';
import { acceptanceCommentGuids, acceptanceRecords } from './finding-acceptance';
import { axisBoxes, viewpointWithCamera } from './finding-camera';
import { FindingComment } from './finding-comment.entity';
import { toFindingExport } from './finding-export-view';
import { recordChanges } from './finding-history';
import { filteredFindings } from './finding-query';
import type { FindingFilters } from './finding-requests';
import type { FindingAccess, FindingActor } from './finding.service';
import { Finding } from './finding.entity';

export interface ExportFile {
  fileName: string;
  contentType: string;
  body: Buffer | string;
}

const ACCEPTED_UPLOAD = /\.(bcf|bcfzip)$/i;
const INSERT_CHUNK = 100;
/** How many problems a refusal spells out; all are in `details`. */
const LISTED_PROBLEMS = 3;

export class FindingExchangeService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly storage: FileStorage,
    private readonly notifier: NoticeSink,
  ) {}

  /** The project's findings matching the filters, oldest first, as the exporters read them. */
  async forExport(projectId: string, filters: FindingFilters, me: string, withSnapshots: boolean): Promise<FindingExport[]> {
    const manager = this.dataSource.manager;
    const findings = await filteredFindings(manager, projectId, filters, me).orderBy('f.number', 'ASC').getMany();
    const ids = findings.map((finding) => finding.id);
    const comments = ids.length === 0 ? [] : await manager.find(FindingComment, { where: { findingId: In(ids) }, relations: { author: true }, order: { createdAt: 'ASC' } });
    const commentsOf = new Map<string, FindingComment[]>();
    for (const comment of comments) {
      const list = commentsOf.get(comment.findingId);
      if (list) list.push(comment);
      else commentsOf.set(comment.findingId, [comment]);
    }
    const acceptances = await acceptanceRecords(manager, findings);
    const exports: FindingExport[] = [];
    for (const finding of findings) {
      const snapshotPng = withSnapshots && finding.snapshotKey ? await this.storage.get(finding.snapshotKey) : undefined;
      exports.push(toFindingExport({ finding, comments: commentsOf.get(finding.id) ?? [], snapshotPng, accepted: acceptances.get(finding.id) }));
    }
    return exports;
  }

  async bcf(projectId: string, filters: FindingFilters, me: string, version: BcfVersion): Promise<ExportFile> {
    const project = await this.dataSource.getRepository(Project).findOneByOrFail({ id: projectId });
    const findings = await this.withCameras(projectId, await this.forExport(projectId, filters, me, true));
    const revision = await latestReadyRevision(this.dataSource, projectId);
    const body = await exportBcf(findings, {
      version,
      project: { id: project.id, name: project.name },
      modelFiles: revision ? [{ fileName: revision.fileName, date: revision.uploadedAt }] : [],
    });
    return { fileName: `${project.code}-findings-bcf-${version}.bcf`, contentType: 'application/zip', body };
  }

  async csv(projectId: string, filters: FindingFilters, me: string): Promise<ExportFile> {
    const project = await this.dataSource.getRepository(Project).findOneByOrFail({ id: projectId });
    const body = findingsCsv(await this.forExport(projectId, filters, me, false));
    return { fileName: `${project.code}-findings.csv`, contentType: 'text/csv; charset=utf-8', body };
  }

  /** Findings without a camera get one framing their members in the newest ready revision (BCF 3.0 needs one). */
  private async withCameras(projectId: string, findings: FindingExport[]): Promise<FindingExport[]> {
    if (findings.every((finding) => finding.viewpoint?.camera)) return findings;
    const revision = await latestReadyRevision(this.dataSource, projectId);
    const boxes = axisBoxes(revision ? await loadMemberRecords(this.dataSource, revision.id) : []);
    return findings.map((finding) => ({ ...finding, viewpoint: viewpointWithCamera(finding.memberGlobalIds, finding.viewpoint, boxes) }));
  }

  async importBcf(projectId: string, upload: { originalname: string; buffer: Buffer }, access: FindingAccess, actor: FindingActor): Promise<BcfImportSummary> {
    if (!ACCEPTED_UPLOAD.test(upload.originalname)) {
      throw new ValidationError(`“${upload.originalname}” is not a BCF file: choose a .bcf or .bcfzip file.`, { code: 'bcf_wrong_file_type' });
    }
    const findings = await this.dataSource.getRepository(Finding).find({ where: { projectId }, select: { id: true, number: true, guid: true, status: true } });
    const imported = await importBcf(upload.buffer, { knownTopicGuids: findings.map((finding) => finding.guid), unknownGuids: 'report' });
    // Viewpoints are not imported, so only topics have to be known.
    rejectUnknown({ topicGuids: imported.unknown.topicGuids, globalIds: [] });
    const grants = (action: Action) => can(access, action);

    const { summary, notices } = await runTransaction(this.dataSource, async (manager) => {
      const current = await manager.find(Finding, { where: { projectId }, select: { id: true, number: true, guid: true, status: true, kind: true } });
      const targets = new Map(current.map((finding) => [finding.guid, finding]));
      const commentGuids = imported.topics.flatMap((topic) => topic.comments.map((comment) => comment.guid));
      const known = commentGuids.length === 0 ? [] : await manager.find(FindingComment, { where: { guid: In(commentGuids) }, select: { guid: true } });
      // The comments our exports write for acceptances are already in the findings, as their justification.
      const knownGuids = new Set([...known.map((comment) => comment.guid), ...(await acceptanceCommentGuids(manager, projectId))]);
      const plan = planBcfImport(imported.topics, targets, knownGuids, grants);
      if (plan.problems.length > 0) {
        const listed = plan.problems.slice(0, LISTED_PROBLEMS).map((problem) => problem.message).join(' ');
        const more = plan.problems.length > LISTED_PROBLEMS ? ` And ${plan.problems.length - LISTED_PROBLEMS} more.` : '';
        throw new ConflictError(`The BCF file was not imported; nothing was changed. ${listed}${more}`, {
          code: 'bcf_import_refused',
          details: { problems: plan.problems },
        });
      }
      for (const change of plan.statusChanges) {
        await manager.update(Finding, change.findingId, { status: change.to, ...(change.clearsJustification && { justification: null }) });
      }
      const importedAt = new Date();
      const rows = plan.comments.map((comment) => importedCommentRow(comment, actor, importedAt));
      for (let start = 0; start < rows.length; start += INSERT_CHUNK) await manager.insert(FindingComment, rows.slice(start, start + INSERT_CHUNK));
      await recordChanges(
        manager,
        { id: actor.id, source: 'bcf-import' },
        plan.statusChanges.map((change) => ({ findingId: change.findingId, field: 'status', from: change.from, to: change.to })),
      );
      const notices: FindingNotice[] = plan.statusChanges.map((change) => ({
        kind: 'status-changed',
        projectId,
        findingId: change.findingId,
        from: change.from,
        to: change.to,
        actorId: actor.id,
      }));
      return {
        notices,
        summary: {
          version: imported.version,
          topics: imported.topics.length,
          statusChanges: plan.statusChanges.length,
          commentsAdded: plan.comments.length,
          unchanged: plan.unchanged,
          warnings: [...imported.warnings, ...plan.warnings],
        },
      };
    });
    await this.notifier.deliver(notices);
    return summary;
  }
}
