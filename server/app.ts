import express, { type Express, type RequestHandler } from 'express';
import helmet from 'helmet';
import fs from 'node:fs';
import path from 'node:path';
import type { Sequelize } from 'sequelize';
import { createAuth } from './auth';
import { bearerAuth, unlessBearer } from './auth/bearer';
import type { Config } from './env';
import { HttpError } from './http-error';
import { jsonBody } from './middleware/body';
import { apiNotFound, errorHandler } from './middleware/errors';
import { bySignedInPerson, rateLimit } from './middleware/rate-limit';
import { isReadMethod, requireUser } from './middleware/require-user';
import { accountRouter } from './routes/account';
import { allowanceTablesRouter } from './routes/allowance-tables';
import { attachmentsRouter } from './routes/attachments';
import { craftsRouter } from './routes/crafts';
import { exchangeRouter } from './routes/exchange';
import { openApiDocument } from './openapi';
import { notificationsRouter } from './routes/notifications';
import { organisationRouter } from './routes/organisation';
import { revisionControlRouter } from './routes/revision-control';
import { sheetsRouter } from './routes/sheets';
import { templatesRouter } from './routes/templates';
import { uncertaintyRouter } from './routes/uncertainty';
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
  // API answers are Cache-Control: no-store, so no client revalidates them: hashing every body for an ETag is wasted work.
  app.set('etag', false);
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
      // Over plain HTTP the header means nothing to a browser and would only mislead; sibling hosts are not ours to pin.
      strictTransportSecurity: config.secureCookies ? { maxAge: 31_536_000, includeSubDomains: false } : false,
    }),
  );
  app.use(permissionsPolicy);

  const auth = createAuth({ config, sequelize: deps.sequelize });
  // A script's access token signs in one request; browsers use the session, its cookies and CSRF tokens, all
  // passed over in one step for a token's request. Only the API reads either: the web app's files and pages
  // are the same for everyone, so they cost no lookup in PostgreSQL.
  // Every API answer may carry someone's data (and those that do not lose nothing): no cache keeps any of them.
  app.use('/api', noStore);
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
  app.use('/api/auth', jsonBody('auth'), auth.router);

  // Below this line the API is for signed-in people only, checked before anything else: an anonymous request is
  // 401 without its body being read. Then each person's limit on changes, then the JSON body, parsed only now and
  // up to the size that part of the API takes (most specific path first; multipart uploads pass to their routes'
  // multer). A new router needs only its mount line, `app.use('/api/…', someRouter(deps))`, among these.
  app.use('/api', requireUser, limitWrites(deps.sequelize, config));
  app.use('/api/crafts/:craftId/revisions', jsonBody('sheet'));
  app.use('/api', jsonBody('small'));
  app.use('/api/account', accountRouter(deps));
  app.use('/api/notifications', notificationsRouter(deps));
  app.use('/api/templates', templatesRouter());
  app.use('/api/crafts', craftsRouter(deps), sheetsRouter(deps), revisionControlRouter(deps));
  app.use('/api/crafts', attachmentsRouter(deps));
  app.use('/api/crafts', uncertaintyRouter());
  app.use('/api/crafts', allowanceTablesRouter(deps));
  app.use('/api/crafts', exchangeRouter(deps));
  app.use('/api/organisation', organisationRouter(deps));
  app.use('/api', apiNotFound);

  serveWebApp(app, config.webDist);
  app.use(errorHandler);
  return app;
}

/** Powerful browser features the app never uses, refused to it and to anything it might embed. */
const permissionsPolicy: RequestHandler = (_req, res, next) => {
  res.setHeader(
    'Permissions-Policy',
    'accelerometer=(), browsing-topics=(), camera=(), display-capture=(), geolocation=(), gyroscope=(), magnetometer=(), microphone=(), midi=(), payment=(), usb=()',
  );
  next();
};

const noStore: RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'no-store');
  next();
};

/** Changes per signed-in person per minute (any request but a read), counted in PostgreSQL across API processes. */
function limitWrites(sequelize: Sequelize, config: Config): RequestHandler {
  return rateLimit(sequelize, {
    name: 'writes',
    limit: config.writeRateLimit,
    windowMs: 60_000,
    what: 'changes',
    key: (req) => (isReadMethod(req.method) ? undefined : bySignedInPerson(req)),
  });
}

/** Serves the exported web app; client routes fall back to its index.html. */
function serveWebApp(app: Express, webDist: string) {
  const indexHtml = path.join(webDist, 'index.html');
  app.use(express.static(webDist, { index: false, maxAge: '1h' }));
  // The sizing sandbox was once at /what-if: bookmarks of the old address land on it.
  app.get('/what-if', (_req, res) => {
    res.redirect(301, '/sandbox');
  });
  app.get('/{*splat}', (_req, res) => {
    if (!fs.existsSync(indexHtml)) {
      res.status(503).type('text').send('The web app is not built yet: run `npm start`, which builds it.');
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexHtml);
  });
}
