import express, { type Express } from 'express';
import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import helmet from 'helmet';
import compression from 'compression';
import pg from 'pg';
import path from 'node:path';
import { existsSync } from 'node:fs';
import { env, ROOT_DIR } from './config/env';
import { initModels } from './db/models';
import { configurePassport } from './auth/passport';
import { requireSignIn } from './auth/authorize';
import { withSessionCache } from './auth/session-cache';
import { sameOriginOnly } from './middleware/same-origin';
import { rejectNulCharacters } from './middleware/no-nul';
import { noStore } from './middleware/no-store';
import { settleOutbox } from './services/outbox';
import { errorHandler, notFoundApi } from './middleware/error-handler';
import { authRouter } from './modules/auth/router';
import { healthRouter } from './modules/health/router';
import { materialsRouter, propertySetsRouter } from './modules/property-sets/router';
import { watchPropertySetChanges } from './modules/property-sets/snapshot';
import { startChangeFeed, stopChangeFeed } from './services/change-feed';
import { evaluateRouter, pressureRouter } from './modules/evaluate/router';
import { libraryRouter } from './modules/library/router';
import { referencesRouter } from './modules/references/router';
import { ratingTablesRouter } from './modules/rating-tables/router';
import { adminRouter } from './modules/admin/router';
import { loadCasesRouter, peopleRouter, projectsRouter, recordsRouter, shortlistsRouter } from './modules/projects/router';
import { accountRouter, adminUsersRouter } from './modules/users/router';
import { mountApi } from './openapi/route-table';
import { openApiRouter } from './openapi/router';

export interface AppHandle {
  app: Express;
  /** Resolves once the process listens on the change feed (or its first try failed). */
  ready: Promise<void>;
  /** Closes what the app opened itself (the session store's pool, the change feed's connection). */
  close(): Promise<void>;
}

export function createApp(): AppHandle {
  const config = env();
  initModels();
  watchPropertySetChanges();
  // Caches serve only once this process listens for changes made by the others (change-feed.ts).
  const feed = startChangeFeed();
  const passport = configurePassport();

  const app = express();
  app.disable('x-powered-by');
  // API answers are not revalidated by ETag (the client caches through its query cache), and
  // hashing every body cost more than answering; static files keep their own validators.
  app.set('etag', false);
  // Off unless TRUST_PROXY says which proxies to believe: otherwise anyone could name their own
  // address in X-Forwarded-For (and dodge the sign-in throttle).
  app.set('trust proxy', config.TRUST_PROXY);
  app.set('query parser', 'simple');

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'default-src': ["'self'"],
          'script-src': ["'self'"],
          'style-src': ["'self'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'"],
          'connect-src': ["'self'"],
          'object-src': ["'none'"],
          'frame-ancestors': ["'none'"],
          'upgrade-insecure-requests': config.cookieSecure ? [] : null,
        },
      },
      hsts: config.cookieSecure,
    }),
  );

  const sessionPool = new pg.Pool({ connectionString: config.DATABASE_URL, max: 10, idleTimeoutMillis: 60_000, connectionTimeoutMillis: 3_000 });
  sessionPool.on('error', () => {
    /* idle client lost (database restarted); the pool reconnects on next use */
  });
  const PgStore = connectPgSimple(session);
  const store = withSessionCache(new PgStore({
    pool: sessionPool,
    tableName: 'session',
    createTableIfMissing: false,
    pruneSessionInterval: config.NODE_ENV === 'test' ? false : 15 * 60,
    // Sessions last a fixed 12 h from sign-in; without this every request would also UPDATE its row.
    disableTouch: true,
  }));

  // Answers are gzipped on the fly, except the two served from the answer caches, which keep a
  // gzipped copy and skip the compressor altogether.
  const compress = compression({ threshold: 1024 });
  const PRECOMPRESSED = new Set(['/api/evaluate', '/api/property-sets']);
  app.use((req, res, next) => (PRECOMPRESSED.has(req.path) ? next() : compress(req, res, next)));

  const api = express.Router();
  api.use(express.json({ limit: '1mb', strict: true }));
  api.use(rejectNulCharacters);
  api.use(sameOriginOnly);
  api.use(
    session({
      name: 'isobath.sid',
      secret: config.SESSION_SECRET,
      store,
      resave: false,
      saveUninitialized: false,
      rolling: false,
      cookie: { httpOnly: true, sameSite: 'lax', secure: config.cookieSecure, maxAge: 12 * 3600_000 },
    }),
  );
  api.use(passport.session());
  // Answers may carry accounts, tokens in caught mail, audit entries and records: no browser or
  // proxy keeps a copy. A route that streams a file may still set its own header.
  api.use(noStore);

  // Public: sign-in, account recovery, health and the API description. Everything after
  // requireSignIn needs a session, and every route names its permission (route-table.ts reads them).
  const mount = (base: string, router: ReturnType<typeof authRouter>) => mountApi(app, api, base, router);
  mount('/auth', authRouter());
  mount('/auth', accountRouter());
  mount('/health', healthRouter());
  mount('/openapi.json', openApiRouter(app));
  api.use(requireSignIn);
  mount('/property-sets', propertySetsRouter());
  mount('/materials', materialsRouter());
  mount('/evaluate', evaluateRouter());
  mount('/pressure', pressureRouter());
  mount('/library', libraryRouter());
  mount('/references', referencesRouter());
  mount('/rating-tables', ratingTablesRouter());
  mount('/admin', adminRouter());
  mount('/admin', adminUsersRouter());
  mount('/projects', projectsRouter());
  mount('/people', peopleRouter());
  mount('/load-cases', loadCasesRouter());
  mount('/shortlists', shortlistsRouter());
  mount('/records', recordsRouter());
  api.use(notFoundApi);

  app.use('/api', api);

  const dist = path.join(ROOT_DIR, 'dist');
  if (existsSync(path.join(dist, 'index.html'))) {
    app.use(express.static(dist, { index: false, maxAge: '1h', immutable: false }));
    app.get('/{*splat}', (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(path.join(dist, 'index.html'));
    });
  }
  app.use(errorHandler);

  return {
    app,
    ready: feed,
    close: async () => {
      // Deliveries this process started (after a response, for instance) finish first.
      await settleOutbox();
      await stopChangeFeed();
      store.close();
      await sessionPool.end().catch(() => undefined);
    },
  };
}
