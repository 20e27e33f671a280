import type { Knex } from 'knex';
import { auditEventSchema, listAuditQuerySchema, pageSchema } from '@tallyfit/contracts';
import { defineRoute, type RouteDefinition } from '../http/route-table';
import { listAudit } from './audit.service';

export function auditRoutes(db: Knex): RouteDefinition[] {
  return [
    defineRoute({
      method: 'get',
      path: '/audit',
      access: 'audit.read',
      summary: 'The audit trail, newest first, filtered by person, action, record, study or time',
      request: { query: listAuditQuerySchema },
      responses: { 200: pageSchema(auditEventSchema) },
      handler: ({ query }) => listAudit(db, query),
    }),
  ];
}
