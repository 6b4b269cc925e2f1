import type { DesignStandard } from './design-standard';
import type { Project } from './project.entity';
import type { ProjectRole } from './project-role';
import type { ProjectSettings } from './project-settings';

export interface ProjectView {
  id: string;
  name: string;
  code: string;
  description: string;
  client: string;
  location: string;
  standard: DesignStandard;
  settings: ProjectSettings;
  archived: boolean;
  createdAt: string;
  updatedAt: string;
  /** The viewer's role; null for a site admin who is not a member. */
  role: ProjectRole | null;
}

export function toProjectView(project: Project, role: ProjectRole | null): ProjectView {
  return {
    id: project.id,
    name: project.name,
    code: project.code,
    description: project.description,
    client: project.client,
    location: project.location,
    standard: project.standard,
    settings: project.settings,
    archived: project.archived,
    createdAt: project.createdAt.toISOString(),
    updatedAt: project.updatedAt.toISOString(),
    role,
  };
}
