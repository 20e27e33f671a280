import type { Knex } from 'knex';
import type { User } from '@tallyfit/contracts';
import { forbidden, notFound } from '../http/http-error';
import { memberStudyIds, readsEveryStudy } from '../studies/study-access';
import { requireStudyContributor } from '../studies/studies.service';
import { selectWatches, type WatchRow } from './watch-rows';

/**
 * Who may do what with a watch, as for analyses: everyone who may read its study reads it;
 * admins and the analysts who may add work to its study create, edit, delete and feed it;
 * leads and admins acknowledge its alerts; pausing and resuming is for leads as well as editors.
 */

/** Limits a query on `watches` to the studies the caller may read. */
export function scopeWatchesToReader(builder: Knex.QueryBuilder, db: Knex, caller: User): Knex.QueryBuilder {
  if (readsEveryStudy(caller)) return builder;
  return builder.whereIn('watches.study_id', memberStudyIds(db, caller.id));
}

/** A watch the caller may read; 404 otherwise, so the answer does not reveal what exists. */
export async function getReadableWatchRow(db: Knex, caller: User, id: number): Promise<WatchRow> {
  const row: WatchRow | undefined = await selectWatches(db)
    .where('watches.id', id)
    .modify((builder) => scopeWatchesToReader(builder, db, caller))
    .first();
  if (!row) throw notFound(`watch ${id} does not exist`);
  return row;
}

/** A watch the caller may change or feed (admins, owners and contributors of its active study). */
export async function getChangeableWatchRow(db: Knex, caller: User, id: number): Promise<WatchRow> {
  const row = await getReadableWatchRow(db, caller, id);
  if (caller.role === 'lead' || caller.role === 'viewer') throw forbidden(`a ${caller.role} reads watches but does not change or feed them`);
  await requireStudyContributor(db, caller, row.study_id);
  return row;
}

/** A watch the caller may pause or resume: its editors, and leads. */
export async function getPausableWatchRow(db: Knex, caller: User, id: number): Promise<WatchRow> {
  const row = await getReadableWatchRow(db, caller, id);
  if (caller.role === 'lead') return row;
  return getChangeableWatchRow(db, caller, id);
}

/** Leads and admins acknowledge alarms. */
export function requireAcknowledger(caller: User): void {
  if (caller.role !== 'lead' && caller.role !== 'admin') throw forbidden('only leads and admins acknowledge alerts');
}
