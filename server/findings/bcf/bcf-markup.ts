/**
 * markup.bcf: one topic with its comments and viewpoint references. Element order follows markup.xsd of each
 * release; the two differ in where comments and viewpoints sit (2.1: beside the Topic; 3.0: inside it, wrapped)
 * and in how labels and header files are wrapped.
 */
import {
  FINDING_KIND_LABELS,
  FINDING_PRIORITY_LABELS,
  FINDING_STATUS_LABELS,
  type FindingComment,
  type FindingExport,
} from '../export/finding-export';
import type { BcfVersion } from './bcf-version';
import {
  type XmlNode,
  attributeOf,
  buildXmlDocument,
  childOf,
  childText,
  childrenOf,
  distinctTexts,
  textOf,
  xmlText,
} from './bcf-xml';

/** The IFC file a topic refers to, written to the markup Header. */
export interface BcfModelFile {
  fileName: string;
  /** ISO 8601 date-time of the file. */
  date?: string;
  /** GlobalId of the file's IfcProject. */
  ifcProjectGlobalId?: string;
}

export interface MarkupViewpointRef {
  guid: string;
  viewpointFile?: string;
  snapshotFile?: string;
}

/** Optional text: left out when blank, because 3.0 declares these NonEmptyOrBlankString. */
function optionalText(value: string | undefined): string | undefined {
  return value === undefined || value.trim() === '' ? undefined : xmlText(value);
}

function headerNode(files: readonly BcfModelFile[], version: BcfVersion): XmlNode | undefined {
  if (files.length === 0) return undefined;
  const fileNodes = files.map(
    (file): XmlNode => ({
      '@_IfcProject': file.ifcProjectGlobalId,
      [version === '2.1' ? '@_isExternal' : '@_IsExternal']: true,
      Filename: optionalText(file.fileName),
      Date: file.date,
    }),
  );
  return version === '2.1' ? { File: fileNodes } : { Files: { File: fileNodes } };
}

function commentNodes(finding: FindingExport, version: BcfVersion): XmlNode[] {
  return finding.comments.map(
    (comment): XmlNode => ({
      '@_Guid': comment.guid,
      Date: comment.date,
      Author: xmlText(comment.author),
      // 2.1 requires the element (empty allowed); 3.0 makes it optional but forbids blank.
      Comment: version === '2.1' ? xmlText(comment.text) : optionalText(comment.text),
      ModifiedDate: comment.modifiedDate,
      ModifiedAuthor: optionalText(comment.modifiedAuthor),
    }),
  );
}

function viewpointNode(ref: MarkupViewpointRef): XmlNode {
  return { '@_Guid': ref.guid, Viewpoint: ref.viewpointFile, Snapshot: ref.snapshotFile };
}

/**
 * Builds markup.bcf for one finding. Dates must already be ISO 8601 date-times and GUIDs checked; labels blank or
 * repeated are dropped.
 */
export function buildMarkup(
  finding: FindingExport,
  version: BcfVersion,
  viewpoint: MarkupViewpointRef | undefined,
  modelFiles: readonly BcfModelFile[],
): Buffer {
  const labels = distinctTexts(finding.labels);
  const comments = commentNodes(finding, version);
  const viewpoints = viewpoint ? [viewpointNode(viewpoint)] : [];
  const topic: XmlNode = {
    '@_Guid': finding.guid,
    '@_TopicType': FINDING_KIND_LABELS[finding.kind],
    '@_TopicStatus': FINDING_STATUS_LABELS[finding.status],
    Title: xmlText(finding.title.trim()),
    Priority: FINDING_PRIORITY_LABELS[finding.priority],
    Labels: version === '2.1' ? labels : labels.length > 0 ? { Label: labels } : undefined,
    CreationDate: finding.createdAt,
    CreationAuthor: xmlText(finding.createdBy),
    ModifiedDate: finding.modifiedAt,
    ModifiedAuthor: optionalText(finding.modifiedBy),
    DueDate: finding.dueDate,
    AssignedTo: optionalText(finding.assigneeEmail),
    Description: optionalText(finding.description),
    ...(version === '3.0' && {
      Comments: comments.length > 0 ? { Comment: comments } : undefined,
      Viewpoints: viewpoints.length > 0 ? { ViewPoint: viewpoints } : undefined,
    }),
  };
  const markup: XmlNode = {
    Header: headerNode(modelFiles, version),
    Topic: topic,
    ...(version === '2.1' && { Comment: comments, Viewpoints: viewpoints }),
  };
  return buildXmlDocument('Markup', markup);
}

export interface ImportedComment extends FindingComment {
  viewpointGuid?: string;
}

export interface ImportedTopicMarkup {
  guid: string;
  /** TopicType and TopicStatus exactly as written in the file. */
  topicType?: string;
  status?: string;
  title: string;
  priority?: string;
  labels: string[];
  creationDate?: string;
  creationAuthor?: string;
  modifiedDate?: string;
  modifiedAuthor?: string;
  dueDate?: string;
  assignedTo?: string;
  description?: string;
  comments: ImportedComment[];
  viewpointRefs: MarkupViewpointRef[];
}

function readComment(node: unknown): ImportedComment {
  return {
    guid: attributeOf(node, 'Guid') ?? '',
    author: childText(node, 'Author') ?? '',
    date: childText(node, 'Date') ?? '',
    text: childText(node, 'Comment') ?? '',
    modifiedDate: childText(node, 'ModifiedDate'),
    modifiedAuthor: childText(node, 'ModifiedAuthor'),
    viewpointGuid: attributeOf(childOf(node, 'Viewpoint'), 'Guid'),
  };
}

function readViewpointRef(node: unknown): MarkupViewpointRef {
  return {
    guid: attributeOf(node, 'Guid') ?? '',
    viewpointFile: childText(node, 'Viewpoint'),
    snapshotFile: childText(node, 'Snapshot'),
  };
}

/**
 * Reads a parsed markup.bcf of either release. Returns undefined when there is no Topic element; GUIDs are
 * returned as written and checked by the caller.
 */
export function readMarkup(tree: Record<string, unknown>, version: BcfVersion): ImportedTopicMarkup | undefined {
  const markup = tree['Markup'];
  const topic = childOf(markup, 'Topic');
  if (topic === undefined) return undefined;
  const labels =
    version === '2.1'
      ? childrenOf(topic, 'Labels').map(textOf)
      : childrenOf(childOf(topic, 'Labels'), 'Label').map(textOf);
  const comments =
    version === '2.1' ? childrenOf(markup, 'Comment') : childrenOf(childOf(topic, 'Comments'), 'Comment');
  const viewpoints =
    version === '2.1' ? childrenOf(markup, 'Viewpoints') : childrenOf(childOf(topic, 'Viewpoints'), 'ViewPoint');
  return {
    guid: attributeOf(topic, 'Guid') ?? '',
    topicType: attributeOf(topic, 'TopicType'),
    status: attributeOf(topic, 'TopicStatus'),
    title: childText(topic, 'Title') ?? '',
    priority: childText(topic, 'Priority'),
    labels: labels.filter((label): label is string => label !== undefined),
    creationDate: childText(topic, 'CreationDate'),
    creationAuthor: childText(topic, 'CreationAuthor'),
    modifiedDate: childText(topic, 'ModifiedDate'),
    modifiedAuthor: childText(topic, 'ModifiedAuthor'),
    dueDate: childText(topic, 'DueDate'),
    assignedTo: childText(topic, 'AssignedTo'),
    description: childText(topic, 'Description'),
    comments: comments.map(readComment),
    viewpointRefs: viewpoints.map(readViewpointRef),
  };
}
