import type { Express, NextFunction, Request, RequestHandler, Response } from 'express';
import type { Role } from '@tallyfit/contracts';
import { forbidden, unauthorized } from './http-error';

/**
 * Who may call a route. Deny by default: a route cannot be mounted without saying this,
 * and the role matrix test walks every declared route.
 */
export type Access = { kind: 'public' } | { kind: 'roles'; roles: readonly Role[] };

export const publicAccess: Access = { kind: 'public' };
export const rolesAccess = (...roles: Role[]): Access => ({ kind: 'roles', roles });
export const anyRole = rolesAccess('admin', 'lead', 'analyst', 'viewer');

export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteDefinition {
  method: HttpMethod;
  /** Path below /api/v1, in Express 5 syntax. */
  path: string;
  access: Access;
  summary: string;
  handler: (req: Request, res: Response) => Promise<void> | void;
}

export const API_PREFIX = '/api/v1';

/** Mounts the routes, each behind authentication (unless public) and its role check. */
export function mountRoutes(app: Express, routes: readonly RouteDefinition[], authenticate: RequestHandler): void {
  for (const route of routes) {
    const guards: RequestHandler[] = route.access.kind === 'public' ? [] : [authenticate, requireRole(route.access.roles)];
    app[route.method](API_PREFIX + route.path, ...guards, wrap(route.handler));
  }
}

function requireRole(roles: readonly Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(unauthorized());
    if (!roles.includes(req.user.role)) return next(forbidden());
    next();
  };
}

/** Express 5 forwards rejected promises itself; this keeps handlers free of try/catch and typed. */
function wrap(handler: RouteDefinition['handler']): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) => Promise.resolve(handler(req, res)).catch(next);
}
