/**
 * The API's own description: GET /api/docs/openapi.json (built from the route
 * table when first asked, so it lists every registered route) and a viewer at
 * GET /api/docs/ whose files are served from the installed swagger-ui-dist,
 * nothing from the internet.
 */
import fs from 'node:fs';
import path from 'node:path';
import swaggerUi from 'swagger-ui-express';
import type { RouteTable } from '../http/routes';
import type { AppContext } from '../context';
import { notFound } from '../http/errors';
import { openApiDocument } from '../apidocs/openapi';

const ASSETS_DIR = path.dirname(require.resolve('swagger-ui-dist/package.json'));
const ASSETS = new Set(['swagger-ui.css', 'swagger-ui-bundle.js', 'swagger-ui-standalone-preset.js', 'favicon-32x32.png', 'favicon-16x16.png']);
const SPEC_URL = '/api/docs/openapi.json';

export function registerDocsRoutes(routes: RouteTable, _ctx: AppContext) {
  let doc: object | null = null;
  routes.add('get', '/docs/openapi.json', 'public', (_req, res) => {
    doc ??= openApiDocument(routes.specs);
    res.json(doc);
  });

  // The viewer's page loads its files relative to itself, so it lives at /api/docs/.
  const page = swaggerUi.setup(undefined, { swaggerUrl: SPEC_URL, customSiteTitle: 'Headwater API', swaggerOptions: { validatorUrl: null } });
  const initScript = swaggerUi.serve[0];
  routes.add('get', '/docs', 'public', (req, res, next) => {
    if (!req.originalUrl.split('?')[0].endsWith('/')) return res.redirect(301, '/api/docs/');
    page(req, res, next);
  });
  routes.add('get', '/docs/:file', 'public', (req, res, next) => {
    const file = String(req.params.file);
    if (file === 'swagger-ui-init.js') return initScript(req, res, next);
    if (!ASSETS.has(file) || !fs.existsSync(path.join(ASSETS_DIR, file))) throw notFound(`no file ${file} in the API viewer`);
    res.sendFile(path.join(ASSETS_DIR, file), { maxAge: '1h' });
  });
}
