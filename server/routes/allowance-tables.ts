import { Router } from 'express';
import { allowanceTableParamsSchema, putAllowanceTableBodySchema } from '@/shared/schemas/allowance-tables';
import type { AppDeps } from '../app';
import { currentUser } from '../middleware/require-user';
import { validate } from '../middleware/validate';
import { getAllowanceTable, putAllowanceTable } from '../services/allowance-tables';

/** A craft's own allowance table under /api/crafts/:craftId (mounted behind requireUser). */
export function allowanceTablesRouter({ sequelize }: AppDeps): Router {
  const router = Router();

  // GET /api/crafts/:craftId/allowance-table: whoever may view the craft; { table (null while none), updatedBy,
  // updatedAt }; 401, 404.
  router.get('/:craftId/allowance-table', validate({ params: allowanceTableParamsSchema }), async (req, res) => {
    res.json(await getAllowanceTable(currentUser(req), req.params.craftId));
  });

  // PUT /api/crafts/:craftId/allowance-table: systems and chief engineers; { table } replaces the craft's own table,
  // which every sheet of the craft's budget then reads; 200 as GET; 400 invalid_input naming each cell or field at
  // fault (an allowance outside 0–100 %, a missing cell, an unknown maturity), 401, 403, 404.
  router.put(
    '/:craftId/allowance-table',
    validate({ params: allowanceTableParamsSchema, body: putAllowanceTableBodySchema }),
    async (req, res) => {
      res.json(await putAllowanceTable(sequelize, currentUser(req), req.params.craftId, req.body.table));
    },
  );

  return router;
}
