/**
 * The API description: GET /api/docs (a readable HTML page), /api/docs/openapi.yaml
 * (OpenAPI 3.1, the same text as docs/openapi.yaml) and the page's stylesheet. Public,
 * like any published API reference; it describes routes, never data.
 */
import { Router, type RequestHandler } from 'express';
import { openApiSpec } from '../docs/openapi-spec';
import { openApiYamlText } from '../docs/openapi-yaml';
import { DOCS_CSS, renderApiHtml } from '../docs/render-html';

let cached: { yaml: string; html: string } | null = null;
const docs = () => (cached ??= { yaml: openApiYamlText(), html: renderApiHtml(openApiSpec() as unknown as Record<string, unknown>) });

const page: RequestHandler = (_req, res) => {
  res.type('html').set('Cache-Control', 'no-cache').send(docs().html);
};
const yaml: RequestHandler = (_req, res) => {
  res.type('application/yaml; charset=utf-8').set('Cache-Control', 'no-cache').send(docs().yaml);
};
const css: RequestHandler = (_req, res) => {
  res.type('text/css').set('Cache-Control', 'public, max-age=3600').send(DOCS_CSS);
};

/** Routes under /api/docs (mount at /docs). */
export function docsRouter(): Router {
  const router = Router();
  router.get('/', page);
  router.get('/openapi.yaml', yaml);
  router.get('/docs.css', css);
  return router;
}
