import { z } from 'zod';
import { dateQueryText, idText, pageQueryFields } from './pagination';

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

export const listAuditQuerySchema = z.object({
  ...pageQueryFields(50),
  actorId: idText('actorId').optional(),
  action: auditActionSchema.optional(),
  entityType: z.string().max(32).optional(),
  entityId: z.string().max(64).optional(),
  studyId: idText('studyId').optional(),
  from: dateQueryText('from').optional(),
  to: dateQueryText('to').optional(),
});
export type ListAuditQuery = z.infer<typeof listAuditQuerySchema>;
