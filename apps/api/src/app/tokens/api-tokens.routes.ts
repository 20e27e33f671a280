import type { Knex } from 'knex';
import { z } from 'zod';
import { apiTokenSchema, createApiTokenRequestSchema, createdApiTokenSchema, idParamsSchema } from '@tallyfit/contracts';
import { forbidden } from '../http/http-error';
import { anyRole, type RouteDefinition } from '../http/route-table';
import { parseInput } from '../http/validate';
import { createApiToken, listApiTokens, revokeApiToken } from './api-tokens.service';

const listTokensQuerySchema = z.object({
  owner: z
    .string()
    .regex(/^(me|all|[1-9]\d*)$/, { message: 'owner must be "me", "all" or a person\'s id' })
    .default('me'),
});

export function apiTokensRoutes(db: Knex): RouteDefinition[] {
  return [
    {
      method: 'get',
      path: '/tokens',
      access: anyRole,
      summary: "The caller's personal API tokens (admins: anyone's with owner=all or owner=<id>); never the secrets",
      tag: 'tokens',
      request: { query: listTokensQuerySchema },
      responses: { 200: z.array(apiTokenSchema) },
      handler: async (req, res) => {
        const { owner } = parseInput(listTokensQuerySchema, req.query, 'query');
        if (owner !== 'me' && Number(owner) !== req.user!.id && req.user!.role !== 'admin') {
          throw forbidden("only an admin may list other people's tokens");
        }
        res.json(await listApiTokens(db, owner === 'me' ? req.user!.id : owner === 'all' ? 'all' : Number(owner)));
      },
    },
    {
      method: 'post',
      path: '/tokens',
      access: anyRole,
      summary: 'Create a named personal API token; the answer is the only time the token is shown',
      tag: 'tokens',
      request: { body: createApiTokenRequestSchema },
      responses: { 201: createdApiTokenSchema },
      handler: async (req, res) => {
        const { name } = parseInput(createApiTokenRequestSchema, req.body, 'token');
        res.status(201).json(await createApiToken(db, req.user!, name));
      },
    },
    {
      method: 'delete',
      path: '/tokens/:id',
      access: anyRole,
      summary: 'Revoke a personal API token (one’s own; admins: anyone’s)',
      tag: 'tokens',
      request: { params: idParamsSchema },
      responses: { 200: apiTokenSchema },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        res.json(await revokeApiToken(db, req.user!, id));
      },
    },
  ];
}
