/**
 * Reads a BCF 2.1 or 3.0 archive into plain data: topics with their status, comments and viewpoints. Nothing is
 * applied here: the caller compares the result with its findings and changes them only when the whole file read
 * cleanly (parse, then apply). Every refusal names the entry or topic folder it comes from.
 */
import { ConflictError, ValidationError } from '../../http/errors';
import { FINDING_STATUS_LABELS, type FindingStatus } from '../export/finding-export';
import { type ArchiveLimits, DEFAULT_ARCHIVE_LIMITS, type OpenedArchive, openArchive } from './bcf-archive-reader';
import { isIfcGlobalId, isUuid } from './bcf-guid';
import { type ImportedComment, type ImportedTopicMarkup, type MarkupViewpointRef, readMarkup } from './bcf-markup';
import { type BcfProject, type ImportedExtensions, readExtensions, readProject, readVersionId } from './bcf-project';
import {
  BCF_VERSIONS,
  type BcfVersion,
  EXTENSIONS_ENTRY,
  MARKUP_FILE,
  PROJECT_ENTRY,
  SNAPSHOT_FILE,
  VERSION_ENTRY,
  VIEWPOINT_FILE,
} from './bcf-version';
import { type ImportedViewpoint, readVisinfo } from './bcf-visinfo';
import { parseXmlEntry } from './bcf-xml';

export interface BcfImportOptions {
  /** GUIDs of the project's findings; topics not among them are reported as unknown. */
  knownTopicGuids?: Iterable<string>;
  /** GlobalIds of the model's elements; selected or listed components not among them are reported as unknown. */
  knownGlobalIds?: Iterable<string>;
  /** `report` (default) returns unknown GUIDs in the result; `reject` refuses the file and lists them. */
  unknownGuids?: 'report' | 'reject';
  limits?: Partial<ArchiveLimits>;
}

export interface ImportedTopicViewpoint extends ImportedViewpoint {
  snapshotPng?: Buffer;
}

export interface ImportedTopic extends Omit<ImportedTopicMarkup, 'viewpointRefs'> {
  folder: string;
  /** Our status for the file's TopicStatus; undefined when it is not one of ours (see `unknown.statuses`). */
  statusId?: FindingStatus;
  viewpoints: ImportedTopicViewpoint[];
}

export interface BcfImportResult {
  version: BcfVersion;
  project?: BcfProject;
  extensions?: ImportedExtensions;
  topics: ImportedTopic[];
  /**
   * Topic GUIDs not in `knownTopicGuids`; GlobalIds not in `knownGlobalIds` (without that list: those that are not
   * 22-character GlobalIds at all); TopicStatus values that are not ours.
   */
  unknown: { topicGuids: string[]; globalIds: string[]; statuses: string[] };
  /** Things that did not stop the import but that the person importing should see. */
  warnings: string[];
}

const TOPIC_ENTRY = /^([^/]+)\/([^/]+)$/;
/** How many unknown GUIDs a refusal message spells out; all of them are in `details`. */
const LISTED_IN_MESSAGE = 5;

function invalid(message: string, code: string): ValidationError {
  return new ValidationError(message, { code });
}

async function readXml(archive: OpenedArchive, name: string): Promise<Record<string, unknown>> {
  return parseXmlEntry(await archive.read(name), name);
}

async function readVersion(archive: OpenedArchive): Promise<BcfVersion> {
  if (!archive.names.includes(VERSION_ENTRY)) {
    throw invalid(`The zip has no ${VERSION_ENTRY} at its root, so it is not a BCF archive.`, 'bcf_not_bcf');
  }
  const versionId = readVersionId(await readXml(archive, VERSION_ENTRY));
  const version = BCF_VERSIONS.find((candidate) => candidate === versionId);
  if (!version) {
    throw invalid(
      `${VERSION_ENTRY} says BCF version ${JSON.stringify(versionId ?? '')}; Taulens reads BCF ${BCF_VERSIONS.join(' and ')}.`,
      'bcf_unsupported_version',
    );
  }
  return version;
}

/** Folder name → file names inside it, for entries one level deep. */
function foldersOf(names: readonly string[]): Map<string, Set<string>> {
  const folders = new Map<string, Set<string>>();
  for (const name of names) {
    const match = TOPIC_ENTRY.exec(name);
    if (!match) continue;
    const files = folders.get(match[1]) ?? new Set<string>();
    files.add(match[2]);
    folders.set(match[1], files);
  }
  return folders;
}

