/**
 * Builds the Express application (no listen): security headers, logging, sessions in
 * MariaDB, CSRF, the API routers, the fake IdP in development, and the JSON error handler.
 * Tests drive it with supertest; server/main.ts listens.
 */
import fs from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import SequelizeStoreInit from 'connect-session-sequelize';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import type { Sequelize } from 'sequelize';
import { ensureFakeIdpKeys } from './auth/fake-idp/keys';
import { fakeIdpRouter } from './auth/fake-idp/router';
import { createSamlPassport, samlSettings } from './auth/saml';
import type { Config } from './config';
import { createLogger } from './logger';
import { loadUser } from './middleware/auth';
import { csrfProtection } from './middleware/csrf';
import { apiNotFound, errorHandler } from './middleware/errors';
import './middleware/session-types';
import { initModels } from './models/index';
import { adminUsersRouter } from './routes/admin-users';
import { auditRouter } from './routes/audit';
import { authRouter } from './routes/auth';
import { departmentsRouter } from './routes/departments';
import { healthRouter } from './routes/health';
import { lettersRouter, requestLettersRouter } from './routes/letters';
import { notificationsRouter } from './routes/notifications';
import { requestsRouter } from './routes/requests';
import { datasetsRouter } from './routes/datasets';
import { filingRouter } from './routes/filing';
import { roleMappingsRouter } from './routes/role-mappings';
import { assignmentRouter } from './routes/assignment';
import { meRouter } from './routes/me';
import { officeSettingsRouter } from './routes/office-settings';
import { outboxRouter } from './routes/outbox';
import { workloadRouter } from './routes/workload';
import { checklistRouter } from './routes/checklist';
import { commentsRouter } from './routes/comments';
import { docsRouter } from './routes/docs';
import { rerunsRouter, requestRerunsRouter } from './routes/reruns';
import { reviewActionsRouter } from './routes/review-actions';
import { configureMailer } from './services/mailer';

/** What the application is built from. */
export interface AppDeps {
  sequelize: Sequelize;
  config: Config;
  logger?: Logger;
  /** Built Angular app to serve with an SPA fallback (e.g. dist/assayer/browser); omitted in API tests. */
  staticDir?: string;
  /** Extra routers mounted under /api by later features, e.g. { '/workload': router }. Mounted after the core routes. */
  extraApiRouters?: Record<string, express.Router>;
}

/** Name of the httpOnly session cookie. */
export const SESSION_COOKIE = 'assayer.sid';

function appVersion(): string {
  try {
    return (JSON.parse(fs.readFileSync(path.resolve('package.json'), 'utf8')) as { version?: string }).version ?? '0.0.0';
  } catch {
    return '0.0.0';
  }
}

/** Creates the Express app; models are bound to the given connection. */
export function createApp(deps: AppDeps): Express {
  const { sequelize, config } = deps;
  const logger = deps.logger ?? createLogger(config.logLevel);
  const secure = config.publicUrl.startsWith('https:');
  initModels(sequelize);
  configureMailer(config, logger);

  const fakeKeys = config.samlEntryPoint ? null : ensureFakeIdpKeys(config.runDir);
  const samlConf = samlSettings(config, fakeKeys?.certPem ?? null);
  const saml = createSamlPassport(samlConf);

  const app = express();
  // Behind a reverse proxy set TRUST_PROXY (e.g. "1" or "loopback") so req.ip, rate limits and secure cookies see the client.
  if (config.trustProxy) app.set('trust proxy', /^\d+$/.test(config.trustProxy) ? Number(config.trustProxy) : config.trustProxy);
  app.disable('x-powered-by');
  app.use(helmet({
    contentSecurityPolicy: {
      useDefaults: true,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        // Angular's build and Material inject inline styles.
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", 'data:'],
        fontSrc: ["'self'", 'data:'],
        connectSrc: ["'self'"],
        formAction: ["'self'"],
        frameAncestors: ["'none'"],
        objectSrc: ["'none'"],
        upgradeInsecureRequests: secure ? [] : null,
      },
    },
    strictTransportSecurity: secure ? undefined : false,
  }));
  app.use(pinoHttp({
    logger,
    customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info'),
    autoLogging: { ignore: (req) => req.url === '/api/health' },
  }));
  app.use(express.json({ limit: '256kb' }));
  app.use(cookieParser());

  if (fakeKeys) {
    app.use('/fake-idp', fakeIdpRouter({ keys: fakeKeys, idpEntityId: samlConf.idpIssuer!, spEntityId: samlConf.issuer, acsUrl: samlConf.callbackUrl }));
  }

  const SequelizeStore = SequelizeStoreInit(session.Store);
  const store = new SequelizeStore({
    db: sequelize,
    table: 'Session',
    expiration: 8 * 3600_000,
    extendDefaultFields: (defaults, s: { userId?: string }) => ({ data: defaults.data, expires: defaults.expires, userId: s.userId ?? null }),
  });
  const api = express.Router();
  api.use(session({
    name: SESSION_COOKIE,
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: Boolean(config.trustProxy),
    // lax (not strict): the browser must send the cookie when the IdP's POST lands us back on the app.
    cookie: { httpOnly: true, secure, sameSite: 'lax', maxAge: 8 * 3600_000, path: '/' },
  }));
  api.use(loadUser);
  // Letter verification by upload changes nothing and is public (no session, no token to echo), so it needs no CSRF token.
  api.use(csrfProtection({ secure, exempt: ['/auth/saml/callback', '/letters/verify'], quiet: ['/health'] }));
  api.use('/health', healthRouter(sequelize, appVersion()));
  api.use('/auth', authRouter({ config, saml }));
  api.use('/departments', departmentsRouter());
  api.use('/requests', requestsRouter());
  api.use('/requests', datasetsRouter());
  api.use('/requests', filingRouter());
  api.use('/admin/users', adminUsersRouter(config));
  api.use('/admin/role-mappings', roleMappingsRouter());
  api.use('/audit', auditRouter());
  api.use('/notifications', notificationsRouter());
  api.use('/requests/:id/assignment', assignmentRouter());
  api.use('/workload', workloadRouter());
  api.use('/office', officeSettingsRouter());
  api.use('/me', meRouter());
  api.use('/admin/outbox', outboxRouter());
  api.use('/requests', requestLettersRouter(config));
  api.use('/letters', lettersRouter(config));
  api.use('/requests', requestRerunsRouter());
  api.use('/requests', checklistRouter());
  api.use('/requests', commentsRouter());
  api.use('/requests', reviewActionsRouter());
  api.use('/reruns', rerunsRouter());
  api.use('/docs', docsRouter());
  for (const [mount, router] of Object.entries(deps.extraApiRouters ?? {})) api.use(mount, router);
  api.use(apiNotFound);
  app.use('/api', api);

  if (deps.staticDir) {
    const dir = path.resolve(deps.staticDir);
    app.use(express.static(dir, { index: false, maxAge: '1h' }));
    // Client-side routes (everything not /api) get the app shell.
    app.get('/{*splat}', (_req, res) => { res.sendFile(path.join(dir, 'index.html')); });
  }
  app.use(errorHandler);
  return app;
}
