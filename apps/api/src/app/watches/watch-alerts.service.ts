import type { Knex } from 'knex';
import type { AlertKind, Page, User, WatchAlert, WatchShare, WebhookPayload } from '@tallyfit/contracts';
import { recordAudit } from '../audit/audit.service';
import { insertedId, isoDate, now } from '../http/db-time';
import { conflict, notFound } from '../http/http-error';
import { getReadableWatchRow, requireAcknowledger } from './watch-access';
import type { WatchContext } from './watch-context';
import type { WatchRow } from './watch-rows';

interface AlertRow {
  id: number;
  watch_id: number;
  kind: AlertKind;
  batch_id: number | null;
  sequential_p: number;
  created_at: string | Date;
  acknowledged_by: number | null;
  acknowledger_name: string | null;
  acknowledged_at: string | Date | null;
  note: string | null;
}

interface DeliveryRow {
  alert_id: number;
  channel: 'email' | 'webhook';
  target: string;
  status: 'pending' | 'delivered' | 'failed';
  attempts: number;
  last_error: string | null;
  delivered_at: string | Date | null;
}

/** An e-mail delivery's stored payload. */
export interface AlertMail {
  subject: string;
  text: string;
}

/** The batch that changed the state, as the alert tells it. */
export interface AlertBatch {
  id: number;
  periodStart: string;
  periodEnd: string;
  cumulativeN: number;
}

const percent = (share: number) => `${(share * 100).toFixed(2)}%`;

function alertMail(watch: WatchRow, kind: AlertKind, p: number, shares: WatchShare[], link: string): AlertMail {
  const headline =
    kind === 'alarm'
      ? `The watch "${watch.name}" is in alarm: its counts no longer match the hypothesis (sequential p = ${p.toPrecision(3)}, below α = ${watch.alpha}).`
      : `The watch "${watch.name}" holds again: its sequential test was restarted and the alarm is cleared.`;
  const table = shares.map(
    (share) => `  ${share.label}: expected ${percent(share.expected)}, seen ${percent(share.estimate)} (between ${percent(share.lower)} and ${percent(share.upper)})`,
  );
  return {
    subject: kind === 'alarm' ? `Tallyfit: "${watch.name}" is in alarm` : `Tallyfit: "${watch.name}" holds again`,
    text: [
      headline,
      ...(table.length ? ['', 'Shares so far, each with its anytime-valid confidence sequence:', ...table] : []),
      '',
      'The sequential p-value stays valid however often the watch is looked at, so this is not an artefact of checking after every batch.',
      '',
      `Open the watch: ${link}`,
    ].join('\n'),
  };
}

/** People told by e-mail: the study's owners and the watch's creator, if their accounts are active. */
async function mailRecipients(trx: Knex.Transaction, watch: WatchRow): Promise<string[]> {
  const rows: Array<{ email: string }> = await trx('users')
    .where('users.disabled', false)
    .where((inner) =>
      inner
        .where('users.id', watch.created_by)
        .orWhereIn('users.id', trx('study_members').select('user_id').where({ study_id: watch.study_id, study_role: 'owner' })),
    )
    .orderBy('users.email')
    .select('users.email');
  return rows.map((row) => row.email);
}

/**
 * Records a change of a watch's state as an alert, with one pending delivery per e-mail recipient
 * and one for the webhook, inside the transaction that changed the state. The runtime sends them
 * after the commit (see alert-delivery.ts). Answers whether anything waits to be sent.
 */
export async function recordAlert(
  trx: Knex.Transaction,
  ctx: Pick<WatchContext, 'publicUrl'>,
  watch: WatchRow,
  kind: AlertKind,
  p: number,
  shares: WatchShare[],
  batch: AlertBatch | null,
): Promise<boolean> {
  const [row] = await trx('watch_alerts').insert({ watch_id: watch.id, kind, batch_id: batch?.id ?? null, sequential_p: p }).returning('id');
  const alertId = insertedId(row);
  await trx('watches').where({ id: watch.id }).update({ alert_state: kind === 'alarm' ? 'waiting' : 'none' });
  const link = `${ctx.publicUrl}/watches/${watch.id}`;
  const mail = alertMail(watch, kind, p, shares, link);
  const deliveries = (await mailRecipients(trx, watch)).map((email) => ({
    alert_id: alertId,
    channel: 'email',
    target: email,
    payload_json: JSON.stringify(mail),
    status: 'pending',
  }));
  if (watch.webhook_url) {
    const payload: WebhookPayload = {
      event: kind === 'alarm' ? 'watch.alarm' : 'watch.cleared',
      alertId,
      watch: { id: watch.id, name: watch.name, studyId: watch.study_id, url: link },
      batch,
      sequentialP: p,
      alpha: watch.alpha,
      shares,
      at: new Date().toISOString(),
    };
    // The body is fixed now, so every retry sends (and signs) the same bytes.
    deliveries.push({ alert_id: alertId, channel: 'webhook', target: watch.webhook_url, payload_json: JSON.stringify(payload), status: 'pending' });
  }
  if (deliveries.length) await trx('alert_deliveries').insert(deliveries);
  return deliveries.length > 0;
}

