import type { Knex } from 'knex';
import {
  changePasswordRequestSchema,
  loginRequestSchema,
  loginResponseSchema,
  refreshRequestSchema,
  userSchema,
  type LoginResponse,
} from '@tallyfit/contracts';
import { recordAudit } from '../audit/audit.service';
import type { Config } from '../config';
import { unauthorized } from '../http/http-error';
import { anyRole, publicAccess, type RouteDefinition } from '../http/route-table';
import { parseInput } from '../http/validate';
import { changeOwnPassword } from '../people/people.service';
import { signAccessToken } from './access-token';
import { loginRateLimit } from './login-rate-limit';
import { verifyPassword } from './password';
import { issueRefreshToken, revokeRefreshToken, rotateRefreshToken } from './refresh-tokens.service';
import { findUserByEmail, publicUser, type StoredUser } from './users.service';

type AuthConfig = Pick<Config, 'jwtSecret' | 'accessTokenTtlSeconds' | 'refreshTokenTtlSeconds' | 'loginAttemptsPer15Minutes'>;

export function authRoutes(db: Knex, config: AuthConfig): RouteDefinition[] {
  const tokensFor = (user: StoredUser, refreshToken: string): LoginResponse => ({
    accessToken: signAccessToken(user, config.jwtSecret, config.accessTokenTtlSeconds),
    expiresIn: config.accessTokenTtlSeconds,
    refreshToken,
    user: publicUser(user),
  });

  return [
    {
      method: 'post',
      path: '/auth/login',
      access: publicAccess,
      summary: 'Sign in with e-mail and password; returns a short-lived access token and a refresh token',
      request: { body: loginRequestSchema },
      responses: { 200: loginResponseSchema },
      before: [loginRateLimit(config.loginAttemptsPer15Minutes)],
      handler: async (req, res) => {
        const { email, password } = parseInput(loginRequestSchema, req.body, 'sign-in');
        const user = await findUserByEmail(db, email);
        // One message for every failure, so the answer does not reveal which e-mails exist.
        const passwordOk = user ? await verifyPassword(password, user.passwordHash) : false;
        if (!user || !passwordOk || user.disabled) {
          await recordAudit(db, {
            actorId: user?.id ?? null,
            action: 'sign-in-failed',
            entityType: 'user',
            entityId: user?.id ?? null,
            summary: `failed sign-in for ${email.toLowerCase()}`,
          });
          throw unauthorized('e-mail or password is wrong');
        }
        const body = await db.transaction(async (trx) => {
          const refresh = await issueRefreshToken(trx, user.id, config.refreshTokenTtlSeconds);
          await recordAudit(trx, { actorId: user.id, action: 'sign-in', entityType: 'user', entityId: user.id, summary: `${user.name} signed in` });
          return tokensFor(user, refresh.token);
        });
        res.json(body);
      },
    },
    {
      method: 'post',
      path: '/auth/refresh',
      access: publicAccess,
      summary: 'Exchange a refresh token for a new access token and a new refresh token (the old one stops working)',
      request: { body: refreshRequestSchema },
      responses: { 200: loginResponseSchema },
      handler: async (req, res) => {
        const { refreshToken } = parseInput(refreshRequestSchema, req.body, 'refresh');
        const rotated = await rotateRefreshToken(db, refreshToken, config.refreshTokenTtlSeconds);
        res.json(tokensFor(rotated.user, rotated.token));
      },
    },
    {
      method: 'post',
      path: '/auth/logout',
      access: publicAccess,
      summary: 'Sign out: the refresh token stops working (the access token expires on its own shortly)',
      request: { body: refreshRequestSchema },
      responses: { 204: { description: 'signed out' } },
      handler: async (req, res) => {
        const { refreshToken } = parseInput(refreshRequestSchema, req.body, 'sign-out');
        const userId = await revokeRefreshToken(db, refreshToken);
        if (userId !== undefined) {
          await recordAudit(db, { actorId: userId, action: 'sign-out', entityType: 'user', entityId: userId, summary: 'signed out' });
        }
        res.status(204).end();
      },
    },
    {
      method: 'get',
      path: '/auth/me',
      access: anyRole,
      summary: 'The signed-in person',
      responses: { 200: userSchema },
      handler: (req, res) => {
        res.json(req.user);
      },
    },
    {
      method: 'post',
      path: '/auth/password',
      access: anyRole,
      summary: 'Change one’s own password (the current one is required); other sessions are signed out',
      request: { body: changePasswordRequestSchema },
      responses: { 204: { description: 'changed' } },
      handler: async (req, res) => {
        const body = parseInput(changePasswordRequestSchema, req.body, 'password change');
        await changeOwnPassword(db, req.user!, body);
        res.status(204).end();
      },
    },
  ];
}

