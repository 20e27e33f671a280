import { z } from 'zod';
import { personRefSchema } from './people-ref';

export const MAX_SHARE_RECIPIENTS = 20;

export const createShareRequestSchema = z.object({
  to: z
    .array(z.email({ message: 'each recipient must be an e-mail address' }).max(254))
    .min(1, { message: 'name at least one recipient' })
    .max(MAX_SHARE_RECIPIENTS, { message: `at most ${MAX_SHARE_RECIPIENTS} recipients per share` }),
  message: z.string().trim().max(2000, { message: 'message must be at most 2000 characters' }).optional(),
});
export type CreateShareRequest = z.infer<typeof createShareRequestSchema>;

export const shareStatusSchema = z.enum(['sent', 'failed']);

export const shareSchema = z.object({
  id: z.number().int(),
  analysisId: z.number().int(),
  sentBy: personRefSchema,
  to: z.array(z.string()),
  message: z.string().nullable(),
  status: shareStatusSchema,
  /** why the mail server did not take the message (failed shares only) */
  failureReason: z.string().nullable(),
  createdAt: z.string(),
});
export type Share = z.infer<typeof shareSchema>;

export const outboxMessageSchema = z.object({
  id: z.number().int(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  /** the HTML alternative, when the message had one */
  html: z.string().nullable(),
  attachments: z.array(z.object({ fileName: z.string(), contentType: z.string(), sizeBytes: z.number().int() })),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;

export const outboxSchema = z.object({
  /** false when mail goes to a real SMTP server: only the built-in stand-in keeps what it received */
  available: z.boolean(),
  /** where mail goes, without credentials */
  destination: z.string(),
  messages: z.array(outboxMessageSchema),
});
export type Outbox = z.infer<typeof outboxSchema>;
