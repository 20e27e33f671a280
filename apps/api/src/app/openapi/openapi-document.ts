import { OpenAPIRegistry, OpenApiGeneratorV3 } from '@asteasolutions/zod-to-openapi';
import { z } from 'zod';
import { apiErrorSchema, CAPABILITIES } from '@tallyfit/contracts';
import { ENGINE_VERSION } from '@tallyfit/engine';
import { API_PREFIX, type RouteDefinition, type RouteResponse } from '../http/route-table';

/** Error statuses a route can answer, by kind of route. */
function errorResponses(route: RouteDefinition): number[] {
  const statuses = [400];
  if (route.access !== 'public') statuses.push(401, 403);
  if (route.path.includes(':')) statuses.push(404);
  if (route.method !== 'get') statuses.push(409, 413, 415, 422);
  if (route.path === '/auth/login') statuses.push(429);
  return statuses;
}

const ERROR_DESCRIPTIONS: Record<number, string> = {
  400: 'invalid input; `fields` names each offending field',
  401: 'not signed in, or the token is expired or revoked',
  403: 'signed in, but the role or study role does not allow this',
  404: 'no such record, or not one the caller may read',
  409: 'conflicts with the current state (duplicate, wrong review status, newer version)',
  413: 'the body is larger than the limit',
  415: 'the body has a media type this route does not take',
  422: 'well-formed but cannot be processed',
  429: 'too many attempts; wait and try again',
};

const isRouteResponse = (value: z.ZodType | RouteResponse): value is RouteResponse =>
  typeof (value as RouteResponse).description === 'string' && !('safeParse' in value);

/** The route's rule in words, read from the capability table. */
function accessDescription(route: RouteDefinition): string {
  if (route.access === 'public') return 'Open to anyone.';
  const rule: { roles: readonly string[]; studyRoles?: readonly string[]; description: string } = CAPABILITIES[route.access];
  const inStudy = rule.studyRoles ? ` Inside a study also needs the study role ${rule.studyRoles.join(' or ')} (admins excepted).` : '';
  return `Capability \`${route.access}\` (${rule.description}). Roles: ${rule.roles.join(', ')}.${inStudy}`;
}

/** An upload's form: the file beside the declared text fields. */
const uploadedFile = z.object({ file: z.string().meta({ format: 'binary', description: 'the file' }) });
const documentedBody = (body: z.ZodType, contentType: string | undefined) =>
  contentType === 'multipart/form-data' ? uploadedFile.and(body) : body;

/** `/analyses/:id` → `/analyses/{id}` */
const openApiPath = (path: string) => path.replace(/:(\w+)/g, '{$1}');

/** The first path segment names the group unless the route says otherwise. */
const tagOf = (route: RouteDefinition) => route.tag ?? route.path.split('/')[1] ?? 'api';

/**
 * The OpenAPI 3 document, generated from the route table: each route's zod schemas for its
 * input and output, its access rule, and the shared error shape. Routes outside /api/v1 (the
 * browsable docs themselves) are left out.
 */
export function buildOpenApiDocument(routes: readonly RouteDefinition[]): object {
  const registry = new OpenAPIRegistry();
  registry.registerComponent('securitySchemes', 'bearer', {
    type: 'http',
    scheme: 'bearer',
    description: 'An access token from /auth/login, or a personal API token (tf_…) from /tokens',
  });
  // A schema with a meta id becomes a named component that every error response refers to.
  const errorSchema = apiErrorSchema.meta({ id: 'Error' });

  for (const route of routes) {
    if ((route.basePath ?? API_PREFIX) !== API_PREFIX) continue;
    const responses: Record<string, { description: string; content?: Record<string, { schema: z.ZodType | object }> }> = {};
    for (const [status, declared] of Object.entries(route.responses)) {
      if (!declared) continue;
      if (isRouteResponse(declared)) {
        responses[status] = declared.schema
          ? { description: declared.description, content: { [declared.contentType ?? 'application/json']: { schema: declared.schema } } }
          : declared.contentType
            ? { description: declared.description, content: { [declared.contentType]: { schema: { type: 'string', format: 'binary' } } } }
            : { description: declared.description };
      } else {
        responses[status] = { description: 'success', content: { 'application/json': { schema: declared } } };
      }
    }
    for (const status of errorResponses(route)) {
      responses[String(status)] ??= { description: ERROR_DESCRIPTIONS[status], content: { 'application/json': { schema: errorSchema } } };
    }
    const access = accessDescription(route);
    const { body, bodyContentType, query, params } = route.request ?? {};
    registry.registerPath({
      method: route.method,
      path: openApiPath(route.path),
      summary: route.summary,
      description: access,
      tags: [tagOf(route)],
      security: route.access === 'public' ? [] : [{ bearer: [] }],
      request: {
        ...(params ? { params: params as never } : {}),
        ...(query ? { query: query as never } : {}),
        ...(body ? { body: { content: { [bodyContentType ?? 'application/json']: { schema: documentedBody(body, bodyContentType) } } } } : {}),
      },
      responses,
    });
  }

  return new OpenApiGeneratorV3(registry.definitions).generateDocument({
    openapi: '3.0.3',
    info: {
      title: 'Tallyfit API',
      version: ENGINE_VERSION,
      description:
        'Store and review goodness-of-fit analyses of category counts. Errors always have the shape `{ error: { code, message, fields? } }`.',
    },
    servers: [{ url: API_PREFIX }],
  });
}
