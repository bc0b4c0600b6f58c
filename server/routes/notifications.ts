import { Router } from 'express';
import { markReadBodySchema } from '@/shared/schemas/notifications';
import type { AppDeps } from '../app';
import { currentUser } from '../middleware/require-user';
import { validate } from '../middleware/validate';
import { listNotifications, markNotificationsRead } from '../services/notifications';

/** Routes under /api/notifications: the signed-in person's own notifications (mounted behind requireUser). */
export function notificationsRouter({ sequelize }: AppDeps): Router {
  const router = Router();

  // GET /api/notifications: any signed-in person; { notifications (latest 50, newest first), unread }; 401.
  router.get('/', async (req, res) => {
    res.json(await listNotifications(sequelize, currentUser(req)));
  });

  // POST /api/notifications/read: any signed-in person; marks `ids` (or all) of their notifications read; 204; 400, 401.
  router.post('/read', validate({ body: markReadBodySchema }), async (req, res) => {
    await markNotificationsRead(sequelize, currentUser(req), req.body.ids);
    res.status(204).end();
  });

  return router;
}
