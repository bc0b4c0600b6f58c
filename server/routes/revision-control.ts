import { Router } from 'express';
import { auditQuerySchema } from '@/shared/schemas/audit';
import { craftParamsSchema } from '@/shared/schemas/crafts';
import { rowHistoryQuerySchema } from '@/shared/schemas/history';
import {
  lockBaselineBodySchema,
  openStudyBodySchema,
  promoteStudyBodySchema,
  revisionParamsSchema,
  studyParamsSchema,
} from '@/shared/schemas/revisions';
import type { AppDeps } from '../app';
import { currentUser } from '../middleware/require-user';
import { validate } from '../middleware/validate';
import { auditCsv, listAudit } from '../services/audit';
import { lockBaseline } from '../services/baselines';
import { rowHistory } from '../services/history';
import { promoteStudy } from '../services/promotion';
import { reviewPack } from '../services/review-pack';
import { openStudy } from '../services/studies';

/**
 * Revision control of a craft under /api/crafts/:craftId: locking the draft as a baseline, opening and
 * promoting studies, the audit log of those and of role and token changes, and the history of row changes. Every
 * route needs a signed-in person (mounted behind requireUser); a craft the caller may not see is 404, a refused
 * action 403.
 */
export function revisionControlRouter({ sequelize }: AppDeps): Router {
  const router = Router();

  // POST /api/crafts/:craftId/revisions/:revisionId/lock: chief engineers; `label`, `note`; 201 Revision (the
  // locked baseline; the draft continues from it); 400 invalid_input, 403, 404, 409 not_a_draft or duplicate_label.
  router.post(
    '/:craftId/revisions/:revisionId/lock',
    validate({ params: revisionParamsSchema, body: lockBaselineBodySchema }),
    async (req, res) => {
      res.status(201).json(await lockBaseline(sequelize, currentUser(req), req.params.craftId, req.params.revisionId, req.body));
    },
  );

  // POST /api/crafts/:craftId/revisions/:revisionId/studies: subsystem owners, systems and chief engineers; `name`,
  // `note`; 201 Revision (the study, owned by the caller); 400 invalid_input, 403, 404.
  router.post(
    '/:craftId/revisions/:revisionId/studies',
    validate({ params: revisionParamsSchema, body: openStudyBodySchema }),
    async (req, res) => {
      res.status(201).json(await openStudy(sequelize, currentUser(req), req.params.craftId, req.params.revisionId, req.body));
    },
  );

  // POST /api/crafts/:craftId/revisions/:studyId/promote: chief engineers; `resolutions` { key: 'draft' | 'study' };
  // Promotion; 400 invalid_input (a resolution for a row not in conflict), 403, 404, 409 not_a_study, already_promoted,
  // merge_conflicts (details.conflicts, details.unresolved; nothing written) or merge_breaks_sheet.
  router.post(
    '/:craftId/revisions/:studyId/promote',
    validate({ params: studyParamsSchema, body: promoteStudyBodySchema }),
    async (req, res) => {
      res.json(await promoteStudy(sequelize, currentUser(req), req.params.craftId, req.params.studyId, req.body));
    },
  );

  // GET /api/crafts/:craftId/revisions/:revisionId/review.pdf: whoever reads the whole sheet (not partners); the
  // design review pack as a PDF download; 403, 404.
  router.get('/:craftId/revisions/:revisionId/review.pdf', validate({ params: revisionParamsSchema }), async (req, res) => {
    const { pdf, fileName } = await reviewPack(sequelize, currentUser(req), req.params.craftId, req.params.revisionId);
    res
      .status(200)
      .type('application/pdf')
      .set('Content-Disposition', `attachment; filename="${fileName}"`)
      .set('X-Content-Type-Options', 'nosniff')
      .send(pdf);
  });

  // GET /api/crafts/:craftId/revisions/:revisionId/history?key=: whoever may view the craft (partners: changes of rows
  // they may see); RowHistory, newest first, at most 200; 400 invalid_input (a bad key), 404.
  router.get(
    '/:craftId/revisions/:revisionId/history',
    validate({ params: revisionParamsSchema, query: rowHistoryQuerySchema }),
    async (req, res) => {
      res.json(await rowHistory(sequelize, currentUser(req), req.params.craftId, req.params.revisionId, req.query));
    },
  );

  // GET /api/crafts/:craftId/audit?action=&actor=&from=&to=&limit=&format=: organisation admins and chief engineers;
  // { events } newest first, or CSV with format=csv or Accept: text/csv; 400 invalid_input, 403, 404.
  router.get('/:craftId/audit', validate({ params: craftParamsSchema, query: auditQuerySchema }), async (req, res) => {
    const events = await listAudit(sequelize, currentUser(req), req.params.craftId, req.query);
    const csv =
      req.query.format === 'csv' || (req.query.format === undefined && req.accepts(['application/json', 'text/csv']) === 'text/csv');
    if (!csv) {
      res.json({ events });
      return;
    }
    res.attachment('trimsheet-audit.csv').type('text/csv; charset=utf-8').send(auditCsv(events));
  });

  return router;
}
