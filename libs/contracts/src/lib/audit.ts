import { z } from 'zod';
import { MAX_PAGE_SIZE } from './pagination';

/** What kind of change an audit event records. */
export const AUDIT_ACTIONS = [
  'create',
  'update',
  'delete',
  'sign-in',
  'sign-in-failed',
  'sign-out',
  'role-change',
  'review',
  'share',
  'revoke',
] as const;
export const auditActionSchema = z.enum(AUDIT_ACTIONS);
export type AuditAction = z.infer<typeof auditActionSchema>;

export const auditEventSchema = z.object({
  id: z.number().int(),
  at: z.string(),
  actor: z.object({ id: z.number().int(), name: z.string() }).nullable(),
  action: auditActionSchema,
  entityType: z.string(),
  entityId: z.string().nullable(),
  studyId: z.number().int().nullable(),
  summary: z.string(),
  before: z.unknown().nullable(),
  after: z.unknown().nullable(),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;

const isoDateTime = (name: string) =>
  z.string().refine((value) => !Number.isNaN(Date.parse(value)), { message: `${name} must be a date or date-time (ISO 8601)` });

export const listAuditQuerySchema = z.object({
  page: z.coerce.number().int().min(1, { message: 'page must be 1 or more' }).default(1),
  pageSize: z.coerce
    .number()
    .int()
    .min(1, { message: 'pageSize must be 1 or more' })
    .max(MAX_PAGE_SIZE, { message: `pageSize must be at most ${MAX_PAGE_SIZE}` })
    .default(50),
  actorId: z.coerce.number().int().positive({ message: 'actorId must be a positive whole number' }).optional(),
  action: auditActionSchema.optional(),
  entityType: z.string().max(32).optional(),
  entityId: z.string().max(64).optional(),
  studyId: z.coerce.number().int().positive({ message: 'studyId must be a positive whole number' }).optional(),
  from: isoDateTime('from').optional(),
  to: isoDateTime('to').optional(),
});
export type ListAuditQuery = z.infer<typeof listAuditQuerySchema>;
