/**
 * The Express application, apart from `listen` so tests drive it in process.
 * route -> authenticate -> requireRole -> validate -> handler -> service.
 */
import path from 'node:path';
import express from 'express';
import helmet from 'helmet';
import type { AppContext } from './context';
import { errorHandler, notFoundHandler } from './http/errors';
import { authenticate, RouteTable } from './http/routes';
import { isActiveUser } from './services/users';
import { registerAuthRoutes } from './routes/auth';
import { registerSystemRoutes } from './routes/system';
import { routeRegistrars } from './routes';

export function createApp(ctx: AppContext) {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          // react-native-web writes style elements at run time
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'script-src': ["'self'"],
        },
      },
    }),
  );

  const api = express.Router();
  // A whole network document may be tens of megabytes; every other body is small.
  api.use('/network/import', express.json({ limit: ctx.config.IMPORT_BODY_LIMIT }));
  api.use(express.json({ limit: ctx.config.BODY_LIMIT }));
  const routes = new RouteTable(api, authenticate(ctx.config.JWT_SECRET, isActiveUser));
  registerSystemRoutes(routes, ctx);
  registerAuthRoutes(routes, ctx);
  for (const register of routeRegistrars) register(routes, ctx);
  api.use(notFoundHandler);
  api.use(errorHandler);
  app.use('/api', api);

  // The exported web app, with index.html for deep links (web.output "single").
  const webDir = ctx.config.WEB_DIR;
  const index = path.join(webDir, 'index.html');
  app.use(express.static(webDir, { index: false, maxAge: '1h', fallthrough: true }));
  app.get(/.*/, (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index, (err) => {
      if (!err) return;
      if ((err as NodeJS.ErrnoException).code !== 'ENOENT') return next(err);
      res.status(503).type('text/plain').send('The web app has not been built yet: run `npm run web:build` (npm start does it for you).');
    });
  });
  app.use(errorHandler);

  return { app, routes: routes.specs };
}
