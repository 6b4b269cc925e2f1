/**
 * Checks and normalises findings before they are written to BCF, so every file in the archive is valid against
 * the release's XSDs: UUIDs in lowercase (3.0's Guid pattern), ISO 8601 date-times, 22-character GlobalIds, finite
 * camera numbers. A problem names the finding and the field; it is a ConflictError because the request is fine
 * but the stored findings cannot be written as they are.
 */
import { ConflictError } from '../../http/errors';
import type {
  ClippingPlane,
  FindingAcceptance,
  FindingCamera,
  FindingComment,
  FindingExport,
  FindingViewpoint,
  ModelVector,
} from '../export/finding-export';
import { isIfcGlobalId, isUuid, nameBasedUuid } from './bcf-guid';
import type { BcfVersion } from './bcf-version';

const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

/** A finding whose fields are safe to write; `viewpoint` always present (derived from the members if needed). */
export interface CheckedFinding extends FindingExport {
  viewpoint: FindingViewpoint & { guid: string };
}

class FindingProblem {
  constructor(
    readonly findingId: string,
    readonly version: BcfVersion,
  ) {}

  fail(field: string, message: string): never {
    throw new ConflictError(`Finding ${this.findingId}: ${field} ${message}`, {
      code: 'bcf_export_invalid',
      details: { findingId: this.findingId, field, version: this.version },
    });
  }

  uuid(value: string | undefined, field: string): string {
    if (value === undefined || !isUuid(value)) this.fail(field, `must be a UUID, got ${JSON.stringify(value)}`);
    return value.toLowerCase();
  }

  text(value: string | undefined, field: string): string {
    if (value === undefined || value.trim() === '') this.fail(field, 'must not be blank');
    return value;
  }

  dateTime(value: string, field: string): string;
  dateTime(value: string | undefined, field: string): string | undefined;
  dateTime(value: string | undefined, field: string): string | undefined {
    if (value === undefined) return undefined;
    const time = Date.parse(value);
    if (!Number.isFinite(time)) this.fail(field, `must be an ISO 8601 date, got ${JSON.stringify(value)}`);
    return new Date(time).toISOString();
  }

  globalIds(values: readonly string[], field: string): string[] {
    const bad = values.find((value) => !isIfcGlobalId(value));
    if (bad !== undefined) this.fail(field, `holds ${JSON.stringify(bad)}, which is not a 22-character IFC GlobalId`);
    return [...new Set(values)];
  }

  vector(vector: ModelVector, field: string, nonZero: boolean): ModelVector {
    if (vector.length !== 3 || !vector.every(Number.isFinite)) this.fail(field, 'must be three finite numbers');
    if (nonZero && vector.every((component) => component === 0)) this.fail(field, 'must not be the zero vector');
    return [vector[0], vector[1], vector[2]];
  }

  positive(value: number, field: string, below?: number): number {
    if (!Number.isFinite(value) || value <= 0 || (below !== undefined && value >= below)) {
      this.fail(field, `must be a number above 0${below === undefined ? '' : ` and below ${below}`}, got ${value}`);
    }
    return value;
  }
}

function checkCamera(camera: FindingCamera, problem: FindingProblem): FindingCamera {
  const placement = {
    viewPoint_m: problem.vector(camera.viewPoint_m, 'viewpoint.camera.viewPoint_m', false),
    direction: problem.vector(camera.direction, 'viewpoint.camera.direction', true),
    up: problem.vector(camera.up, 'viewpoint.camera.up', true),
    aspectRatio: problem.positive(camera.aspectRatio, 'viewpoint.camera.aspectRatio'),
  };
  if (camera.kind === 'orthogonal') {
    return { kind: 'orthogonal', ...placement, viewToWorldScale_m: problem.positive(camera.viewToWorldScale_m, 'viewpoint.camera.viewToWorldScale_m') };
  }
  return { kind: 'perspective', ...placement, fieldOfView_deg: problem.positive(camera.fieldOfView_deg, 'viewpoint.camera.fieldOfView_deg', 180) };
}

