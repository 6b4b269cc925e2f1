/** The archive-level files: bcf.version, project.bcfp and (3.0) extensions.xml. */
import {
  FINDING_KIND_LABELS,
  FINDING_PRIORITY_LABELS,
  FINDING_STATUS_LABELS,
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

export interface BcfProject {
  id: string;
  name?: string;
}

export function buildVersion(version: BcfVersion): Buffer {
  // 2.1's version.xsd has an optional DetailedVersion; 3.0's has only the attribute.
  const root: XmlNode = version === '2.1' ? { '@_VersionId': '2.1', DetailedVersion: '2.1' } : { '@_VersionId': '3.0' };
  return buildXmlDocument('Version', root);
}

export function buildProject(project: BcfProject, version: BcfVersion): Buffer {
  const projectNode: XmlNode = {
    '@_ProjectId': xmlText(project.id),
    Name: project.name === undefined || project.name.trim() === '' ? undefined : xmlText(project.name),
  };
  if (version === '3.0') return buildXmlDocument('ProjectInfo', { Project: projectNode });
  // ExtensionSchema is required in 2.1 but may be empty: we ship no redefinition schema (our values are in the topics).
  return buildXmlDocument('ProjectExtension', { Project: projectNode, ExtensionSchema: '' });
}

export interface BcfExtensionLists {
  labels: readonly string[];
  users: readonly string[];
}

/** BCF 3.0 extensions.xml: the values a receiving tool should offer for this project. */
export function buildExtensions(lists: BcfExtensionLists): Buffer {
  const labels = distinctTexts(lists.labels);
  const users = distinctTexts(lists.users);
  return buildXmlDocument('Extensions', {
    TopicTypes: { TopicType: Object.values(FINDING_KIND_LABELS) },
    TopicStatuses: { TopicStatus: Object.values(FINDING_STATUS_LABELS) },
    Priorities: { Priority: Object.values(FINDING_PRIORITY_LABELS) },
    TopicLabels: labels.length > 0 ? { TopicLabel: labels } : undefined,
    Users: users.length > 0 ? { User: users } : undefined,
  });
}

/** VersionId as written ("2.1", "3.0", or anything else the caller must refuse). */
export function readVersionId(tree: Record<string, unknown>): string | undefined {
  return attributeOf(tree['Version'], 'VersionId')?.trim();
}

export function readProject(tree: Record<string, unknown>): BcfProject | undefined {
  const root = tree['ProjectInfo'] ?? tree['ProjectExtension'];
  const project = childOf(root, 'Project');
  const id = attributeOf(project, 'ProjectId');
  return id === undefined ? undefined : { id, name: childText(project, 'Name') };
}

export interface ImportedExtensions {
  topicStatuses: string[];
  topicTypes: string[];
  priorities: string[];
  labels: string[];
  users: string[];
}

export function readExtensions(tree: Record<string, unknown>): ImportedExtensions {
  const root = tree['Extensions'];
  const values = (group: string, item: string): string[] =>
    childrenOf(childOf(root, group), item)
      .map(textOf)
      .filter((value): value is string => value !== undefined);
  return {
    topicStatuses: values('TopicStatuses', 'TopicStatus'),
    topicTypes: values('TopicTypes', 'TopicType'),
    priorities: values('Priorities', 'Priority'),
    labels: values('TopicLabels', 'TopicLabel'),
    users: values('Users', 'User'),
  };
}
