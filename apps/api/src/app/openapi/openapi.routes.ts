import type { Request, Response } from 'express';
import swaggerUi from 'swagger-ui-express';
import { z } from 'zod';
import { notFound } from '../http/http-error';
import { API_PREFIX, publicAccess, type RouteDefinition } from '../http/route-table';
import { buildOpenApiDocument } from './openapi-document';

const DOCS_BASE = '/api';
/** The only files the docs page loads (all shipped in swagger-ui-dist; nothing from a CDN). */
const DOCS_ASSETS = new Set([
  'swagger-ui.css',
  'swagger-ui-bundle.js',
  'swagger-ui-standalone-preset.js',
  'swagger-ui-init.js',
  'favicon-32x32.png',
  'favicon-16x16.png',
]);

/**
 * The OpenAPI document and its browsable page. `routes` is read when first asked for, so the
 * document covers every route in the table, including these.
 */
export function openApiRoutes(routes: () => readonly RouteDefinition[]): RouteDefinition[] {
  let document: object | undefined;
  const page = swaggerUi.setup(undefined, {
    customSiteTitle: 'Tallyfit API',
    swaggerOptions: { url: `${API_PREFIX}/openapi.json` },
  }) as (req: Request, res: Response) => void;
  const [initScript, assets] = swaggerUi.serve as unknown as [
    (req: Request, res: Response, next: (error?: unknown) => void) => void,
    (req: Request, res: Response, next: (error?: unknown) => void) => void,
  ];

  return [
    {
      method: 'get',
      path: '/openapi.json',
      access: publicAccess,
      summary: 'This API described in OpenAPI 3',
      tag: 'docs',
      responses: { 200: z.record(z.string(), z.unknown()) },
      handler: (_req, res) => {
        document ??= buildOpenApiDocument(routes());
        res.json(document);
      },
    },
    {
      method: 'get',
      path: '/docs',
      basePath: DOCS_BASE,
      access: publicAccess,
      summary: 'The API documentation as a browsable page',
      handler: (req, res) => {
        // The page loads its files by relative URL, so it must be served from /api/docs/.
        if (!req.originalUrl.split('?')[0].endsWith('/')) return res.redirect(301, `${DOCS_BASE}/docs/`);
        page(req, res);
      },
    },
    {
      method: 'get',
      path: '/docs/:asset',
      basePath: DOCS_BASE,
      access: publicAccess,
      summary: 'A file of the documentation page (script, style sheet or icon)',
      handler: (req, res, next) => {
        const asset = String(req.params['asset']);
        if (!DOCS_ASSETS.has(asset)) throw notFound(`no such documentation file: ${asset}`);
        // swagger-ui-express answers the init script itself and the rest from swagger-ui-dist.
        req.url = `/${asset}`;
        initScript(req, res, (error) => (error ? next(error) : assets(req, res, next)));
      },
    },
  ];
}
