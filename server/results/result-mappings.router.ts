import { Router } from 'express';
import { z } from 'zod';
import { currentUser, projectAccessOf, requireProjectPermission } from '../auth/require-access';
import type { AppContext } from '../http/app-context';
import { inputOf, validate } from '../http/validate';
import { columnMappingSchema } from './column-mapping';
import { MappingTemplateService } from './mapping-template.service';

const projectParams = z.object({ projectId: z.uuid() });
const listInput = { params: projectParams };
const createInput = { params: projectParams, body: z.strictObject({ name: z.string().trim().min(1, 'give the template a name').max(120), mapping: columnMappingSchema }) };
const templateInput = { params: z.object({ projectId: z.uuid(), templateId: z.uuid('is not a valid template id') }) };

/** /api/projects/:projectId/result-mappings: saved column mappings of results files. */
export function resultMappingsRouter(ctx: AppContext): Router {
  const templates = new MappingTemplateService(ctx.dataSource);
  const router = Router({ mergeParams: true });

  router.get('/', requireProjectPermission('model.read'), validate(listInput), async (_req, res) => {
    res.json({ templates: await templates.list(projectAccessOf(res).projectId) });
  });

  router.post('/', requireProjectPermission('results.upload'), validate(createInput), async (req, res) => {
    const { params, body } = inputOf(res, createInput);
    res.status(201).json({ template: await templates.create(params.projectId, body.name, body.mapping, currentUser(req).id) });
  });

  // The mapping alone, as `taulens check --mapping FILE.json` reads it.
  router.get('/:templateId/download', requireProjectPermission('model.read'), validate(templateInput), async (_req, res) => {
    const { params } = inputOf(res, templateInput);
    const template = await templates.get(params.projectId, params.templateId);
    res.attachment(`${mappingFileName(template.name)}.mapping.json`);
    res.type('application/json').send(JSON.stringify(template.mapping, null, 2) + '\n');
  });

  router.delete('/:templateId', requireProjectPermission('results.upload'), validate(templateInput), async (_req, res) => {
    const { params } = inputOf(res, templateInput);
    await templates.remove(params.projectId, params.templateId);
    res.status(204).end();
  });

  return router;
}

/** A file name from a template's name: letters, digits, '-' and '_' kept, the rest folded into one '-'. */
function mappingFileName(name: string): string {
  return name.replace(/[^\p{L}\p{N}_-]+/gu, '-').replace(/^-+|-+$/g, '') || 'mapping';
}