function checkViewpoint(finding: FindingExport, topicGuid: string, problem: FindingProblem): CheckedFinding['viewpoint'] {
  const source: FindingViewpoint = finding.viewpoint ?? {
    selectedGlobalIds: finding.memberGlobalIds,
    visibility: { defaultVisible: true, exceptionGlobalIds: [] },
  };
  const camera = source.camera && checkCamera(source.camera, problem);
  if (camera === undefined && problem.version === '3.0') {
    problem.fail('viewpoint.camera', 'is missing; BCF 3.0 viewpoints need a camera (frame the members with framingCamera)');
  }
  const planes = (source.clippingPlanes ?? []).map(
    (plane, i): ClippingPlane => ({
      location_m: problem.vector(plane.location_m, `viewpoint.clippingPlanes[${i}].location_m`, false),
      direction: problem.vector(plane.direction, `viewpoint.clippingPlanes[${i}].direction`, true),
    }),
  );
  return {
    guid: source.guid === undefined ? nameBasedUuid(topicGuid, 'viewpoint') : problem.uuid(source.guid, 'viewpoint.guid'),
    camera,
    selectedGlobalIds: problem.globalIds(source.selectedGlobalIds, 'viewpoint.selectedGlobalIds'),
    visibility: {
      defaultVisible: source.visibility.defaultVisible,
      exceptionGlobalIds: problem.globalIds(source.visibility.exceptionGlobalIds, 'viewpoint.visibility.exceptionGlobalIds'),
    },
    clippingPlanes: planes,
  };
}

function checkComment(comment: FindingComment, i: number, problem: FindingProblem): FindingComment {
  return {
    guid: problem.uuid(comment.guid, `comments[${i}].guid`),
    author: problem.text(comment.author, `comments[${i}].author`),
    date: problem.dateTime(comment.date, `comments[${i}].date`),
    text: comment.text,
    modifiedDate: problem.dateTime(comment.modifiedDate, `comments[${i}].modifiedDate`),
    modifiedAuthor: comment.modifiedAuthor,
  };
}

/**
 * The comment that carries an acceptance into BCF, whose topics have no field for it. Its GUID is derived from the
 * topic and the time of acceptance, so every export writes the same one and an import can recognise it.
 */
export function acceptanceCommentGuid(topicGuid: string, acceptedAt: string): string {
  return nameBasedUuid(topicGuid, `acceptance ${new Date(acceptedAt).toISOString()}`);
}

function acceptanceComment(acceptance: FindingAcceptance, topicGuid: string, problem: FindingProblem): FindingComment {
  const date = problem.dateTime(acceptance.date, 'acceptance.date');
  return {
    guid: acceptanceCommentGuid(topicGuid, date),
    author: problem.text(acceptance.author, 'acceptance.author'),
    date,
    text: `Accepted as it is: ${problem.text(acceptance.justification, 'acceptance.justification')}`,
  };
}

/** The finding's comments in date order, the acceptance among them. */
function commentsOf(finding: FindingExport, topicGuid: string, problem: FindingProblem): FindingComment[] {
  const comments = finding.comments.map((comment, i) => checkComment(comment, i, problem));
  if (finding.acceptance) comments.push(acceptanceComment(finding.acceptance, topicGuid, problem));
  return comments.sort((a, b) => Date.parse(a.date) - Date.parse(b.date));
}

export function checkFindingForBcf(finding: FindingExport, version: BcfVersion): CheckedFinding {
  const problem = new FindingProblem(finding.id, version);
  const guid = problem.uuid(finding.guid, 'guid');
  if (finding.snapshotPng !== undefined && !PNG_SIGNATURE.equals(Buffer.from(finding.snapshotPng.subarray(0, 8)))) {
    problem.fail('snapshotPng', 'is not a PNG image');
  }
  return {
    ...finding,
    guid,
    title: problem.text(finding.title, 'title'),
    createdBy: problem.text(finding.createdBy, 'createdBy'),
    createdAt: problem.dateTime(finding.createdAt, 'createdAt'),
    modifiedAt: problem.dateTime(finding.modifiedAt, 'modifiedAt'),
    dueDate: problem.dateTime(finding.dueDate, 'dueDate'),
    comments: commentsOf(finding, guid, problem),
    memberGlobalIds: problem.globalIds(finding.memberGlobalIds, 'memberGlobalIds'),
    viewpoint: checkViewpoint(finding, guid, problem),
  };
}

/** Fails when two findings share a topic GUID (they would share a folder). */
export function requireDistinctTopics(findings: readonly CheckedFinding[]): void {
  const seen = new Map<string, string>();
  for (const finding of findings) {
    const other = seen.get(finding.guid);
    if (other !== undefined) {
      throw new ConflictError(`Findings ${other} and ${finding.id} have the same GUID ${finding.guid}.`, {
        code: 'bcf_export_invalid',
        details: { guid: finding.guid },
      });
    }
    seen.set(finding.guid, finding.id);
  }
}
