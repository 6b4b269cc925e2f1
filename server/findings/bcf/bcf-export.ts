/**
 * Writes findings as a BCF archive (BCF 2.1 or 3.0): bcf.version, project.bcfp, for 3.0 extensions.xml, and one
 * folder per topic GUID holding markup.bcf, viewpoint.bcfv and, when there is one, snapshot.png.
 * Everything is checked before the first byte is written, so bad data gives one clear error and no archive.
 */
import { ZipFile } from 'yazl';
import { ConflictError } from '../../http/errors';
import type { FindingExport } from '../export/finding-export';
import { type CheckedFinding, checkFindingForBcf, requireDistinctTopics } from './bcf-export-check';
import { type BcfModelFile, buildMarkup } from './bcf-markup';
import { type BcfProject, buildExtensions, buildProject, buildVersion } from './bcf-project';
import {
  type BcfVersion,
  EXTENSIONS_ENTRY,
  MARKUP_FILE,
  PROJECT_ENTRY,
  SNAPSHOT_FILE,
  VERSION_ENTRY,
  VIEWPOINT_FILE,
} from './bcf-version';
import { buildVisinfo } from './bcf-visinfo';

export interface BcfExportOptions {
  version: BcfVersion;
  project: BcfProject;
  /** The IFC file(s) the findings refer to, named in every topic's header. */
  modelFiles?: readonly BcfModelFile[];
  /** Users to list in 3.0's extensions.xml besides every author and assignee found in the findings. */
  users?: readonly string[];
  /** Timestamp of the archive entries; defaults to now. */
  exportedAt?: Date;
}

export interface BcfEntry {
  name: string;
  bytes: Buffer;
}

function usersOf(findings: readonly CheckedFinding[], extra: readonly string[]): string[] {
  return [
    ...extra,
    ...findings.flatMap((finding) => [
      finding.createdBy,
      finding.modifiedBy ?? '',
      finding.assigneeEmail ?? '',
      ...finding.comments.flatMap((comment) => [comment.author, comment.modifiedAuthor ?? '']),
    ]),
  ];
}

function topicEntries(finding: CheckedFinding, options: BcfExportOptions): BcfEntry[] {
  const folder = finding.guid;
  const snapshot = finding.snapshotPng === undefined ? undefined : Buffer.from(finding.snapshotPng);
  const markup = buildMarkup(
    finding,
    options.version,
    { guid: finding.viewpoint.guid, viewpointFile: VIEWPOINT_FILE, snapshotFile: snapshot && SNAPSHOT_FILE },
    options.modelFiles ?? [],
  );
  const entries: BcfEntry[] = [
    { name: `${folder}/${MARKUP_FILE}`, bytes: markup },
    { name: `${folder}/${VIEWPOINT_FILE}`, bytes: buildVisinfo(finding.viewpoint.guid, finding.viewpoint, options.version) },
  ];
  if (snapshot) entries.push({ name: `${folder}/${SNAPSHOT_FILE}`, bytes: snapshot });
  return entries;
}

/** The archive's files in order, before zipping; also what the schema tests validate. */
export function bcfEntries(findings: readonly FindingExport[], options: BcfExportOptions): BcfEntry[] {
  if (options.project.id.trim() === '') {
    throw new ConflictError('The project id written to project.bcfp must not be blank.', { code: 'bcf_export_invalid' });
  }
  const checked = findings.map((finding) => checkFindingForBcf(finding, options.version));
  requireDistinctTopics(checked);
  const entries: BcfEntry[] = [
    { name: VERSION_ENTRY, bytes: buildVersion(options.version) },
    { name: PROJECT_ENTRY, bytes: buildProject(options.project, options.version) },
  ];
  if (options.version === '3.0') {
    const labels = checked.flatMap((finding) => finding.labels);
    entries.push({ name: EXTENSIONS_ENTRY, bytes: buildExtensions({ labels, users: usersOf(checked, options.users ?? []) }) });
  }
  return entries.concat(checked.flatMap((finding) => topicEntries(finding, options)));
}

/** The .bcfzip archive as one buffer. */
export async function exportBcf(findings: readonly FindingExport[], options: BcfExportOptions): Promise<Buffer> {
  const entries = bcfEntries(findings, options);
  const mtime = options.exportedAt ?? new Date();
  const zip = new ZipFile();
  for (const entry of entries) {
    // PNG is already deflated; storing it saves time and nothing else.
    zip.addBuffer(entry.bytes, entry.name, { mtime, compress: !entry.name.endsWith('.png') });
  }
  zip.end();
  const chunks: Buffer[] = [];
  for await (const chunk of zip.outputStream) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks);
}
