/** Request schemas of the findings routes (validated at the edge by `validate`). */
import { z } from 'zod';
import { FINDING_STATUSES, FINDING_KINDS, FINDING_LIMITS, FINDING_PRIORITIES } from './finding-fields';
import { isIfcGlobalId } from './bcf/bcf-guid';

export const projectParams = z.object({ projectId: z.uuid() });
export const findingParams = z.object({ projectId: z.uuid(), findingId: z.uuid('is not a valid finding id') });

const globalId = z.string().refine(isIfcGlobalId, 'is not a 22-character IFC GlobalId');
const globalIds = z.array(globalId).max(50_000);
const finite = z.number().refine(Number.isFinite, 'must be a finite number');
const vector = z.tuple([finite, finite, finite]);
const nonZeroVector = vector.refine((v) => v.some((component) => component !== 0), 'must not be the zero vector');

const cameraPlacement = { viewPoint_m: vector, direction: nonZeroVector, up: nonZeroVector, aspectRatio: z.number().positive().max(100) };

/** A camera in IFC axes, metres (BCF's PerspectiveCamera or OrthogonalCamera). */
export const cameraSchema = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('perspective'), ...cameraPlacement, fieldOfView_deg: z.number().gt(0).lt(180) }),
  z.strictObject({ kind: z.literal('orthogonal'), ...cameraPlacement, viewToWorldScale_m: z.number().positive().max(1e6) }),
]);

export const clippingPlaneSchema = z.strictObject({ location_m: vector, direction: nonZeroVector });

export const viewpointSchema = z.strictObject({
  camera: cameraSchema.optional(),
  selectedGlobalIds: globalIds,
  visibility: z.strictObject({ defaultVisible: z.boolean(), exceptionGlobalIds: globalIds }),
  clippingPlanes: z.array(clippingPlaneSchema).max(6).default([]),
});

const title = z.string().trim().min(1, 'is required').max(FINDING_LIMITS.title, `is too long (at most ${FINDING_LIMITS.title} characters)`);
const description = z.string().trim().max(FINDING_LIMITS.description, `is too long (at most ${FINDING_LIMITS.description} characters)`);
const labels = z
  .array(z.string().trim().min(1, 'must not be blank').max(FINDING_LIMITS.label, `is too long (at most ${FINDING_LIMITS.label} characters)`))
  .max(FINDING_LIMITS.labels, `at most ${FINDING_LIMITS.labels} labels`)
  .transform((values) => [...new Set(values)]);
const priority = z.enum(FINDING_PRIORITIES, `must be one of ${FINDING_PRIORITIES.join(', ')}`);
const base64 = z.string().max(Math.ceil((FINDING_LIMITS.snapshotBytes * 4) / 3) + 4, 'is larger than the snapshot limit').regex(/^[A-Za-z0-9+/]*={0,2}$/, 'is not base64');

export const createFindingInput = {
  params: projectParams,
  body: z.strictObject({
    title,
    description: description.default(''),
    memberGlobalIds: z.array(globalId).min(1, 'select at least one member').max(FINDING_LIMITS.members).transform((ids) => [...new Set(ids)]),
    viewpoint: viewpointSchema.optional(),
    snapshotPng: base64.optional(),
    priority: priority.default('normal'),
    labels: labels.default([]),
  }),
};

export const updateFindingInput = {
  params: findingParams,
  body: z
    .strictObject({
      priority: priority.optional(),
      dueDate: z.iso.date('must be a date (YYYY-MM-DD)').nullable().optional(),
      labels: labels.optional(),
      assigneeId: z.uuid('is not a valid user id').nullable().optional(),
      title: title.optional(),
      description: description.optional(),
    })
    .refine((body) => Object.values(body).some((value) => value !== undefined), 'name at least one field to change'),
};

export const transitionInput = {
  params: findingParams,
  body: z.strictObject({
    to: z.enum(FINDING_STATUSES, `must be one of ${FINDING_STATUSES.join(', ')}`),
    justification: z.string().max(FINDING_LIMITS.justification, `is too long (at most ${FINDING_LIMITS.justification} characters)`).optional(),
    /** What was done, kept as a comment; required to resolve a failing finding. */
    note: z.string().trim().max(FINDING_LIMITS.comment, `is too long (at most ${FINDING_LIMITS.comment} characters)`).optional(),
  }),
};

export const commentInput = {
  params: findingParams,
  body: z.strictObject({
    text: z.string().trim().min(1, 'is required').max(FINDING_LIMITS.comment, `is too long (at most ${FINDING_LIMITS.comment} characters)`),
  }),
};

export const bulkAssignInput = {
  params: projectParams,
  body: z.strictObject({
    findingIds: z.array(z.uuid('is not a valid finding id')).min(1, 'select at least one finding').max(1000).transform((ids) => [...new Set(ids)]),
    assigneeId: z.uuid('is not a valid user id').nullable(),
  }),
};

/** "open,in-progress" → ['open', 'in-progress']. */
function listOf<const T extends readonly [string, ...string[]]>(values: T) {
  return z
    .string()
    .transform((text) => text.split(',').map((part) => part.trim()).filter((part) => part !== ''))
    .pipe(z.array(z.enum(values, `each must be one of ${values.join(', ')}`)));
}

export const FINDING_SORTS = ['number', 'title', 'status', 'priority', 'utilisation', 'dueDate', 'updatedAt', 'assignee'] as const;
export type FindingSort = (typeof FINDING_SORTS)[number];

/** Filters shared by the list and the exports. */
export const findingFilters = z.object({
  status: listOf(FINDING_STATUSES).optional(),
  kind: listOf(FINDING_KINDS).optional(),
  priority: listOf(FINDING_PRIORITIES).optional(),
  /** A user id, `me`, or `none` for unassigned findings. */
  assignee: z.union([z.literal('me'), z.literal('none'), z.uuid('must be a user id, me or none')]).optional(),
  q: z.string().trim().max(200).optional(),
});
export type FindingFilters = z.output<typeof findingFilters>;

export const listFindingsInput = {
  params: projectParams,
  query: findingFilters.extend({
    sort: z.enum(FINDING_SORTS).default('number'),
    dir: z.enum(['asc', 'desc']).default('desc'),
    page: z.coerce.number().int().min(0).default(0),
    pageSize: z.coerce.number().int().min(1).max(200).default(50),
  }),
};
export type FindingListQuery = z.output<typeof listFindingsInput.query>;

export const exportBcfInput = {
  params: projectParams,
  query: findingFilters.extend({ version: z.enum(['2.1', '3.0']).default('2.1') }),
};

export const exportCsvInput = { params: projectParams, query: findingFilters };
