import { z } from 'zod';
import { booleanQueryText, pageQueryFields } from './pagination';
import { personRefSchema } from './people-ref';

/** What a notification tells: work was submitted (to reviewers), returned or signed off (to its author). */
export const NOTIFICATION_KINDS = ['submitted', 'returned', 'signed_off'] as const;
export const notificationKindSchema = z.enum(NOTIFICATION_KINDS);
export type NotificationKind = z.infer<typeof notificationKindSchema>;

/** Whether the e-mail copy reached the mail server: pending until it was tried after the decision committed. */
export const NOTIFICATION_MAIL_STATES = ['pending', 'sent', 'failed'] as const;

export const notificationSchema = z.object({
  id: z.number().int(),
  kind: notificationKindSchema,
  analysis: z.object({ id: z.number().int(), title: z.string() }),
  actor: personRefSchema,
  /** The decision's comment (the reason for a return), if any. */
  note: z.string().nullable(),
  readAt: z.string().nullable(),
  mailStatus: z.enum(NOTIFICATION_MAIL_STATES),
  mailFailure: z.string().nullable(),
  createdAt: z.string(),
});
export type Notification = z.infer<typeof notificationSchema>;

export const listNotificationsQuerySchema = z.object({
  ...pageQueryFields(20),
  unread: booleanQueryText('unread').optional(),
});
export type ListNotificationsQuery = z.input<typeof listNotificationsQuerySchema>;
export type ListNotificationsFilters = z.output<typeof listNotificationsQuerySchema>;

/** One page of one's notifications, newest first, with how many are unread in all. */
export const notificationsPageSchema = z.object({
  items: z.array(notificationSchema),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
  unreadCount: z.number().int(),
});
export type NotificationsPage = z.infer<typeof notificationsPageSchema>;

/** The words of a notification, the same in the bell's menu and in the e-mail's subject. */
export function notificationSentence(notification: Pick<Notification, 'kind' | 'actor' | 'analysis'>): string {
  const { actor, analysis } = notification;
  switch (notification.kind) {
    case 'submitted':
      return `${actor.name} submitted "${analysis.title}" for review`;
    case 'returned':
      return `${actor.name} returned "${analysis.title}" for changes`;
    case 'signed_off':
      return `${actor.name} signed off "${analysis.title}"`;
  }
}
