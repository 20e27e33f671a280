import type { Knex } from 'knex';
import { auditEventSchema, listAuditQuerySchema, pageSchema } from '@tallyfit/contracts';
import { rolesAccess, type RouteDefinition } from '../http/route-table';
import { parseInput } from '../http/validate';
import { listAudit } from './audit.service';

export function auditRoutes(db: Knex): RouteDefinition[] {
  return [
    {
      method: 'get',
      path: '/audit',
      access: rolesAccess('admin', 'lead'),
      summary: 'The audit trail, newest first, filtered by person, action, record, study or time',
      request: { query: listAuditQuerySchema },
      responses: { 200: pageSchema(auditEventSchema) },
      handler: async (req, res) => {
        res.json(await listAudit(db, parseInput(listAuditQuerySchema, req.query, 'query')));
      },
    },
  ];
}
