import type { Knex } from 'knex';
import { changePasswordRequestSchema, loginRequestSchema, loginResponseSchema, refreshRequestSchema, userSchema } from '@tallyfit/contracts';
import type { Config } from '../config';
import { defineRoute, type RouteDefinition } from '../http/route-table';
import { changeOwnPassword } from '../people/people.service';
import { loginRateLimit } from './login-rate-limit';
import { renewSession, signIn, signOut, type SessionConfig } from './sign-in.service';

type AuthConfig = SessionConfig & Pick<Config, 'loginAttemptsPer15Minutes'>;

export function authRoutes(db: Knex, config: AuthConfig): RouteDefinition[] {
  return [
    defineRoute({
      method: 'post',
      path: '/auth/login',
      access: 'public',
      summary: 'Sign in with e-mail and password; returns a short-lived access token and a refresh token',
      request: { body: loginRequestSchema },
      responses: { 200: loginResponseSchema },
      before: [loginRateLimit(config.loginAttemptsPer15Minutes)],
      handler: ({ body }) => signIn(db, config, body.email, body.password),
    }),
    defineRoute({
      method: 'post',
      path: '/auth/refresh',
      access: 'public',
      summary: 'Exchange a refresh token for a new access token and a new refresh token (the old one stops working)',
      request: { body: refreshRequestSchema },
      responses: { 200: loginResponseSchema },
      handler: ({ body }) => renewSession(db, config, body.refreshToken),
    }),
    defineRoute({
      method: 'post',
      path: '/auth/logout',
      access: 'public',
      summary: 'Sign out: the refresh token stops working (the access token expires on its own shortly)',
      request: { body: refreshRequestSchema },
      responses: { 204: { description: 'signed out' } },
      handler: ({ body }) => signOut(db, body.refreshToken),
    }),
    defineRoute({
      method: 'get',
      path: '/auth/me',
      access: 'account.use',
      summary: 'The signed-in person',
      responses: { 200: userSchema },
      handler: ({ user }) => user,
    }),
    defineRoute({
      method: 'post',
      path: '/auth/password',
      access: 'account.use',
      summary: 'Change one’s own password (the current one is required); other sessions are signed out',
      request: { body: changePasswordRequestSchema },
      responses: { 204: { description: 'changed' } },
      handler: ({ body, user }) => changeOwnPassword(db, user, body),
    }),
  ];
}
