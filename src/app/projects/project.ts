import type { ProjectSettings } from '../../../server/projects/project-settings';
import { ProjectAction, ProjectRole } from '../core/permissions';

export type { ProjectSettings };

export type StandardId = 'aisc360-22-lrfd' | 'aisc360-22-asd' | 'en1993-1-1';

export const STANDARDS: readonly { id: StandardId; label: string }[] = [
  { id: 'aisc360-22-lrfd', label: 'AISC 360-22, LRFD' },
  { id: 'aisc360-22-asd', label: 'AISC 360-22, ASD' },
  { id: 'en1993-1-1', label: 'EN 1993-1-1 with EN 1993-1-5' },
];

export function standardLabel(id: StandardId): string {
  return STANDARDS.find((standard) => standard.id === id)?.label ?? id;
}

/** Field lengths the server accepts (server/projects/project-fields.ts). */
export const PROJECT_FIELD_LIMITS = { name: 120, code: 32, description: 2000, client: 200, location: 200 } as const;

/** Project codes as the server accepts them: they appear on drawings and in file names. */
export const PROJECT_CODE_PATTERN = /^[A-Za-z0-9][A-Za-z0-9._-]{0,31}$/;

/** A project as the API lists it; `role` is the signed-in user's role (null for a site admin who is not a member). */
export interface Project {
  id: string;
  name: string;
  code: string;
  description: string;
  client: string;
  location: string;
  standard: StandardId;
  /** Starting values of every new check run (national-annex factors, default grade, warning band). */
  settings: ProjectSettings;
  archived: boolean;
  createdAt: string;
  role?: ProjectRole | null;
}

/** `GET /api/projects/:projectId` */
export interface ProjectDetail {
  project: Project;
  role: ProjectRole | null;
  permissions: ProjectAction[];
}

/** Body of `POST /api/projects` and `PATCH /api/projects/:projectId`. */
export interface ProjectDraft {
  name: string;
  code: string;
  description?: string;
  client?: string;
  location?: string;
  standard?: StandardId;
}

/** Body of `PATCH /api/projects/:projectId`: changed details and check defaults. */
export type ProjectChanges = Partial<ProjectDraft> & { settings?: Partial<ProjectSettings> };

export interface Member {
  userId: string;
  email: string;
  name: string;
  role: ProjectRole;
}
