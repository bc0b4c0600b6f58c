import { Router } from 'express';
import { craftParamsSchema, createCraftBodySchema, updateCraftBodySchema } from '@/shared/schemas/crafts';
import { memberParamsSchema, setMemberBodySchema } from '@/shared/schemas/members';
import type { AppDeps } from '../app';
import { currentUser, requireInOrganisation } from '../middleware/require-user';
import { validate } from '../middleware/validate';
import { createCraft, getCraft, listCrafts, updateCraft } from '../services/crafts';
import { listMembers, removeMember, setMember } from '../services/members';

/** Routes under /api/crafts; every one needs a signed-in person (mounted behind requireUser). */
export function craftsRouter({ sequelize }: AppDeps): Router {
  const router = Router();

  // GET /api/crafts: any signed-in person; the crafts they may see.
  router.get('/', async (req, res) => {
    res.json({ crafts: await listCrafts(sequelize, currentUser(req)) });
  });

  // POST /api/crafts: organisation admins; from `templateId` (default the square sail) or `copyOf` (a craft the
  // person may copy); 201 Craft; 400 invalid_input, 403, 404 (copyOf not found or not copyable).
  router.post('/', requireInOrganisation('createCraft'), validate({ body: createCraftBodySchema }), async (req, res) => {
    res.status(201).json(await createCraft(sequelize, currentUser(req), req.body));
  });

  // GET /api/crafts/:craftId: members and organisation admins; 404 otherwise.
  router.get('/:craftId', validate({ params: craftParamsSchema }), async (req, res) => {
    res.json(await getCraft(sequelize, currentUser(req), req.params.craftId));
  });

  // PATCH /api/crafts/:craftId: chief engineers and organisation admins; 400, 403, 404.
  router.patch('/:craftId', validate({ params: craftParamsSchema, body: updateCraftBodySchema }), async (req, res) => {
    res.json(await updateCraft(sequelize, currentUser(req), req.params.craftId, req.body));
  });

  // GET /api/crafts/:craftId/members: members and organisation admins; 404 otherwise.
  router.get('/:craftId/members', validate({ params: craftParamsSchema }), async (req, res) => {
    res.json({ members: await listMembers(sequelize, currentUser(req), req.params.craftId) });
  });

  // PUT /api/crafts/:craftId/members/:userId: organisation admins; 400, 403, 404, 409 last_chief_engineer.
  router.put('/:craftId/members/:userId', validate({ params: memberParamsSchema, body: setMemberBodySchema }), async (req, res) => {
    res.json(await setMember(sequelize, currentUser(req), req.params.craftId, req.params.userId, req.body));
  });

  // DELETE /api/crafts/:craftId/members/:userId: organisation admins; 403, 404, 409 last_chief_engineer.
  router.delete('/:craftId/members/:userId', validate({ params: memberParamsSchema }), async (req, res) => {
    await removeMember(sequelize, currentUser(req), req.params.craftId, req.params.userId);
    res.status(204).end();
  });

  return router;
}
