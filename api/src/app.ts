/**
 * The Express application factory. Order matters: public routes (health, the
 * OpenAPI document) come before sessions so they work while the database is
 * down; every /api/v1 route after them needs a session, and every
 * state-changing one a CSRF token.
 */
import compression from 'compression';
import express, { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import helmet from 'helmet';
import type { Knex } from 'knex';
import type pg from 'pg';
import { pinoHttp } from 'pino-http';
import type { Logger } from 'pino';
import { allowablesOpenApi } from './allowables/allowables.openapi.ts';
import { allowablesRouter } from './allowables/allowables.routes.ts';
import { analysesOpenApi } from './analyses/analyses.openapi.ts';
import { analysesRouter } from './analyses/analyses.routes.ts';
import { auditOpenApi, auditRouter } from './audit/audit.routes.ts';
import { authOpenApi, authRouter } from './auth/auth.routes.ts';
import { csrfProtection } from './auth/csrf.ts';
import type { OidcClient } from './auth/oidc-client.ts';
import { requireSession } from './auth/require-role.ts';
import { sessionMiddleware } from './auth/session.ts';
import { calculationOpenApi, calculationRouters } from './calculations/index.ts';
import { couponsOpenApi } from './coupons/coupons.openapi.ts';
import { couponsRouter } from './coupons/coupons.routes.ts';
import type { Config } from './config.ts';
import { healthOpenApi, healthRouter } from './health/health.routes.ts';
import { exportsOpenApi } from './exports/exports.openapi.ts';
import { exportsRouter } from './exports/exports.routes.ts';
import { errorHandler, notFoundHandler } from './http/errors.ts';
import { buildOpenApiDocument } from './http/openapi.ts';
import './http/request-user.ts';
import { layupsOpenApi } from './layups/layups.openapi.ts';
import { layupsRouter } from './layups/layups.routes.ts';
import { mailOpenApi, mailRouter } from './mail/mail.routes.ts';
import { createMailer } from './mail/mail.transport.ts';
import { startOutboxRetry } from './mail/outbox.service.ts';
import { materialsOpenApi } from './materials/materials.openapi.ts';
import { materialsRouter } from './materials/materials.routes.ts';
import { plyPropertiesOpenApi, plyPropertiesRouter } from './ply-properties/ply-properties.routes.ts';
import { staticClient } from './http/static-client.ts';
import { usersOpenApi, usersRouter } from './users/users.routes.ts';
import { PRODUCT_VERSION } from './version.ts';

export interface AppDeps {
  config: Config;
  db: Knex;
  /** Pool for the session store. */
  pool: pg.Pool;
  oidc: OidcClient;
  logger: Logger;
}

export function createApp(deps: AppDeps) {
  const { config, db } = deps;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  // Replies of the API are built per request and never cached (below), so an ETag would only cost a hash of each body.
  app.set('etag', false);

  app.use(
    pinoHttp({
      logger: deps.logger,
      autoLogging: { ignore: (req) => req.url === '/api/v1/health' || !/^\/(api|auth)\//.test(req.url ?? '') },
      // One short line per request: no headers (cookies must not reach the log).
      serializers: {
        req: (req) => ({ id: req.id, method: req.method, url: req.url }),
        res: (res) => ({ statusCode: res.statusCode }),
      },
    }),
  );
  // gzip for the client's bundles and the API's JSON (matrices and analyses compress well).
  app.use(compression());
  const issuerOrigin = new URL(config.oidc.issuer).origin;
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          formAction: ["'self'", issuerOrigin],
          frameAncestors: ["'none'"],
          upgradeInsecureRequests: config.appUrl.startsWith('https:') ? [] : null,
        },
      },
      strictTransportSecurity: config.appUrl.startsWith('https:'),
    }),
  );

  const openApi = buildOpenApiDocument(PRODUCT_VERSION, [healthOpenApi, authOpenApi, usersOpenApi, auditOpenApi, ...calculationOpenApi, materialsOpenApi, couponsOpenApi, analysesOpenApi, allowablesOpenApi, plyPropertiesOpenApi, mailOpenApi, layupsOpenApi, exportsOpenApi]);
  const publicApi = Router();
  publicApi.use(healthRouter(db, PRODUCT_VERSION));
  publicApi.get('/openapi.json', (_req, res) => {
    res.json(openApi);
  });
  app.use('/api/v1', publicApi);

  // Signed-in data stays out of shared and browser caches.
  app.use(['/api', '/auth'], (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  const sessions = sessionMiddleware(config, deps.pool, (message) => deps.logger.warn(message));
  const csrf = csrfProtection(config);
  app.use(['/api', '/auth'], sessions.middleware, csrf.issueToken);

  const signInLimit = rateLimit({
    windowMs: 60_000,
    limit: Number(process.env.PLYLEDGER_SIGN_IN_LIMIT_PER_MINUTE ?? (config.profile === 'test' ? 600 : 60)),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({ error: { code: 'too_many_sign_ins', message: 'Too many sign-in attempts from this address; wait a minute and try again', details: null } });
    },
  });
  app.use('/auth', signInLimit, authRouter({ db, config, oidc: deps.oidc, csrf }));

  const api = Router();
  api.use(express.json({ limit: '2mb' }));
  api.use(csrf.protect);
  api.use(requireSession);
  api.use(usersRouter(db));
  api.use(auditRouter(db));
  for (const router of calculationRouters) api.use(router);
  api.use(materialsRouter(db));
  api.use(couponsRouter(db));
  api.use(analysesRouter(db));
  const mailer = createMailer(config);
  startOutboxRetry(db, mailer);
  api.use(allowablesRouter(db, mailer));
  api.use(plyPropertiesRouter(db));
  api.use(mailRouter(db, mailer));
  api.use(layupsRouter(db));
  api.use(exportsRouter(db));
  app.use('/api/v1', api);
  app.use(['/api', '/auth'], notFoundHandler);

  app.use(staticClient(config.clientDist));
  app.use(errorHandler);
  return { app, openApi, sessionStore: sessions.store };
}
