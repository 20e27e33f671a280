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
      before: [loginRateLimit(db, config.loginAttemptsPer15Minutes)],
      handler: async ({ body, res }) => {
        res.json(await signIn(db, config, body.email, body.password));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/auth/refresh',
      access: 'public',
      summary: 'Exchange a refresh token for a new access token and a new refresh token (the old one stops working)',
      request: { body: refreshRequestSchema },
      responses: { 200: loginResponseSchema },
      handler: async ({ body, res }) => {
        res.json(await renewSession(db, config, body.refreshToken));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/auth/logout',
      access: 'public',
      summary: 'Sign out: the refresh token stops working and the person’s access tokens end at once (other sessions renew theirs)',
      request: { body: refreshRequestSchema },
      responses: { 204: { description: 'signed out' } },
      handler: async ({ body, res }) => {
        await signOut(db, body.refreshToken);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'get',
      path: '/auth/me',
      access: 'account.use',
      summary: 'The signed-in person',
      responses: { 200: userSchema },
      handler: ({ user, res }) => {
        res.json(user);
      },
    }),
    defineRoute({
      method: 'post',
      path: '/auth/password',
      access: 'account.use',
      summary: 'Change one’s own password (the current one is required); other sessions are signed out',
      request: { body: changePasswordRequestSchema },
      responses: { 204: { description: 'changed' } },
      handler: async ({ body, user, res }) => {
        await changeOwnPassword(db, user, body);
        res.status(204).end();
      },
    }),
  ];
}
