import { Router } from 'express';
import { invitationParamsSchema, inviteBodySchema, personParamsSchema, setOrgAdminBodySchema } from '@/shared/schemas/organisation';
import type { AppDeps } from '../app';
import { currentUser, requireInOrganisation } from '../middleware/require-user';
import { validate } from '../middleware/validate';
import { getOrganisation, invitePerson, setOrgAdmin, withdrawInvitation } from '../services/organisation';

/** Routes under /api/organisation; every one needs a signed-in person (mounted behind requireUser). */
export function organisationRouter({ sequelize, mailer, config }: AppDeps): Router {
  const router = Router();

  // GET /api/organisation: any signed-in person; their organisation and the people they may see (partners: the
  // names of the members of their crafts), invitations for admins.
  router.get('/', async (req, res) => {
    res.json(await getOrganisation(currentUser(req)));
  });

  // POST /api/organisation/invitations: organisation admins; 400, 403, 409 already_a_person or already_linked,
  // 429 rate_limited (per admin and per organisation), 502 mail_not_sent.
  router.post('/invitations', requireInOrganisation('invitePeople'), validate({ body: inviteBodySchema }), async (req, res) => {
    res.status(201).json(await invitePerson(sequelize, mailer, config.publicUrl, currentUser(req), req.body));
  });

  // DELETE /api/organisation/invitations/:invitationId: organisation admins; withdraws the invitation; 204; 400,
  // 403, 404 (unknown, or another organisation's), 409 invitation_accepted.
  router.delete(
    '/invitations/:invitationId',
    requireInOrganisation('invitePeople'),
    validate({ params: invitationParamsSchema }),
    async (req, res) => {
      await withdrawInvitation(sequelize, currentUser(req), req.params.invitationId);
      res.status(204).end();
    },
  );

  // PUT /api/organisation/people/:userId/admin: organisation admins; 400, 403, 404, 409 last_admin.
  router.put(
    '/people/:userId/admin',
    requireInOrganisation('setOrgAdmin'),
    validate({ params: personParamsSchema, body: setOrgAdminBodySchema }),
    async (req, res) => {
      res.json(await setOrgAdmin(sequelize, currentUser(req), req.params.userId, req.body.isOrgAdmin));
    },
  );

  return router;
}
