import type { Express, NextFunction, Request, RequestHandler, Response } from 'express';
import type { z } from 'zod';
import type { Role } from '@tallyfit/contracts';
import { forbidden, HttpError, unauthorized } from './http-error';

/**
 * Who may call a route. Deny by default: a route cannot be mounted without saying this,
 * and the role matrix test walks every declared route.
 */
export type Access = { kind: 'public' } | { kind: 'roles'; roles: readonly Role[] };

export const publicAccess: Access = { kind: 'public' };
export const rolesAccess = (...roles: Role[]): Access => ({ kind: 'roles', roles });
export const anyRole = rolesAccess('admin', 'lead', 'analyst', 'viewer');

export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';

/** The zod schemas of a route's input, for the OpenAPI document (handlers still parse with parseInput). */
export interface RouteRequestSchemas {
  body?: z.ZodType;
  /** Defaults to application/json (an upload route says multipart/form-data). */
  bodyContentType?: string;
  query?: z.ZodType;
  params?: z.ZodType;
}

/** A response that is not plain JSON, or that needs its own description. */
export interface RouteResponse {
  description: string;
  /** Defaults to application/json. */
  contentType?: string;
  /** The body's schema; absent for an empty body or a file. */
  schema?: z.ZodType;
}

export interface RouteDefinition {
  method: HttpMethod;
  /** Path below the base path (normally /api/v1), in Express 5 syntax. */
  path: string;
  access: Access;
  summary: string;
  /** Groups routes in the OpenAPI document (defaults to the path's first segment). */
  tag?: string;
  request?: RouteRequestSchemas;
  /** Success responses by status: a JSON schema or a full description. Errors are documented for every route. */
  responses?: Partial<Record<number, z.ZodType | RouteResponse>>;
  /** Mount somewhere other than /api/v1 (the browsable docs live at /api/docs). */
  basePath?: string;
  /** Middleware run after the access check and before the handler (a rate limit, an upload parser). */
  before?: RequestHandler[];
  handler: (req: Request, res: Response, next: NextFunction) => Promise<void> | void;
}

export const API_PREFIX = '/api/v1';

/** The full path Express sees for a route. */
export const fullPath = (route: Pick<RouteDefinition, 'path' | 'basePath'>): string => (route.basePath ?? API_PREFIX) + route.path;

/** Mounts the routes, each behind authentication (unless public) and its role check. */
export function mountRoutes(app: Express, routes: readonly RouteDefinition[], authenticate: RequestHandler): void {
  for (const route of routes) {
    const guards: RequestHandler[] = route.access.kind === 'public' ? [] : [authenticate, requireRole(route.access.roles)];
    const bodyCheck = route.method === 'get' || route.method === 'delete' ? [] : [requireJsonOrUpload];
    app[route.method](fullPath(route), ...guards, ...bodyCheck, ...(route.before ?? []), wrap(route.handler));
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

function requireRole(roles: readonly Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(unauthorized());
    if (!roles.includes(req.user.role)) return next(forbidden());
    next();
  };
}

/** Express 5 forwards rejected promises itself; this keeps handlers free of try/catch and typed. */
function wrap(handler: RouteDefinition['handler']): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) => Promise.resolve(handler(req, res, next)).catch(next);
}
