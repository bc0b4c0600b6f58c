import { Router } from 'express';
import { revisionParamsSchema } from '@/shared/schemas/revisions';
import { uncertaintyRequestSchema } from '@/shared/schemas/uncertainty';
import { currentUser } from '../middleware/require-user';
import { validate } from '../middleware/validate';
import { runUncertainty } from '../services/uncertainty';

/** Uncertainty (Monte Carlo) studies of a revision under /api/crafts/:craftId (mounted behind requireUser). */
export function uncertaintyRouter(): Router {
  const router = Router();

  // POST /api/crafts/:craftId/revisions/:revisionId/uncertainty: whoever may view the craft (partners vary and read the
  // rows shared with them, and the headline figures); `inputs` (key, distribution), `samples` (at most 100,000), `seed`,
  // `percentiles`, `outputs`, `requirements`, `bins`; 200 UncertaintyResult; 400 invalid_input naming the field, 404.
  router.post(
    '/:craftId/revisions/:revisionId/uncertainty',
    validate({ params: revisionParamsSchema, body: uncertaintyRequestSchema }),
    async (req, res) => {
      res.json(await runUncertainty(currentUser(req), req.params.craftId, req.params.revisionId, req.body));
    },
  );

  return router;
}
