import { Router } from 'express';
import { mailPreferencesSchema } from '@/shared/schemas/notifications';
import { linkIdentityBodySchema } from '@/shared/schemas/session';
import { createTokenBodySchema, tokenParamsSchema } from '@/shared/schemas/tokens';
import type { AppDeps } from '../app';
import { currentUser } from '../middleware/require-user';
import { validate } from '../middleware/validate';
import { createToken, listTokens, revokeToken } from '../services/access-tokens';
import { getMailPreferences, setMailPreferences } from '../services/notifications';
import { listIdentities } from '../services/sign-in';
import { requestIdentityLink } from '../auth/sign-in-intents';

/** Routes under /api/account: the signed-in person's own settings (mounted behind requireUser; never by token). */
export function accountRouter({ sequelize }: AppDeps): Router {
  const router = Router();

  // GET /api/account/tokens: any signed-in person (session only); { tokens }; 401, 403 token_not_allowed.
  router.get('/tokens', async (req, res) => {
    res.json({ tokens: await listTokens(currentUser(req)) });
  });

  // POST /api/account/tokens: any signed-in person (session only); 201 { token, secret } (the secret shown
  // this once); 400, 401, 403.
  router.post('/tokens', validate({ body: createTokenBodySchema }), async (req, res) => {
    res.status(201).json(await createToken(currentUser(req), req.body));
  });

  // DELETE /api/account/tokens/:tokenId: the token's owner (session only); 204; 401, 403, 404.
  router.delete('/tokens/:tokenId', validate({ params: tokenParamsSchema }), async (req, res) => {
    await revokeToken(currentUser(req), req.params.tokenId);
    res.status(204).end();
  });

  // GET /api/account/mail-preferences: any signed-in person (session only); which notifications also come by mail; 401, 403.
  router.get('/mail-preferences', async (req, res) => {
    res.json(await getMailPreferences(sequelize, currentUser(req)));
  });

  // PUT /api/account/mail-preferences: any signed-in person (session only); the preferences saved; 400, 401, 403.
  router.put('/mail-preferences', validate({ body: mailPreferencesSchema }), async (req, res) => {
    res.json(await setMailPreferences(sequelize, currentUser(req), req.body));
  });

  // GET /api/account/identities: any signed-in person (session only); { identities } (provider, linkedAt); 401, 403.
  router.get('/identities', async (req, res) => {
    res.json({ identities: await listIdentities(currentUser(req)) });
  });

  // POST /api/account/identities: any signed-in person (session only); records the request to link the provider's
  // sign-in and answers { startUrl }, where the browser goes next; the provider's callback links it and returns
  // to /account?link=<result>; 400, 401, 403.
  router.post('/identities', validate({ body: linkIdentityBodySchema }), (req, res) => {
    requestIdentityLink(req, currentUser(req).id, req.body.provider);
    res.json({ startUrl: `/api/auth/${req.body.provider}` });
  });

  return router;
}