function isoDate(value: string | undefined, what: string): string | undefined {
  if (value === undefined) return undefined;
  const time = Date.parse(value);
  if (!Number.isFinite(time)) throw invalid(`${what} is not a date: ${JSON.stringify(value)}.`, 'bcf_invalid_topic');
  return new Date(time).toISOString();
}

function checkComment(comment: ImportedComment, index: number, folder: string): ImportedComment {
  const where = `Comment ${index + 1} in topic folder ${folder}`;
  if (!isUuid(comment.guid)) throw invalid(`${where} has no valid Guid (${JSON.stringify(comment.guid)}).`, 'bcf_invalid_topic');
  return {
    ...comment,
    guid: comment.guid.toLowerCase(),
    date: isoDate(comment.date, `${where}: Date`) ?? '',
    modifiedDate: isoDate(comment.modifiedDate, `${where}: ModifiedDate`),
    viewpointGuid: comment.viewpointGuid?.toLowerCase(),
  };
}

const STATUS_BY_LABEL = new Map(
  Object.entries(FINDING_STATUS_LABELS).map(([id, label]) => [label.toLowerCase(), id as FindingStatus]),
);

/** Matches our labels regardless of case and spacing ("In Progress", "ready  to verify"). */
export function statusFromLabel(label: string | undefined): FindingStatus | undefined {
  return label === undefined ? undefined : STATUS_BY_LABEL.get(label.trim().replace(/\s+/g, ' ').toLowerCase());
}

/** 2.0-style archives list no viewpoints in the markup but keep the default viewpoint.bcfv in the folder. */
function defaultViewpointRefs(files: ReadonlySet<string>): MarkupViewpointRef[] {
  if (!files.has(VIEWPOINT_FILE)) return [];
  return [{ guid: '', viewpointFile: VIEWPOINT_FILE, snapshotFile: files.has(SNAPSHOT_FILE) ? SNAPSHOT_FILE : undefined }];
}

async function readViewpoints(
  archive: OpenedArchive,
  folder: string,
  refs: readonly MarkupViewpointRef[],
  warnings: string[],
): Promise<ImportedTopicViewpoint[]> {
  const viewpoints: ImportedTopicViewpoint[] = [];
  for (const ref of refs) {
    const name = `${folder}/${ref.viewpointFile ?? ''}`;
    if (ref.viewpointFile === undefined || !archive.names.includes(name)) {
      warnings.push(`Topic folder ${folder} lists viewpoint ${ref.viewpointFile ?? '(no file)'} but the file is not in the archive.`);
      continue;
    }
    const viewpoint = readVisinfo(await readXml(archive, name));
    const snapshotName = `${folder}/${ref.snapshotFile ?? ''}`;
    const snapshotPng = ref.snapshotFile !== undefined && archive.names.includes(snapshotName) ? await archive.read(snapshotName) : undefined;
    viewpoints.push({ ...viewpoint, guid: (ref.guid || viewpoint.guid).toLowerCase(), snapshotPng });
  }
  return viewpoints;
}

async function readTopic(
  archive: OpenedArchive,
  version: BcfVersion,
  folder: string,
  files: ReadonlySet<string>,
  warnings: string[],
): Promise<ImportedTopic> {
  if (!files.has(MARKUP_FILE)) {
    throw invalid(`Topic folder ${folder} has no ${MARKUP_FILE}; every topic needs one.`, 'bcf_missing_markup');
  }
  const markup = readMarkup(await readXml(archive, `${folder}/${MARKUP_FILE}`), version);
  if (!markup) throw invalid(`${folder}/${MARKUP_FILE} has no Topic element.`, 'bcf_missing_markup');
  if (!isUuid(markup.guid)) {
    throw invalid(`The topic in folder ${folder} has no valid Guid (${JSON.stringify(markup.guid)}).`, 'bcf_invalid_topic');
  }
  const guid = markup.guid.toLowerCase();
  if (guid !== folder.toLowerCase()) warnings.push(`Topic ${guid} is stored in folder ${folder}, not in a folder named after it.`);
  const { viewpointRefs, ...fields } = markup;
  const refs = viewpointRefs.length > 0 ? viewpointRefs : defaultViewpointRefs(files);
  return {
    ...fields,
    guid,
    folder,
    statusId: statusFromLabel(markup.status),
    creationDate: isoDate(markup.creationDate, `Topic ${guid}: CreationDate`),
    modifiedDate: isoDate(markup.modifiedDate, `Topic ${guid}: ModifiedDate`),
    dueDate: isoDate(markup.dueDate, `Topic ${guid}: DueDate`),
    comments: markup.comments.map((comment, i) => checkComment(comment, i, folder)),
    viewpoints: await readViewpoints(archive, folder, refs, warnings),
  };
}

