import type { Knex } from 'knex';
import type { Logger } from 'pino';
import {
  CAPABILITIES,
  notificationSentence,
  type ListNotificationsFilters,
  type Notification,
  type NotificationKind,
  type NotificationsPage,
  type User,
} from '@tallyfit/contracts';
import { isoDate, now } from '../http/db-time';
import { notFound } from '../http/http-error';
import type { MailService } from '../mail/mail-service';

/** What a review decision needs to tell people about it. */
export interface ReviewEvent {
  kind: NotificationKind;
  analysis: { id: number; title: string; authorId: number };
  actor: { id: number; name: string };
  note: string | null;
}

/** How notifications leave the building: the mail path, the console's address for links, and where failures are logged. */
export interface NotificationMail {
  mail: MailService;
  publicUrl: string;
  logger: Pick<Logger, 'warn'>;
}

interface NotificationRow {
  id: number;
  kind: NotificationKind;
  analysis_id: number;
  analysis_title: string;
  actor_id: number;
  actor_name: string;
  note: string | null;
  read_at: string | Date | null;
  mail_status: Notification['mailStatus'];
  mail_failure: string | null;
  created_at: string | Date;
}

const toNotification = (row: NotificationRow): Notification => ({
  id: row.id,
  kind: row.kind,
  analysis: { id: row.analysis_id, title: row.analysis_title },
  actor: { id: row.actor_id, name: row.actor_name },
  note: row.note,
  readAt: isoDate(row.read_at),
  mailStatus: row.mail_status,
  mailFailure: row.mail_failure,
  createdAt: isoDate(row.created_at),
});

/**
 * Who hears of a decision: a submission goes to everyone who may review it (every active person
 * whose role has `analyses.review`), never to the actor or the author; a return or a sign-off goes
 * to the author.
 */
async function recipientsOf(trx: Knex.Transaction, event: ReviewEvent): Promise<number[]> {
  if (event.kind !== 'submitted') return event.analysis.authorId === event.actor.id ? [] : [event.analysis.authorId];
  const rows: Array<{ id: number }> = await trx('users')
    .whereIn('role', [...CAPABILITIES['analyses.review'].roles])
    .where('disabled', false)
    .whereNotIn('id', [event.actor.id, event.analysis.authorId])
    .select('id')
    .orderBy('id');
  return rows.map((row) => row.id);
}

/**
 * Writes the notifications of a review decision inside the decision's transaction, so they exist
 * if and only if the decision does. Answers their ids, for `mailNotifications` after the commit.
 */
export async function notifyReviewDecision(trx: Knex.Transaction, event: ReviewEvent): Promise<number[]> {
  const recipients = await recipientsOf(trx, event);
  const ids: number[] = [];
  for (const recipientId of recipients) {
    const [row] = await trx('notifications')
      .insert({
        recipient_id: recipientId,
        analysis_id: event.analysis.id,
        actor_id: event.actor.id,
        kind: event.kind,
        note: event.note,
        mail_status: 'pending',
      })
      .returning('id');
    ids.push(typeof row === 'object' ? Number(row.id) : Number(row));
  }
  return ids;
}

function selectNotifications(db: Knex) {
  return db('notifications')
    .join('analyses', 'analyses.id', 'notifications.analysis_id')
    .join('users as actors', 'actors.id', 'notifications.actor_id')
    .select('notifications.*', 'analyses.title as analysis_title', 'actors.name as actor_name');
}

function mailText(notification: Notification, link: string): string {
  return [
    `${notificationSentence(notification)}.`,
    ...(notification.note ? ['', notification.note] : []),
    '',
    `Open it in Tallyfit: ${link}`,
  ].join('\n');
}

/**
 * Sends the e-mail copy of each notification, one message per recipient, after the decision has
 * committed. A message the mail server refuses is logged and recorded on its notification; it never
 * undoes the decision.
 */
export async function mailNotifications(db: Knex, delivery: NotificationMail, ids: readonly number[]): Promise<void> {
  if (ids.length === 0) return;
  const rows: Array<NotificationRow & { recipient_email: string }> = await selectNotifications(db)
    .join('users as recipients', 'recipients.id', 'notifications.recipient_id')
    .select('recipients.email as recipient_email')
    .whereIn('notifications.id', [...ids]);
  for (const row of rows) {
    const notification = toNotification(row);
    try {
      await delivery.mail.send({
        to: [row.recipient_email],
        subject: `Tallyfit: ${notificationSentence(notification)}`,
        text: mailText(notification, `${delivery.publicUrl}/analyses/${notification.analysis.id}`),
      });
      await db('notifications').where({ id: row.id }).update({ mail_status: 'sent' });
    } catch (error) {
      const reason = (error instanceof Error ? error.message : String(error)).slice(0, 500);
      delivery.logger.warn({ notificationId: row.id, reason }, 'notification e-mail not sent');
      // Runs after the answer was sent: a database gone meanwhile (a server stopping) must not crash the process.
      await db('notifications')
        .where({ id: row.id })
        .update({ mail_status: 'failed', mail_failure: reason })
        .catch((storeError: unknown) => delivery.logger.warn({ notificationId: row.id, storeError }, 'could not record the failed e-mail'));
    }
  }
}

/** One page of the caller's notifications, newest first, with the unread count. */
export async function listNotifications(db: Knex, caller: User, query: ListNotificationsFilters): Promise<NotificationsPage> {
  const mine = () => db('notifications').where('notifications.recipient_id', caller.id);
  const filtered = () => mine().modify((builder) => (query.unread ? builder.whereNull('notifications.read_at') : builder));
  const [{ count: total }] = await filtered().count({ count: '*' });
  const [{ count: unread }] = await mine().whereNull('notifications.read_at').count({ count: '*' });
  const rows: NotificationRow[] = await selectNotifications(db)
    .where('notifications.recipient_id', caller.id)
    .modify((builder) => (query.unread ? builder.whereNull('notifications.read_at') : builder))
    .orderBy([
      { column: 'notifications.created_at', order: 'desc' },
      { column: 'notifications.id', order: 'desc' },
    ])
    .limit(query.pageSize)
    .offset((query.page - 1) * query.pageSize);
  return {
    items: rows.map(toNotification),
    total: Number(total),
    page: query.page,
    pageSize: query.pageSize,
    unreadCount: Number(unread),
  };
}

/** Marks one of the caller's notifications read (404 for anyone else's, so ids reveal nothing). */
export async function markNotificationRead(db: Knex, caller: User, id: number): Promise<Notification> {
  const row = await db('notifications').where({ id, recipient_id: caller.id }).first();
  if (!row) throw notFound(`notification ${id} does not exist`);
  if (row.read_at === null) await db('notifications').where({ id }).update({ read_at: now(db) });
  return toNotification(await selectNotifications(db).where('notifications.id', id).first());
}

/** Marks every unread notification of the caller read; answers how many changed. */
export async function markAllNotificationsRead(db: Knex, caller: User): Promise<{ marked: number }> {
  const marked = await db('notifications').where({ recipient_id: caller.id }).whereNull('read_at').update({ read_at: now(db) });
  return { marked: Number(marked) };
}
