import type { Knex } from 'knex';
import { z } from 'zod';
import { apiTokenSchema, can, createApiTokenRequestSchema, createdApiTokenSchema, idParamsSchema } from '@tallyfit/contracts';
import { forbidden } from '../http/http-error';
import { defineRoute, type RouteDefinition } from '../http/route-table';
import { createApiToken, listApiTokens, revokeApiToken } from './api-tokens.service';

const listTokensQuerySchema = z.object({
  owner: z
    .string()
    .regex(/^(me|all|[1-9]\d*)$/, { message: 'owner must be "me", "all" or a person\'s id' })
    .default('me'),
});

export function apiTokensRoutes(db: Knex): RouteDefinition[] {
  return [
    defineRoute({
      method: 'get',
      path: '/tokens',
      access: 'account.use',
      summary: "The caller's personal API tokens (admins: anyone's with owner=all or owner=<id>); never the secrets",
      tag: 'tokens',
      request: { query: listTokensQuerySchema },
      responses: { 200: z.array(apiTokenSchema) },
      handler: ({ query: { owner }, user }) => {
        if (owner !== 'me' && Number(owner) !== user.id && !can(user.role, 'people.manage')) {
          throw forbidden("only an admin may list other people's tokens");
        }
        return listApiTokens(db, owner === 'me' ? user.id : owner === 'all' ? 'all' : Number(owner));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/tokens',
      access: 'account.use',
      summary: 'Create a named personal API token; the answer is the only time the token is shown',
      tag: 'tokens',
      request: { body: createApiTokenRequestSchema },
      responses: { 201: createdApiTokenSchema },
      handler: ({ body, user }) => createApiToken(db, user, body.name),
    }),
    defineRoute({
      method: 'delete',
      path: '/tokens/:id',
      access: 'account.use',
      summary: 'Revoke a personal API token (one’s own; admins: anyone’s)',
      tag: 'tokens',
      request: { params: idParamsSchema },
      responses: { 200: apiTokenSchema },
      handler: ({ params, user }) => revokeApiToken(db, user, params.id),
    }),
  ];
}
