import type { Request, Response } from 'express';
import swaggerUi from 'swagger-ui-express';
import { z } from 'zod';
import { notFound } from '../http/http-error';
import { API_PREFIX, defineRoute, type RouteDefinition } from '../http/route-table';
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

const docsAssetParamsSchema = z.object({ asset: z.string() });

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
    defineRoute({
      method: 'get',
      path: '/openapi.json',
      access: 'public',
      summary: 'This API described in OpenAPI 3',
      tag: 'docs',
      responses: { 200: z.record(z.string(), z.unknown()) },
      handler: () => (document ??= buildOpenApiDocument(routes())),
    }),
    defineRoute({
      method: 'get',
      path: '/docs',
      basePath: DOCS_BASE,
      access: 'public',
      summary: 'The API documentation as a browsable page',
      responses: { 200: { description: 'the documentation page', contentType: 'text/html' } },
      handler: ({ req, res }) => {
        // The page loads its files by relative URL, so it must be served from /api/docs/.
        if (!req.originalUrl.split('?')[0].endsWith('/')) return res.redirect(301, `${DOCS_BASE}/docs/`);
        page(req, res);
      },
    }),
    defineRoute({
      method: 'get',
      path: '/docs/:asset',
      basePath: DOCS_BASE,
      access: 'public',
      summary: 'A file of the documentation page (script, style sheet or icon)',
      request: { params: docsAssetParamsSchema },
      responses: { 200: { description: 'the file', contentType: 'application/octet-stream' } },
      handler: ({ params, req, res }) => {
        if (!DOCS_ASSETS.has(params.asset)) throw notFound(`no such documentation file: ${params.asset}`);
        return new Promise<void>((resolve, reject) => {
          // swagger-ui-express answers the init script itself and the rest from swagger-ui-dist.
          req.url = `/${params.asset}`;
          const fail = (error?: unknown) => (error ? reject(error) : reject(notFound(`no such documentation file: ${params.asset}`)));
          res.once('finish', () => resolve());
          initScript(req, res, (error) => (error ? fail(error) : assets(req, res, fail)));
        });
      },
    }),
  ];
}
