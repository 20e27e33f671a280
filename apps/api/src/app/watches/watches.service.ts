import type { Knex } from 'knex';
import type {
  ListWatchesFilters,
  Page,
  UpdateWatchRequest,
  User,
  Watch,
  WatchDetail,
  WatchFeed,
  WebhookSettingsRequest,
} from '@tallyfit/contracts';
import { createWatchRequestSchema } from '@tallyfit/contracts';
import { recordAudit } from '../audit/audit.service';
import { insertedId, now } from '../http/db-time';
import { conflict, unprocessable } from '../http/http-error';
import { seal } from './secret-box';
import { beginSequentialTest } from './sequential-test';
import { getChangeableWatchRow, getPausableWatchRow, getReadableWatchRow, requireWatchEditor, scopeWatchesToReader } from './watch-access';
import type { WatchContext } from './watch-context';
import { clearAlarmByRestart } from './watch-alerts.service';
import { selectWatches, toWatch, toWatchDetail, watchHypothesis, watchLabels, type WatchRow } from './watch-rows';

type CreateWatch = ReturnType<typeof createWatchRequestSchema.parse>;

/** The feed's columns (the other kinds' columns are emptied when the feed changes). */
function feedColumns(feed: WatchFeed) {
  return feed.kind === 'pull'
    ? { feed_kind: 'pull', connection_id: feed.connectionId, pull_query: feed.query, schedule: feed.schedule, timezone: feed.timezone ?? null }
    : { feed_kind: feed.kind, connection_id: null, pull_query: null, schedule: null, timezone: null };
}

async function requireConnection(db: Knex, feed: WatchFeed): Promise<void> {
  if (feed.kind !== 'pull') return;
  const connection = await db('source_connections').where({ id: feed.connectionId }).whereNull('deleted_at').first('id');
  if (!connection) throw unprocessable(`connection ${feed.connectionId} does not exist`, [{ path: 'feed.connectionId', message: 'no such connection' }]);
}

/** The webhook columns: a new webhook needs a secret; an edit without one keeps the stored secret. */
function webhookColumns(key: Buffer, webhook: WebhookSettingsRequest | null | undefined, stored?: WatchRow) {
  if (webhook === undefined) return {};
  if (webhook === null) return { webhook_url: null, webhook_secret_encrypted: null };
  if (webhook.secret === undefined && !stored?.webhook_secret_encrypted) {
    throw unprocessable('webhook.secret is required for a new webhook (it signs each delivery)', [{ path: 'webhook.secret', message: 'required' }]);
  }
  return {
    webhook_url: webhook.url,
    webhook_secret_encrypted: webhook.secret === undefined ? stored?.webhook_secret_encrypted : seal(key, webhook.secret),
  };
}

/** What the audit trail keeps of a watch (never the webhook secret). */
const auditView = (row: { name: string; feed_kind: string; alpha: number; state: string; webhook_url?: string | null }) => ({
  name: row.name,
  feed: row.feed_kind,
  alpha: row.alpha,
  state: row.state,
  webhook: row.webhook_url ?? null,
});

export async function getWatchRow(db: Knex | Knex.Transaction, id: number): Promise<WatchRow> {
  return selectWatches(db).where('watches.id', id).first();
}

export async function createWatch(ctx: WatchContext, caller: User, request: CreateWatch): Promise<WatchDetail> {
  const { db } = ctx;
  await requireWatchEditor(db, caller, request.studyId);
  await requireConnection(db, request.feed);
  const sequentialState = beginSequentialTest(request.labels, request.hypothesis, request.alpha);
  const id = await db.transaction(async (trx) => {
    const columns = {
      study_id: request.studyId,
      name: request.name,
      description: request.description ?? null,
      labels_json: JSON.stringify(request.labels),
      hypothesis_json: JSON.stringify(request.hypothesis),
      alpha: request.alpha,
      ...feedColumns(request.feed),
      ...webhookColumns(ctx.secretKey, request.webhook),
      state: 'holding',
      sequential_state_json: JSON.stringify(sequentialState),
      shares_json: '[]',
      created_by: caller.id,
    };
    const [row] = await trx('watches').insert(columns).returning('id');
    const newId = insertedId(row);
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'create',
      entityType: 'watch',
      entityId: newId,
      studyId: request.studyId,
      summary: `created watch "${request.name}" (${request.feed.kind} feed)`,
      after: { ...auditView(columns), labels: request.labels, hypothesis: request.hypothesis.kind },
    });
    return newId;
  });
  ctx.scheduleChanged(id);
  return toWatchDetail(await getWatchRow(db, id));
}

