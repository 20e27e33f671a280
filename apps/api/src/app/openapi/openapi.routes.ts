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

/**
 * Our own look for the docs page: the explorer's top bar and logo hidden, a Tallyfit header in its
 * place, and the console's teal (primary 40 and 30 of its palette) for headings, links and buttons.
 */
const DOCS_CSS = `
.swagger-ui .topbar { display: none; }
body { margin: 0; background: #f6fafa; }
.swagger-ui { font-family: Roboto, Arial, sans-serif; }
.swagger-ui .information-container { background: #00696c; padding: 4px 0 12px; }
.swagger-ui .information-container::before {
  content: 'Tallyfit · API for goodness-of-fit checks'; display: block; max-width: 1460px; margin: 0 auto;
  padding: 16px 20px 0; color: #b6fdff; font: 500 14px Roboto, Arial, sans-serif; letter-spacing: .04em;
}
.swagger-ui .info { margin: 12px auto 8px; }
.swagger-ui .info .title, .swagger-ui .info p, .swagger-ui .info li, .swagger-ui .info a { color: #ffffff; }
.swagger-ui .info .title small { background: #004f51; }
.swagger-ui .info .title small.version-stamp { background: #38656d; }
.swagger-ui a { color: #00696c; }
.swagger-ui .opblock-tag { color: #004f51; border-bottom-color: #bcebf3; }
.swagger-ui .btn.authorize { color: #00696c; border-color: #00696c; }
.swagger-ui .btn.authorize svg { fill: #00696c; }
.swagger-ui .btn.execute { background: #00696c; border-color: #00696c; }
`;

const docsAssetParamsSchema = z.object({ asset: z.string() });

/**
 * The OpenAPI document and its browsable page. `routes` is read when first asked for, so the
 * document covers every route in the table, including these.
 */
export function openApiRoutes(routes: () => readonly RouteDefinition[]): RouteDefinition[] {
  let document: object | undefined;
  const page = swaggerUi.setup(undefined, {
    customSiteTitle: 'Tallyfit API',
    customCss: DOCS_CSS,
    customfavIcon: '/favicon.svg',
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
