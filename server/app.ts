/**
 * The Express application, apart from `listen` so tests drive it in process.
 * route -> authenticate -> requireRole -> body parser -> validate -> handler -> service
 * (server/http/routes.ts puts the body parser after the checks).
 */
import path from 'node:path';
import express, { type RequestHandler } from 'express';
import compression from 'compression';
import helmet from 'helmet';
import type { AppContext } from './context';
import { parseTrustProxy } from './config';
import { errorHandler, notFoundHandler } from './http/errors';
import { RouteTable } from './http/routes';
import { precompressed } from './http/precompressed';
import { authenticate } from './auth/authenticate';
import { UserRowCache } from './auth/userRowCache';
import { UserChangeListener } from './auth/userChanges';
import { loadUserRow } from './services/users';
import { registerAuthRoutes } from './routes/auth';
import { registerSystemRoutes } from './routes/system';
import { routeRegistrars } from './routes';

/**
 * Security headers. HSTS and the CSP directive upgrade-insecure-requests only
 * make sense over HTTPS: sent over plain HTTP on a LAN address they make the
 * browser ask for https:// scripts that nothing serves, and the app is blank.
 * req.secure is true for a TLS connection, or behind a trusted proxy that
 * says X-Forwarded-Proto: https.
 */
function securityHeaders(): RequestHandler {
  const directives = {
    // react-native-web writes style elements at run time
    'style-src': ["'self'", "'unsafe-inline'"],
    'img-src': ["'self'", 'data:', 'blob:'],
    'font-src': ["'self'", 'data:'],
    'script-src': ["'self'"],
  };
  const overHttps = helmet({ contentSecurityPolicy: { useDefaults: true, directives } });
  const overHttp = helmet({
    contentSecurityPolicy: { useDefaults: true, directives: { ...directives, 'upgrade-insecure-requests': null } },
    strictTransportSecurity: false,
  });
  return (req, res, next) => (req.secure ? overHttps : overHttp)(req, res, next);
}

export function createApp(ctx: AppContext) {
  const app = express();
  app.disable('x-powered-by');
  // Off unless TRUST_PROXY says which proxy to believe: otherwise anyone could
  // set X-Forwarded-For and get a fresh sign-in allowance per invented address.
  app.set('trust proxy', parseTrustProxy(ctx.config.TRUST_PROXY));
  app.use(securityHeaders());

  const api = express.Router();
  // user rows cached per process while changes to users are heard (auth/userRowCache.ts); closed with the context
  const userRows = new UserRowCache();
  ctx.userChanges = new UserChangeListener(ctx.db.url, userRows);
  ctx.userChanges.start();
  const routes = new RouteTable(api, authenticate(ctx.config.JWT_SECRET, loadUserRow, userRows), {
    small: ctx.config.BODY_LIMIT,
    // a whole network document may be tens of megabytes
    large: ctx.config.IMPORT_BODY_LIMIT,
    public: '16kb',
  });
  registerSystemRoutes(routes, ctx);
  registerAuthRoutes(routes, ctx);
  for (const register of routeRegistrars) register(routes, ctx);
  api.use(notFoundHandler);
  api.use(errorHandler);
  app.use('/api', api);

  // The exported web app, with index.html for deep links (web.output "single").
  const webDir = ctx.config.WEB_DIR;
  const index = path.join(webDir, 'index.html');
  // Compressed on the way out: the app's script is megabytes as built and a
  // phone on a weak signal feels every one. The build compresses its files
  // once with brotli 11 and gzip (http/precompressed.ts); anything else is
  // compressed per request. (The API answers are not: reach is small and hot.)
  const web = express.Router();
  // The service worker (src/offline) must be checked afresh on every visit, or
  // a new version of the app could wait an hour behind an old worker.
  const noCache = (res: express.Response, file: string) => {
    if (path.basename(file) === 'sw.js') res.setHeader('Cache-Control', 'no-cache');
  };
  web.use(precompressed(webDir, { maxAgeSeconds: 3600, setHeaders: noCache }));
  web.use(compression());
  web.use(express.static(webDir, { index: false, maxAge: '1h', fallthrough: true, setHeaders: noCache }));
  app.use(web);
  app.get(/.*/, (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index, (err) => {
      const code = (err as NodeJS.ErrnoException | undefined)?.code;
      // no error, or the browser left before the page was sent
      if (!err || code === 'ECONNABORTED') return;
      if (code !== 'ENOENT') return next(err);
      res.status(503).type('text/plain').send('The web app has not been built yet: run `npm run web:build` (npm start does it for you).');
    });
  });
  app.use(errorHandler);

  return { app, routes: routes.specs };
}