export async function getWatch(db: Knex, caller: User, id: number): Promise<WatchDetail> {
  return toWatchDetail(await getReadableWatchRow(db, caller, id));
}

/** One page of the watches the caller may read, those in alarm first, then by name. */
export async function listWatches(db: Knex, caller: User, query: ListWatchesFilters): Promise<Page<Watch>> {
  const filtered = db('watches')
    .whereNull('watches.deleted_at')
    .modify((builder) => scopeWatchesToReader(builder, db, caller))
    .modify((builder) => {
      if (query.studyId) builder.where('watches.study_id', query.studyId);
      if (query.state) builder.where('watches.state', query.state);
      if (query.feed) builder.where('watches.feed_kind', query.feed);
      if (query.waiting !== undefined) builder.where('watches.alert_state', query.waiting ? '=' : '<>', 'waiting');
      if (query.q) {
        const pattern = `%${query.q.toLowerCase().replace(/[\\%_]/g, (c) => '\\' + c)}%`;
        builder.where((inner) =>
          inner
            .whereRaw("lower(watches.name) like ? escape '\\'", [pattern])
            .orWhereRaw("lower(coalesce(watches.description, '')) like ? escape '\\'", [pattern]),
        );
      }
    });
  const [{ total }] = await filtered.clone().count({ total: '*' });
  const ids: number[] = await filtered
    .clone()
    .orderByRaw("(watches.state = 'alarm') desc")
    .orderBy('watches.name')
    .orderBy('watches.id')
    .limit(query.pageSize)
    .offset((query.page - 1) * query.pageSize)
    .pluck('watches.id');
  const rows: WatchRow[] = ids.length ? await selectWatches(db).whereIn('watches.id', ids) : [];
  const byId = new Map(rows.map((row) => [row.id, row]));
  const items = ids.map((id) => byId.get(id)).filter((row): row is WatchRow => row !== undefined);
  return { items: items.map(toWatch), total: Number(total), page: query.page, pageSize: query.pageSize };
}

/**
 * Edits a watch. Labels, hypothesis and α are what the sequential evidence is about, so they
 * change only before the first batch (or after a restart, which begins a fresh test).
 */
export async function updateWatch(ctx: WatchContext, caller: User, id: number, request: UpdateWatchRequest): Promise<WatchDetail> {
  const { db } = ctx;
  const before = await getChangeableWatchRow(db, caller, id);
  const changesTest = request.labels !== undefined || request.hypothesis !== undefined || request.alpha !== undefined;
  if (changesTest && Number(before.n) > 0) {
    throw conflict(`watch ${id} has taken in batches: its categories, hypothesis and alpha are fixed until the test is restarted (pause, then resume with restart)`);
  }
  if (request.feed) await requireConnection(db, request.feed);
  const labels = request.labels ?? watchLabels(before);
  const hypothesis = request.hypothesis ?? watchHypothesis(before);
  const alpha = request.alpha ?? before.alpha;
  const changes: Record<string, unknown> = {
    ...(request.name !== undefined ? { name: request.name } : {}),
    ...(request.description !== undefined ? { description: request.description } : {}),
    ...(request.feed ? feedColumns(request.feed) : {}),
    ...webhookColumns(ctx.secretKey, request.webhook, before),
    ...(changesTest
      ? {
          labels_json: JSON.stringify(labels),
          hypothesis_json: JSON.stringify(hypothesis),
          alpha,
          sequential_state_json: JSON.stringify(beginSequentialTest(labels, hypothesis, alpha)),
        }
      : {}),
  };
  await db.transaction(async (trx) => {
    await trx('watches').where({ id }).update({ ...changes, updated_at: now(trx) });
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'update',
      entityType: 'watch',
      entityId: id,
      studyId: before.study_id,
      summary: `edited watch "${request.name ?? before.name}"`,
      before: auditView(before),
      after: auditView({ ...before, ...changes }),
    });
  });
  ctx.scheduleChanged(id);
  return toWatchDetail(await getWatchRow(db, id));
}

