import type { Knex } from 'knex';
import type { AuditAction, AuditEvent, ListAuditQuery, Page } from '@tallyfit/contracts';
import { dbTime, insertedId, isoDate } from '../http/db-time';

export interface AuditEntry {
  /** Who did it; null when nobody is signed in (a failed sign-in). */
  actorId: number | null;
  action: AuditAction;
  /** The kind of record: 'analysis', 'study', 'user', 'api-token', 'dataset', 'share', ... */
  entityType: string;
  entityId?: number | string | null;
  studyId?: number | null;
  /** One plain sentence. */
  summary: string;
  /** Small summaries of the record before and after the change (never secrets). */
  before?: unknown;
  after?: unknown;
}

interface AuditRow {
  id: number;
  at: string | Date;
  actor_id: number | null;
  actor_name: string | null;
  action: AuditAction;
  entity_type: string;
  entity_id: string | null;
  study_id: number | null;
  summary: string;
  before_json: string | null;
  after_json: string | null;
}

/**
 * Records one audit event. Pass the transaction that makes the change, so the event is stored
 * if and only if the change is.
 */
export async function recordAudit(trx: Knex | Knex.Transaction, entry: AuditEntry): Promise<void> {
  await trx('audit_events').insert({
    actor_id: entry.actorId,
    action: entry.action,
    entity_type: entry.entityType,
    entity_id: entry.entityId === undefined || entry.entityId === null ? null : String(entry.entityId),
    study_id: entry.studyId ?? null,
    summary: entry.summary.slice(0, 500),
    before_json: entry.before === undefined ? null : JSON.stringify(entry.before),
    after_json: entry.after === undefined ? null : JSON.stringify(entry.after),
  });
}

/**
 * Inserts one row and records its audit event in the same transaction; answers the new row's id.
 * The event is built from the id, so it always names the row it describes.
 */
export async function insertWithAudit(
  trx: Knex.Transaction,
  table: string,
  row: Record<string, unknown>,
  audit: (id: number) => AuditEntry,
): Promise<number> {
  const [inserted] = await trx(table).insert(row).returning('id');
  const id = insertedId(inserted);
  await recordAudit(trx, audit(id));
  return id;
}

/** The audit trail, newest first, filtered. */
export async function listAudit(db: Knex, query: ListAuditQuery): Promise<Page<AuditEvent>> {
  const filtered = db('audit_events').modify((builder) => {
    if (query.actorId) builder.where('audit_events.actor_id', query.actorId);
    if (query.action) builder.where('audit_events.action', query.action);
    if (query.entityType) builder.where('audit_events.entity_type', query.entityType);
    if (query.entityId) builder.where('audit_events.entity_id', query.entityId);
    if (query.studyId) builder.where('audit_events.study_id', query.studyId);
    if (query.from) builder.where('audit_events.at', '>=', dbTime(db, query.from));
    if (query.to) builder.where('audit_events.at', '<=', dbTime(db, query.to));
  });
  const [{ total }] = await filtered.clone().count({ total: '*' });
  const rows: AuditRow[] = await filtered
    .clone()
    .leftJoin('users', 'users.id', 'audit_events.actor_id')
    .select('audit_events.*', 'users.name as actor_name')
    .orderBy([
      { column: 'audit_events.at', order: 'desc' },
      { column: 'audit_events.id', order: 'desc' },
    ])
    .limit(query.pageSize)
    .offset((query.page - 1) * query.pageSize);
  return {
    items: rows.map((row) => ({
      id: row.id,
      at: isoDate(row.at),
      actor: row.actor_id === null ? null : { id: row.actor_id, name: row.actor_name ?? '' },
      action: row.action,
      entityType: row.entity_type,
      entityId: row.entity_id,
      studyId: row.study_id,
      summary: row.summary,
      before: row.before_json === null ? null : JSON.parse(row.before_json),
      after: row.after_json === null ? null : JSON.parse(row.after_json),
    })),
    total: Number(total),
    page: query.page,
    pageSize: query.pageSize,
  };
}
