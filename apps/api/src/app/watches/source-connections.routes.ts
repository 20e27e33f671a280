import type { Knex } from 'knex';
import { z } from 'zod';
import {
  connectionSchema,
  connectionTestResultSchema,
  createConnectionRequestSchema,
  idParamsSchema,
  updateConnectionRequestSchema,
} from '@tallyfit/contracts';
import { defineRoute, type RouteDefinition } from '../http/route-table';
import {
  createConnection,
  deleteConnection,
  getConnection,
  listConnections,
  testConnection,
  updateConnection,
} from './source-connections.service';

export function sourceConnectionsRoutes(db: Knex, secretKey: Buffer): RouteDefinition[] {
  return [
    defineRoute({
      method: 'get',
      path: '/connections',
      access: 'connections.manage',
      summary: 'The connections to teams’ own databases that pull-fed watches read (never their passwords)',
      responses: { 200: z.array(connectionSchema) },
      handler: async ({ res }) => {
        res.json(await listConnections(db));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/connections',
      access: 'connections.manage',
      summary: 'Add a PostgreSQL connection; the password is stored encrypted and never returned',
      request: { body: createConnectionRequestSchema },
      responses: { 201: connectionSchema },
      handler: async ({ body, user, res }) => {
        res.status(201).json(await createConnection(db, secretKey, user, body));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/connections/:id',
      access: 'connections.manage',
      summary: 'One connection (without its password)',
      request: { params: idParamsSchema },
      responses: { 200: connectionSchema },
      handler: async ({ params, res }) => {
        res.json(await getConnection(db, params.id));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/connections/:id',
      access: 'connections.manage',
      summary: 'Edit a connection (its creator or an admin); leave out the password to keep it',
      request: { params: idParamsSchema, body: updateConnectionRequestSchema },
      responses: { 200: connectionSchema },
      handler: async ({ params, body, user, res }) => {
        res.json(await updateConnection(db, secretKey, user, params.id, body));
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/connections/:id',
      access: 'connections.manage',
      summary: 'Delete a connection no watch reads from (its creator or an admin)',
      request: { params: idParamsSchema },
      responses: { 204: { description: 'deleted' } },
      handler: async ({ params, user, res }) => {
        await deleteConnection(db, user, params.id);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'post',
      path: '/connections/:id/test',
      access: 'connections.manage',
      summary: 'Try a connection: connect and ask the server its version (answers what happened either way)',
      request: { params: idParamsSchema },
      responses: { 200: connectionTestResultSchema },
      handler: async ({ params, res }) => {
        res.json(await testConnection(db, secretKey, params.id));
      },
    }),
  ];
}
