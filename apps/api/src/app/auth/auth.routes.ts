import type { Knex } from 'knex';
import { loginRequestSchema, type LoginResponse } from '@tallyfit/contracts';
import type { Config } from '../config';
import { unauthorized } from '../http/http-error';
import { anyRole, publicAccess, type RouteDefinition } from '../http/route-table';
import { parseInput } from '../http/validate';
import { signAccessToken } from './access-token';
import { verifyPassword } from './password';
import { findUserByEmail, publicUser } from './users.service';

export function authRoutes(db: Knex, config: Pick<Config, 'jwtSecret' | 'accessTokenTtlSeconds'>): RouteDefinition[] {
  return [
    {
      method: 'post',
      path: '/auth/login',
      access: publicAccess,
      summary: 'Sign in with e-mail and password; returns a bearer token',
      handler: async (req, res) => {
        const { email, password } = parseInput(loginRequestSchema, req.body, 'sign-in');
        const user = await findUserByEmail(db, email);
        // One message for every failure, so the answer does not reveal which e-mails exist.
        const passwordOk = user ? await verifyPassword(password, user.passwordHash) : false;
        if (!user || !passwordOk || user.disabled) throw unauthorized('e-mail or password is wrong');
        const body: LoginResponse = {
          accessToken: signAccessToken(user, config.jwtSecret, config.accessTokenTtlSeconds),
          expiresIn: config.accessTokenTtlSeconds,
          user: publicUser(user),
        };
        res.json(body);
      },
    },
    {
      method: 'get',
      path: '/auth/me',
      access: anyRole,
      summary: 'The signed-in person',
      handler: (req, res) => {
        res.json(req.user);
      },
    },
  ];
}
