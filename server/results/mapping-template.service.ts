/** Column mappings a project saved under a name, for the next export of the same analysis program. */
import { randomUUID } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import { ConflictError, NotFoundError } from '../http/errors';
import type { ColumnMapping } from './column-mapping';
import type { MappingTemplateView } from './results-api-types';
import { ResultMappingTemplate } from './result-mapping-template.entity';

export class MappingTemplateService {
  constructor(private readonly dataSource: DataSource) {}

  async list(projectId: string): Promise<MappingTemplateView[]> {
    const templates = await this.dataSource.getRepository(ResultMappingTemplate).find({ where: { projectId }, order: { name: 'ASC' } });
    return templates.map(toTemplateView);
  }

  async get(projectId: string, templateId: string): Promise<MappingTemplateView> {
    const template = await this.dataSource.getRepository(ResultMappingTemplate).findOneBy({ id: templateId, projectId });
    if (!template) throw new NotFoundError('Mapping template not found.', { code: 'template_not_found' });
    return toTemplateView(template);
  }

  /** Saves a template; inside an import it joins the import's transaction (`manager`). */
  async create(projectId: string, name: string, mapping: ColumnMapping, actorId: string, manager: EntityManager = this.dataSource.manager): Promise<MappingTemplateView> {
    await assertNameFree(manager, projectId, name);
    // insert, not save: save opens its own transaction, which would tangle with a queued one on the shared connection.
    const id = randomUUID();
    await manager.insert(ResultMappingTemplate, { id, projectId, name, mapping, createdById: actorId });
    return toTemplateView(await manager.findOneByOrFail(ResultMappingTemplate, { id }));
  }

  async assertNameFree(projectId: string, name: string): Promise<void> {
    await assertNameFree(this.dataSource.manager, projectId, name);
  }

  async remove(projectId: string, templateId: string): Promise<void> {
    const result = await this.dataSource.getRepository(ResultMappingTemplate).delete({ id: templateId, projectId });
    if (!result.affected) throw new NotFoundError('Mapping template not found.', { code: 'template_not_found' });
  }
}

async function assertNameFree(manager: EntityManager, projectId: string, name: string): Promise<void> {
  if (await manager.existsBy(ResultMappingTemplate, { projectId, name })) {
    throw new ConflictError(`This project already has a mapping template called '${name}'. Choose another name.`, { code: 'template_name_taken' });
  }
}

function toTemplateView(template: ResultMappingTemplate): MappingTemplateView {
  return { id: template.id, name: template.name, mapping: template.mapping, createdAt: template.createdAt.toISOString() };
}