/** A restart during a pause cleared the alarm: the "cleared" alert, without a batch. */
export function clearAlarmByRestart(trx: Knex.Transaction, ctx: Pick<WatchContext, 'publicUrl'>, watch: WatchRow): Promise<boolean> {
  return recordAlert(trx, ctx, watch, 'cleared', 1, [], null);
}

function toAlert(row: AlertRow, deliveries: DeliveryRow[]): WatchAlert {
  return {
    id: row.id,
    watchId: row.watch_id,
    kind: row.kind,
    batchId: row.batch_id,
    sequentialP: row.sequential_p,
    createdAt: isoDate(row.created_at),
    acknowledgedBy: row.acknowledged_by === null ? null : { id: row.acknowledged_by, name: row.acknowledger_name ?? '' },
    acknowledgedAt: isoDate(row.acknowledged_at),
    note: row.note,
    deliveries: deliveries
      .filter((delivery) => delivery.alert_id === row.id)
      .map((delivery) => ({
        channel: delivery.channel,
        target: delivery.target,
        status: delivery.status,
        attempts: delivery.attempts,
        lastError: delivery.last_error,
        deliveredAt: isoDate(delivery.delivered_at),
      })),
  };
}

const selectAlerts = (db: Knex | Knex.Transaction) =>
  db('watch_alerts').leftJoin('users', 'users.id', 'watch_alerts.acknowledged_by').select('watch_alerts.*', 'users.name as acknowledger_name');

async function withDeliveries(db: Knex, rows: AlertRow[]): Promise<WatchAlert[]> {
  const deliveries: DeliveryRow[] = rows.length
    ? await db('alert_deliveries').whereIn('alert_id', rows.map((row) => row.id)).orderBy(['channel', 'target'])
    : [];
  return rows.map((row) => toAlert(row, deliveries));
}

/** A watch's alerts, newest first. */
export async function listAlerts(db: Knex, caller: User, watchId: number, page: number, pageSize: number): Promise<Page<WatchAlert>> {
  await getReadableWatchRow(db, caller, watchId);
  const [{ total }] = await db('watch_alerts').where({ watch_id: watchId }).count({ total: '*' });
  const rows: AlertRow[] = await selectAlerts(db)
    .where('watch_alerts.watch_id', watchId)
    .orderBy([
      { column: 'watch_alerts.created_at', order: 'desc' },
      { column: 'watch_alerts.id', order: 'desc' },
    ])
    .limit(pageSize)
    .offset((page - 1) * pageSize);
  return { items: await withDeliveries(db, rows), total: Number(total), page, pageSize };
}

/**
 * A lead (or admin) acknowledges an alarm with a note. Once only: the update is guarded by
 * "not yet acknowledged", so two racing acknowledgements cannot both win.
 */
export async function acknowledgeAlert(db: Knex, caller: User, alertId: number, note: string | undefined): Promise<WatchAlert> {
  requireAcknowledger(caller);
  const alert: AlertRow | undefined = await db('watch_alerts').where({ id: alertId }).first();
  if (!alert) throw notFound(`alert ${alertId} does not exist`);
  const watch = await getReadableWatchRow(db, caller, alert.watch_id).catch(() => {
    throw notFound(`alert ${alertId} does not exist`);
  });
  if (alert.kind !== 'alarm') throw conflict(`alert ${alertId} says the watch holds again; only alarms are acknowledged`);
  await db.transaction(async (trx) => {
    const changed = await trx('watch_alerts')
      .where({ id: alertId })
      .whereNull('acknowledged_at')
      .update({ acknowledged_by: caller.id, acknowledged_at: now(trx), note: note || null });
    if (changed !== 1) throw conflict(`alert ${alertId} was already acknowledged`);
    // The watch shows "acknowledged" only while this is its latest alert.
    const latest = await trx('watch_alerts').where({ watch_id: watch.id }).orderBy('id', 'desc').first('id');
    if (latest?.id === alertId) await trx('watches').where({ id: watch.id }).update({ alert_state: 'acknowledged', updated_at: now(trx) });
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'update',
      entityType: 'watch-alert',
      entityId: alertId,
      studyId: watch.study_id,
      summary: `acknowledged the alarm of watch "${watch.name}"`,
      after: { note: note || null },
    });
  });
  const [row] = await selectAlerts(db).where('watch_alerts.id', alertId);
  const [acknowledged] = await withDeliveries(db, [row]);
  return acknowledged;
}
