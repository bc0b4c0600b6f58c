import { Router } from 'express';
import type { TemplateSummary } from '@/shared/schemas/templates';
import { templates } from '@/shared/templates';

/** Routes under /api/templates (mounted behind requireUser). */
export function templatesRouter(): Router {
  const router = Router();

  // GET /api/templates: any signed-in person; { templates } a craft can start from, in the chooser's order; 401.
  router.get('/', (_req, res) => {
    const list: TemplateSummary[] = templates.map((template) => ({
      id: template.id,
      name: template.name,
      description: template.description,
      parameterCount: template.sheet.parameters.length,
    }));
    res.json({ templates: list });
  });

  return router;
}
