import type { Express, NextFunction, Request, RequestHandler, Response } from 'express';
import type { z } from 'zod';
import { can, type Capability, type User } from '@tallyfit/contracts';
import { forbidden, HttpError, unauthorized } from './http-error';
import { parseInput } from './validate';

/**
 * Who may call a route: a capability from the one table in `@tallyfit/contracts`, or `public`.
 * Deny by default: a route cannot be declared without saying this, and the role matrix test walks
 * every declared route.
 */
export type RouteAccess = Capability | 'public';

export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';

/** The zod schemas of a route's input: `mountRoutes` parses each, and the OpenAPI document shows them. */
export interface RouteRequestSchemas<Params extends z.ZodType, Query extends z.ZodType, Body extends z.ZodType> {
  params?: Params;
  query?: Query;
  body?: Body;
  /**
   * A multipart upload: the body schema describes the form's fields for the document; the upload
   * parser in `before` reads the file, and the text fields are parsed with `body` after it.
   */
  bodyContentType?: 'multipart/form-data';
}

/** A response that is not plain JSON, or that needs its own description. */
export interface RouteResponse {
  description: string;
  /** Defaults to application/json. */
  contentType?: string;
  /** The body's schema; absent for an empty body or a file. */
  schema?: z.ZodType;
}

/** What a handler receives: the input already parsed by the route's own schemas. */
export interface RouteInput<Params, Query, Body, Caller> {
  params: Params;
  query: Query;
  body: Body;
  /** The signed-in caller; undefined only on public routes. */
  user: Caller;
  req: Request;
  res: Response;
}

type Parsed<Schema> = Schema extends z.ZodType ? z.infer<Schema> : undefined;
type CallerOf<Access extends RouteAccess> = Access extends 'public' ? User | undefined : User;

export interface RouteSpec<
  Access extends RouteAccess,
  Params extends z.ZodType,
  Query extends z.ZodType,
  Body extends z.ZodType,
> {
  method: HttpMethod;
  /** Path below the base path (normally /api/v1), in Express 5 syntax. */
  path: string;
  access: Access;
  summary: string;
  /** Groups routes in the OpenAPI document (defaults to the path's first segment). */
  tag?: string;
  request?: RouteRequestSchemas<Params, Query, Body>;
  /** Success responses by status: a JSON schema or a full description. Errors are documented for every route. */
  responses: Partial<Record<number, z.ZodType | RouteResponse>>;
  /** Mount somewhere other than /api/v1 (the browsable docs live at /api/docs). */
  basePath?: string;
  /** Middleware run after the access check and the params check, before the body is parsed (a rate limit, an upload parser). */
  before?: RequestHandler[];
  /**
   * Answers the request: return the body (sent as JSON with the route's success status, or an
   * empty 204), or write `res` yourself for a file, a redirect or a status chosen at run time.
   */
  handler: (input: RouteInput<Parsed<Params>, Parsed<Query>, Parsed<Body>, CallerOf<Access>>) => unknown;
}

/** A declared route with its input types erased, as the table, the mounter and the document see it. */
export type RouteDefinition = Omit<RouteSpec<RouteAccess, z.ZodType, z.ZodType, z.ZodType>, 'handler' | 'request'> & {
  request?: RouteRequestSchemas<z.ZodType, z.ZodType, z.ZodType>;
  handler: (input: RouteInput<unknown, unknown, unknown, User | undefined>) => unknown;
};

/** Declares one route; the handler's input is typed from the route's own schemas. */
export function defineRoute<
  Access extends RouteAccess,
  Params extends z.ZodType = z.ZodUndefined,
  Query extends z.ZodType = z.ZodUndefined,
  Body extends z.ZodType = z.ZodUndefined,
>(spec: RouteSpec<Access, Params, Query, Body>): RouteDefinition {
  return spec as unknown as RouteDefinition;
}

export const API_PREFIX = '/api/v1';

/** The full path Express sees for a route. */
export const fullPath = (route: Pick<RouteDefinition, 'path' | 'basePath'>): string => (route.basePath ?? API_PREFIX) + route.path;

/** Whether a role passes a route's access rule (the study part is the services' to check). */
export const routeAllows = (route: Pick<RouteDefinition, 'access'>, role: User['role']): boolean =>
  route.access === 'public' || can(role, route.access);

/**
 * Mounts the routes, each behind authentication (unless public) and its capability check, then
 * parses the declared params, query and body, in that order, so a handler only ever sees input
 * that matches what the OpenAPI document promises.
 */
export function mountRoutes(app: Express, routes: readonly RouteDefinition[], authenticate: RequestHandler): void {
  for (const route of routes) {
    const guards: RequestHandler[] = route.access === 'public' ? [] : [authenticate, requireCapability(route)];
    const bodyCheck = route.method === 'get' || route.method === 'delete' ? [] : [requireJsonOrUpload];
    app[route.method](fullPath(route), ...guards, ...bodyCheck, parseParams(route), ...(route.before ?? []), handle(route));
  }
}

/**
 * A body that is neither JSON nor an upload (multipart, checked by the upload routes themselves)
 * gets a 415 rather than a confusing "field is required".
 */
const requireJsonOrUpload: RequestHandler = (req, _res, next) => {
  const hasBody = Number(req.headers['content-length'] ?? 0) > 0 || req.headers['transfer-encoding'] !== undefined;
  if (hasBody && !req.is(['application/json', 'multipart/form-data'])) {
    return next(new HttpError(415, 'unsupported_media_type', 'send the request body as JSON (Content-Type: application/json)'));
  }
  next();
};

function requireCapability(route: RouteDefinition): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(unauthorized());
    if (!routeAllows(route, req.user.role)) return next(forbidden());
    next();
  };
}

/** Bad ids are refused before any `before` middleware (an upload) starts work on them. */
const PARSED_PARAMS = Symbol('parsed params');
type WithParsedParams = Request & { [PARSED_PARAMS]?: unknown };

function parseParams(route: RouteDefinition): RequestHandler {
  return (req, _res, next) => {
    const schema = route.request?.params;
    if (schema) (req as WithParsedParams)[PARSED_PARAMS] = parseInput(schema, req.params, 'path');
    next();
  };
}

/** What a body-less request's body reads as, so `{}`-shaped schemas accept an empty POST. */
const bodyOf = (req: Request): unknown => req.body ?? {};

/** The status a returned body is sent with: the route's first declared success. */
const successStatus = (route: RouteDefinition): number =>
  Math.min(...Object.keys(route.responses).map(Number).filter((status) => status >= 200 && status < 300));

function handle(route: RouteDefinition): RequestHandler {
  const { query, body } = route.request ?? {};
  const status = successStatus(route);
  return async (req: Request, res: Response, next: NextFunction) => {
    try {
      const answer = await route.handler({
        params: (req as WithParsedParams)[PARSED_PARAMS],
        query: query ? parseInput(query, req.query, 'query') : undefined,
        body: body ? parseInput(body, bodyOf(req), 'body') : undefined,
        user: req.user,
        req,
        res,
      });
      if (res.headersSent) return;
      if (answer === undefined) res.status(status).end();
      else res.status(status).json(answer);
    } catch (error) {
      next(error);
    }
  };
}

/** Lets a `before` middleware read the already-parsed params (an upload checks the study first). */
export const parsedParams = <Params>(req: Request): Params => (req as WithParsedParams)[PARSED_PARAMS] as Params;
