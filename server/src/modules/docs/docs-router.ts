import fs from 'node:fs';
import path from 'node:path';
import { Router, type Express } from 'express';
import { PROJECT_ROOT } from '../../config/paths';
import swaggerUi from 'swagger-ui-express';
import { buildOpenApiDocument } from './openapi';

const DOCUMENT_URL = '/api/v1/openapi.json';

/**
 * The API reference: `GET /api/v1/openapi.json` (OpenAPI 3.1, generated from the routes the app
 * serves and their zod contracts, once, on first request) and a reference page at `/api/docs/`
 * whose scripts and styles are served from this site, so the app's own CSP holds.
 */
export function createDocsModule(deps: { version?: string } = {}) {
  const version = deps.version ?? packageVersion();
  let document: ReturnType<typeof buildOpenApiDocument> | null = null;
  const api = Router();
  api.get('/openapi.json', (req, res) => {
    document ??= buildOpenApiDocument(req.app as Express, version);
    res.setHeader('Cache-Control', 'public, max-age=300');
    res.json(document);
  });

  const page = Router();
  const options = {
    swaggerUrl: DOCUMENT_URL,
    customSiteTitle: 'Thalpos API reference',
    // No calls to an outside validator: the page talks to this site only.
    swaggerOptions: { validatorUrl: null, tryItOutEnabled: true },
  };
  // The page loads its scripts by relative URL, so it lives at the path with the slash.
  page.get('/docs', (req, res, next) =>
    req.originalUrl.split('?')[0]!.endsWith('/') ? next() : res.redirect(301, '/api/docs/'),
  );
  page.use('/docs/', swaggerUi.serveFiles(undefined, options), swaggerUi.setup(undefined, options));
  return { api, page };
}

function packageVersion(): string {
  const manifest = path.join(PROJECT_ROOT, 'package.json');
  return (JSON.parse(fs.readFileSync(manifest, 'utf8')) as { version: string }).version;
}
