import { z } from 'zod';
import { DESIGN_STANDARDS } from './design-standard';
import { projectSettingsSchema } from './project-settings';

const name = z.string().trim().min(1, 'is required').max(120, 'is too long (at most 120 characters)');
const code = z
  .string()
  .trim()
  .regex(/^[A-Za-z0-9][A-Za-z0-9._-]{0,31}$/, 'use 1–32 letters, digits, dots, dashes or underscores, starting with a letter or digit');
const description = z.string().trim().max(2000, 'is too long (at most 2000 characters)');
const place = z.string().trim().max(200, 'is too long (at most 200 characters)');
const standard = z.enum(DESIGN_STANDARDS, `must be one of ${DESIGN_STANDARDS.join(', ')}`);
const settingsPatch = projectSettingsSchema.partial();

export const createProjectBody = z.object({
  name,
  code,
  description: description.default(''),
  client: place.default(''),
  location: place.default(''),
  standard: standard.default('aisc360-22-lrfd'),
  settings: settingsPatch.optional(),
});
export type CreateProjectInput = z.output<typeof createProjectBody>;

export const updateProjectBody = z
  .object({
    name: name.optional(),
    code: code.optional(),
    description: description.optional(),
    client: place.optional(),
    location: place.optional(),
    standard: standard.optional(),
    settings: settingsPatch.optional(),
  })
  .refine((body) => Object.values(body).some((v) => v !== undefined), 'give at least one field to change');
export type UpdateProjectInput = z.output<typeof updateProjectBody>;

export const projectIdParams = z.object({ projectId: z.uuid() });

export const listProjectsQuery = z.object({
  archived: z.enum(['true', 'false', 'all'], 'must be true, false or all').default('false'),
});
