import { Router } from 'express';
import { compareQuerySchema } from '@/shared/schemas/compare';
import { craftParamsSchema } from '@/shared/schemas/crafts';
import {
  createParameterBodySchema,
  deleteParameterQuerySchema,
  parameterParamsSchema,
  revisionParamsSchema,
  subsystemBodySchema,
  subsystemParamsSchema,
  updateParameterBodySchema,
} from '@/shared/schemas/revisions';
import type { AppDeps } from '../app';
import { currentUser } from '../middleware/require-user';
import { validate } from '../middleware/validate';
import { compareRevisions } from '../services/compare';
import { createParameter, deleteParameter, updateParameter } from '../services/parameters';
import { getRevisionDetail, getRevisionEvaluation, listRevisions } from '../services/revisions';
import { streamSheetEvents } from '../services/sheet-stream';
import { createSubsystem, deleteSubsystem, renameSubsystem } from '../services/subsystems';

/**
 * A craft's sheet under /api/crafts/:craftId: revisions and their rows, subsystems and the live event
 * stream; every route needs a signed-in person (mounted behind requireUser). A craft the caller may not
 * see is 404; a row they may not see is 404; a refused action is 403 with the permission table's reason.
 */
export function sheetsRouter({ sequelize, events }: AppDeps): Router {
  const router = Router();

  // GET /api/crafts/:craftId/revisions: whoever may view the craft; { revisions }; 404.
  router.get('/:craftId/revisions', validate({ params: craftParamsSchema }), async (req, res) => {
    res.json({ revisions: await listRevisions(sequelize, currentUser(req), req.params.craftId) });
  });

  // GET /api/crafts/:craftId/revisions/:revisionId: whoever may view the craft (partners: shared rows and
  // headline figures); RevisionDetail; 404.
  router.get('/:craftId/revisions/:revisionId', validate({ params: revisionParamsSchema }), async (req, res) => {
    res.type('json').send(await getRevisionDetail(currentUser(req), req.params.craftId, req.params.revisionId));
  });

  // GET /api/crafts/:craftId/revisions/:revisionId/evaluation: as above; EvaluationResponse (partners: what they see); 404.
  router.get('/:craftId/revisions/:revisionId/evaluation', validate({ params: revisionParamsSchema }), async (req, res) => {
    res.json(await getRevisionEvaluation(currentUser(req), req.params.craftId, req.params.revisionId));
  });

  // GET /api/crafts/:craftId/compare?from=&to=[&output=]: whoever may view the craft (partners: the rows of
  // the subsystems shared with them); CompareResponse; 400 (a query parameter, or an output with no old or
  // new value), 404 (a revision of another craft, an output not in `to`).
  router.get('/:craftId/compare', validate({ params: craftParamsSchema, query: compareQuerySchema }), async (req, res) => {
    res.json(await compareRevisions(currentUser(req), req.params.craftId, req.query));
  });

  // POST /api/crafts/:craftId/revisions/:revisionId/parameters: systems and chief engineers; 201 RevisionParameter;
  // 400 (invalid_input, unknown_subsystem, an engine code such as cycle), 403, 404, 409 duplicate_key.
  router.post(
    '/:craftId/revisions/:revisionId/parameters',
    validate({ params: revisionParamsSchema, body: createParameterBodySchema }),
    async (req, res) => {
      res.status(201).json(await createParameter(sequelize, currentUser(req), req.params.craftId, req.params.revisionId, req.body));
    },
  );

  // PATCH /api/crafts/:craftId/revisions/:revisionId/parameters/:key: content by whoever may edit the row
  // (owners: their subsystems), key/before/subsystem by systems and chief engineers; RevisionParameter;
  // 400 (invalid_input, an engine code naming the row), 403 (forbidden, protected), 404, 409 version_conflict
  // (details.current) or duplicate_key.
  router.patch(
    '/:craftId/revisions/:revisionId/parameters/:key',
    validate({ params: parameterParamsSchema, body: updateParameterBodySchema }),
    async (req, res) => {
      const { craftId, revisionId, key } = req.params;
      res.json(await updateParameter(sequelize, currentUser(req), craftId, revisionId, key, req.body));
    },
  );

  // DELETE /api/crafts/:craftId/revisions/:revisionId/parameters/:key?version=N: systems and chief engineers;
  // 204; 400, 403, 404, 409 version_conflict or in_use (details.keys).
  router.delete(
    '/:craftId/revisions/:revisionId/parameters/:key',
    validate({ params: parameterParamsSchema, query: deleteParameterQuerySchema }),
    async (req, res) => {
      const { craftId, revisionId, key } = req.params;
      await deleteParameter(sequelize, currentUser(req), craftId, revisionId, key, req.query.version);
      res.status(204).end();
    },
  );

  // POST /api/crafts/:craftId/subsystems: systems and chief engineers; 201 Subsystem; 400, 403, 404, 409 duplicate_name.
  router.post('/:craftId/subsystems', validate({ params: craftParamsSchema, body: subsystemBodySchema }), async (req, res) => {
    res.status(201).json(await createSubsystem(sequelize, currentUser(req), req.params.craftId, req.body.name));
  });

  // PATCH /api/crafts/:craftId/subsystems/:subsystemId: systems and chief engineers; Subsystem; 400, 403, 404, 409 duplicate_name.
  router.patch(
    '/:craftId/subsystems/:subsystemId',
    validate({ params: subsystemParamsSchema, body: subsystemBodySchema }),
    async (req, res) => {
      res.json(await renameSubsystem(sequelize, currentUser(req), req.params.craftId, req.params.subsystemId, req.body.name));
    },
  );

  // DELETE /api/crafts/:craftId/subsystems/:subsystemId: systems and chief engineers; 204; 403, 404, 409 in_use (details.keys).
  router.delete('/:craftId/subsystems/:subsystemId', validate({ params: subsystemParamsSchema }), async (req, res) => {
    await deleteSubsystem(sequelize, currentUser(req), req.params.craftId, req.params.subsystemId);
    res.status(204).end();
  });

  // GET /api/crafts/:craftId/events: whoever may view the craft; text/event-stream of SheetEvent (partners
  // hear only the keys of rows shared with them); 404.
  router.get('/:craftId/events', validate({ params: craftParamsSchema }), async (req, res) => {
    await streamSheetEvents(events, currentUser(req), req.params.craftId, res);
  });

  return router;
}
