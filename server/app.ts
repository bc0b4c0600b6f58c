import express, { type Express } from 'express';
import helmet from 'helmet';
import fs from 'node:fs';
import path from 'node:path';
import type { Sequelize } from 'sequelize';
import { createAuth } from './auth';
import { bearerAuth, unlessBearer } from './auth/bearer';
import type { Config } from './env';
import { HttpError } from './http-error';
import { apiNotFound, errorHandler } from './middleware/errors';
import { requireUser } from './middleware/require-user';
import { accountRouter } from './routes/account';
import { craftsRouter } from './routes/crafts';
import { openApiDocument } from './openapi';
import { notificationsRouter } from './routes/notifications';
import { organisationRouter } from './routes/organisation';
import { revisionControlRouter } from './routes/revision-control';
import { sheetsRouter } from './routes/sheets';
import { templatesRouter } from './routes/templates';
import type { Mailer } from './services/mailer';
import type { SheetEvents } from './services/sheet-events';

export interface AppDeps {
  config: Config;
  sequelize: Sequelize;
  mailer: Mailer;
  /** This process's listener of sheet changes (PostgreSQL LISTEN), feeding the event streams. */
  events: SheetEvents;
}

/** Builds the Express app: API under /api, the exported web app for everything else. Never listens. */
export function createApp(deps: AppDeps): Express {
  const { config } = deps;
  const app = express();
  app.set('trust proxy', config.trustProxy);
  app.disable('x-powered-by');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // react-native-web injects style elements at run time; scripts come only from our own bundle.
          'style-src': ["'self'", "'unsafe-inline'"],
          'script-src': ["'self'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'form-action': ["'self'", config.sso.issuer, new URL(config.google.authorizationUrl).origin],
          'upgrade-insecure-requests': config.secureCookies ? [] : null,
        },
      },
    }),
  );
  app.use(express.json({ limit: '1mb' }));

  const auth = createAuth({ config, sequelize: deps.sequelize });
  // A script's access token signs in one request; browsers use the session, its cookies and CSRF tokens, all
  // passed over in one step for a token's request. Only the API reads either: the web app's files and pages
  // are the same for everyone, so they cost no lookup in PostgreSQL.
  app.use('/api', bearerAuth);
  app.use('/api', unlessBearer(auth.browser));

  // GET /api/health: anyone; 200 when the database answers, 503 database_unavailable when it does not.
  app.get('/api/health', async (_req, res) => {
    try {
      await deps.sequelize.query('SELECT 1');
    } catch {
      throw new HttpError(503, 'database_unavailable', 'The database does not answer');
    }
    res.json({ status: 'ok' });
  });
  // GET /api/openapi.json: anyone; the OpenAPI 3.1 description of every route.
  const openApi = openApiDocument();
  app.get('/api/openapi.json', (_req, res) => {
    res.json(openApi);
  });
  app.use('/api/auth', auth.router);
  app.use('/api/account', requireUser, accountRouter(deps));
  app.use('/api/notifications', requireUser, notificationsRouter(deps));
  app.use('/api/templates', requireUser, templatesRouter());
  app.use('/api/crafts', requireUser, craftsRouter(deps), sheetsRouter(deps), revisionControlRouter(deps));
  app.use('/api/organisation', requireUser, organisationRouter(deps));
  app.use('/api', apiNotFound);

  serveWebApp(app, config.webDist);
  app.use(errorHandler);
  return app;
}

/** Serves the exported web app; client routes fall back to its index.html. */
function serveWebApp(app: Express, webDist: string) {
  const indexHtml = path.join(webDist, 'index.html');
  app.use(express.static(webDist, { index: false, maxAge: '1h' }));
  app.get('/{*splat}', (_req, res) => {
    if (!fs.existsSync(indexHtml)) {
      res.status(503).type('text').send('The web app is not built yet: run `npm start`, which builds it.');
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexHtml);
  });
}