function requireDistinctGuids(topics: readonly ImportedTopic[]): void {
  const folders = new Map<string, string>();
  for (const topic of topics) {
    const other = folders.get(topic.guid);
    if (other !== undefined) {
      throw invalid(`Topic ${topic.guid} appears twice (folders ${other} and ${topic.folder}).`, 'bcf_invalid_topic');
    }
    folders.set(topic.guid, topic.folder);
  }
}

function unknownOf(topics: readonly ImportedTopic[], options: BcfImportOptions): BcfImportResult['unknown'] {
  const knownTopics = options.knownTopicGuids && new Set([...options.knownTopicGuids].map((guid) => guid.toLowerCase()));
  const knownElements = options.knownGlobalIds && new Set(options.knownGlobalIds);
  const referenced = new Set(
    topics.flatMap((topic) =>
      topic.viewpoints.flatMap((viewpoint) => [...viewpoint.selectedGlobalIds, ...viewpoint.visibility.exceptionGlobalIds]),
    ),
  );
  return {
    topicGuids: knownTopics ? topics.map((topic) => topic.guid).filter((guid) => !knownTopics.has(guid)) : [],
    globalIds: [...referenced].filter((id) => (knownElements ? !knownElements.has(id) : !isIfcGlobalId(id))),
    statuses: [...new Set(topics.filter((topic) => topic.statusId === undefined).map((topic) => topic.status ?? '(none)'))],
  };
}

/** Refuses the file when it refers to unknown topics or elements, listing them; callers may pass only the lists they enforce. */
export function rejectUnknown(unknown: Pick<BcfImportResult['unknown'], 'topicGuids' | 'globalIds'>): void {
  const parts: string[] = [];
  const list = (ids: string[]): string =>
    ids.slice(0, LISTED_IN_MESSAGE).join(', ') + (ids.length > LISTED_IN_MESSAGE ? ` and ${ids.length - LISTED_IN_MESSAGE} more` : '');
  if (unknown.topicGuids.length > 0) parts.push(`${unknown.topicGuids.length} topic(s) that match no finding of this project (${list(unknown.topicGuids)})`);
  if (unknown.globalIds.length > 0) parts.push(`${unknown.globalIds.length} element GlobalId(s) not in the model (${list(unknown.globalIds)})`);
  if (parts.length === 0) return;
  throw new ConflictError(`The BCF file was not imported: it refers to ${parts.join(' and ')}. Nothing was changed.`, {
    code: 'bcf_unknown_guids',
    details: { topicGuids: unknown.topicGuids, globalIds: unknown.globalIds },
  });
}

export async function importBcf(archiveBytes: Buffer, options: BcfImportOptions = {}): Promise<BcfImportResult> {
  const archive = await openArchive(archiveBytes, { ...DEFAULT_ARCHIVE_LIMITS, ...options.limits });
  try {
    const version = await readVersion(archive);
    const project = archive.names.includes(PROJECT_ENTRY) ? readProject(await readXml(archive, PROJECT_ENTRY)) : undefined;
    const extensions =
      version === '3.0' && archive.names.includes(EXTENSIONS_ENTRY) ? readExtensions(await readXml(archive, EXTENSIONS_ENTRY)) : undefined;
    const warnings: string[] = [];
    const topics: ImportedTopic[] = [];
    for (const [folder, files] of foldersOf(archive.names)) {
      // Topic folders are named by GUID; other folders (3.0 documents, archiver leftovers) hold no topics.
      if (!isUuid(folder) && !files.has(MARKUP_FILE)) continue;
      topics.push(await readTopic(archive, version, folder, files, warnings));
    }
    requireDistinctGuids(topics);
    const unknown = unknownOf(topics, options);
    if (options.unknownGuids === 'reject') rejectUnknown(unknown);
    return { version, project, extensions, topics, unknown, warnings };
  } finally {
    archive.close();
  }
}
