import { type DataSource, type EntityManager, In, Raw, type Repository } from 'typeorm';
import { type Action, canCreateProjects } from '../auth/permissions';
import type { SignedInUser } from '../auth/session-user';
import { runTransaction } from '../data-source';
import { ConflictError, ForbiddenError, NotFoundError } from '../http/errors';
import type { CreateProjectInput, UpdateProjectInput } from './project-fields';
import { ProjectMember } from './project-member.entity';
import type { ProjectRole } from './project-role';
import { defaultSettingsFor, projectSettingsSchema, settingsForStandardChange } from './project-settings';
import { type ProjectView, toProjectView } from './project-views';
import { Project } from './project.entity';

export type ArchivedFilter = 'true' | 'false' | 'all';

export class ProjectService {
  private readonly projects: Repository<Project>;
  private readonly members: Repository<ProjectMember>;

  constructor(private readonly dataSource: DataSource) {
    this.projects = dataSource.getRepository(Project);
    this.members = dataSource.getRepository(ProjectMember);
  }

  /** The user's projects; a site admin sees every project. */
  async list(user: SignedInUser, archived: ArchivedFilter): Promise<ProjectView[]> {
    const roles = await this.rolesOf(user.id);
    if (!user.isAdmin && roles.size === 0) return [];
    const where = {
      ...(archived === 'all' ? {} : { archived: archived === 'true' }),
      ...(user.isAdmin ? {} : { id: In([...roles.keys()]) }),
    };
    const projects = await this.projects.find({ where, order: { name: 'ASC' } });
    return projects.map((p) => toProjectView(p, roles.get(p.id) ?? null));
  }

  /** The creator becomes the project's coordinator. */
  async create(user: SignedInUser, input: CreateProjectInput): Promise<ProjectView> {
    const roles = await this.rolesOf(user.id);
    if (!canCreateProjects(user, [...roles.values()])) {
      throw new ForbiddenError('Only site administrators and project coordinators can create projects.');
    }
    const settings = projectSettingsSchema.parse({ ...defaultSettingsFor(input.standard), ...input.settings });
    const project = await runTransaction(this.dataSource, async (manager) => {
      await assertCodeFree(manager, input.code);
      const created = await manager.save(
        manager.create(Project, {
          name: input.name,
          code: input.code,
          description: input.description,
          client: input.client,
          location: input.location,
          standard: input.standard,
          settings,
          createdById: user.id,
        }),
      );
      await manager.insert(ProjectMember, { projectId: created.id, userId: user.id, role: 'coordinator' });
      return created;
    });
    return toProjectView(project, 'coordinator');
  }

  async get(projectId: string, role: ProjectRole | null): Promise<ProjectView> {
    return toProjectView(await this.find(projectId), role);
  }

  async update(projectId: string, patch: UpdateProjectInput, role: ProjectRole | null): Promise<ProjectView> {
    const saved = await runTransaction(this.dataSource, async (manager) => {
      const project = await manager.findOneBy(Project, { id: projectId });
      if (!project) throw projectNotFound();
      if (patch.code !== undefined && patch.code.toLowerCase() !== project.code.toLowerCase()) {
        await assertCodeFree(manager, patch.code);
      }
      const standard = patch.standard ?? project.standard;
      const settings = projectSettingsSchema.parse(
        settingsForStandardChange(project.settings, project.standard, standard, patch.settings ?? {}),
      );
      const { settings: _ignored, ...fields } = patch;
      return manager.save(Object.assign(project, definedOnly(fields), { standard, settings }));
    });
    return toProjectView(saved, role);
  }

  async setArchived(projectId: string, archived: boolean, role: ProjectRole | null): Promise<ProjectView> {
    const project = await this.find(projectId);
    project.archived = archived;
    return toProjectView(await this.projects.save(project), role);
  }

  private async find(projectId: string): Promise<Project> {
    const project = await this.projects.findOneBy({ id: projectId });
    if (!project) throw projectNotFound();
    return project;
  }

  private async rolesOf(userId: string): Promise<Map<string, ProjectRole>> {
    const memberships = await this.members.findBy({ userId });
    return new Map(memberships.map((m) => [m.projectId, m.role]));
  }
}

/** What GET /api/projects/:projectId answers. */
export interface ProjectDetail {
  project: ProjectView;
  role: ProjectRole | null;
  permissions: Action[];
}

async function assertCodeFree(manager: EntityManager, code: string): Promise<void> {
  const taken = await manager.existsBy(Project, { code: Raw((column) => `LOWER(${column}) = LOWER(:code)`, { code }) });
  if (taken) throw new ConflictError(`Another project already uses the code “${code}”.`, { code: 'project_code_taken' });
}

function projectNotFound(): NotFoundError {
  return new NotFoundError('Project not found.', { code: 'project_not_found' });
}

function definedOnly<T extends object>(value: T): Partial<T> {
  return Object.fromEntries(Object.entries(value).filter(([, v]) => v !== undefined)) as Partial<T>;
}