export async function pauseWatch(ctx: WatchContext, caller: User, id: number): Promise<WatchDetail> {
  const { db } = ctx;
  const before = await getPausableWatchRow(db, caller, id);
  if (before.state === 'paused') throw conflict(`watch ${id} is already paused`);
  await db.transaction(async (trx) => {
    // Guarded by the state read, so a racing pause or batch cannot be overwritten unseen.
    const changed = await trx('watches').where({ id, state: before.state }).update({ state: 'paused', updated_at: now(trx) });
    if (changed !== 1) throw conflict(`watch ${id} changed meanwhile; try again`);
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'update',
      entityType: 'watch',
      entityId: id,
      studyId: before.study_id,
      summary: `paused watch "${before.name}"`,
      before: { state: before.state },
      after: { state: 'paused' },
    });
  });
  ctx.scheduleChanged(id);
  return toWatchDetail(await getWatchRow(db, id));
}

/**
 * Resumes a paused watch in the state its sequential test says. With `restart`, a fresh
 * sequential test begins (and an open alarm is cleared, with its alert).
 */
export async function resumeWatch(ctx: WatchContext, caller: User, id: number, restart: boolean): Promise<WatchDetail> {
  const { db } = ctx;
  const before = await getPausableWatchRow(db, caller, id);
  if (before.state !== 'paused') throw conflict(`watch ${id} is not paused`);
  const fresh = restart ? beginSequentialTest(watchLabels(before), watchHypothesis(before), before.alpha) : undefined;
  let alerted = false;
  await db.transaction(async (trx) => {
    const state = fresh ? 'holding' : before.alarm ? 'alarm' : 'holding';
    const changed = await trx('watches')
      .where({ id, state: 'paused' })
      .update({
        state,
        ...(fresh ? { alarm: false, n: 0, sequential_p: 1, sequential_state_json: JSON.stringify(fresh), shares_json: '[]' } : {}),
        updated_at: now(trx),
      });
    if (changed !== 1) throw conflict(`watch ${id} changed meanwhile; try again`);
    if (fresh && before.alarm) alerted = await clearAlarmByRestart(trx, ctx, before);
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'update',
      entityType: 'watch',
      entityId: id,
      studyId: before.study_id,
      summary: `resumed watch "${before.name}"${fresh ? ' with a fresh sequential test' : ''}`,
      before: { state: 'paused', n: Number(before.n), sequentialP: before.sequential_p },
      after: { state, restarted: Boolean(fresh) },
    });
  });
  ctx.scheduleChanged(id);
  if (alerted) ctx.deliveriesQueued();
  return toWatchDetail(await getWatchRow(db, id));
}

/** Deletes a watch (soft: its batches and alerts stay for the audit trail, its schedule stops). */
export async function deleteWatch(ctx: WatchContext, caller: User, id: number): Promise<void> {
  const { db } = ctx;
  const before = await getChangeableWatchRow(db, caller, id);
  await db.transaction(async (trx) => {
    await trx('watches').where({ id }).update({ deleted_at: now(trx), updated_at: now(trx) });
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'delete',
      entityType: 'watch',
      entityId: id,
      studyId: before.study_id,
      summary: `deleted watch "${before.name}" (${before.batch_count} batches kept)`,
      before: auditView(before),
    });
  });
  ctx.scheduleChanged(id);
}
