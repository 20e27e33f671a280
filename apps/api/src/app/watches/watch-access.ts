import type { Knex } from 'knex';
import { can, type User } from '@tallyfit/contracts';
import { conflict, forbidden, notFound } from '../http/http-error';
import { memberStudyIds, readsEveryStudy, studyRoleOf } from '../studies/study-access';
import { selectWatches, type WatchRow } from './watch-rows';

/**
 * The study part of the watch capabilities (the role part is the route's): everyone who reads a
 * study reads its watches; `watches.manage` needs an owner or contributor of the study;
 * `watches.pause` the same, except for those who read every study (leads).
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

/** Checks that the caller may create, edit and feed watches in an active study. */
export async function requireWatchEditor(db: Knex, caller: User, studyId: number): Promise<void> {
  const study = await db('studies').where({ id: studyId }).first('id', 'archived_at');
  const studyRole = study ? await studyRoleOf(db, studyId, caller.id) : undefined;
  if (!study || (!readsEveryStudy(caller) && !studyRole)) throw notFound(`study ${studyId} does not exist`);
  if (!can(caller.role, 'watches.manage', studyRole ?? null)) {
    throw forbidden('only owners and contributors of this study (and admins) create, edit and feed its watches');
  }
  if (study.archived_at !== null) throw conflict(`study ${studyId} is archived; restore it before changing its watches`);
}

/** A watch the caller may change or feed. */
export async function getChangeableWatchRow(db: Knex, caller: User, id: number): Promise<WatchRow> {
  const row = await getReadableWatchRow(db, caller, id);
  await requireWatchEditor(db, caller, row.study_id);
  return row;
}

/** A watch the caller may pause or resume. */
export async function getPausableWatchRow(db: Knex, caller: User, id: number): Promise<WatchRow> {
  const row = await getReadableWatchRow(db, caller, id);
  const studyRole = readsEveryStudy(caller) ? undefined : ((await studyRoleOf(db, row.study_id, caller.id)) ?? null);
  if (!can(caller.role, 'watches.pause', studyRole)) throw forbidden('only leads, admins and the study’s owners and contributors pause or resume a watch');
  return row;
}

/** Leads and admins acknowledge alarms. */
export function requireAcknowledger(caller: User): void {
  if (!can(caller.role, 'alerts.acknowledge')) throw forbidden('only leads and admins acknowledge alerts');
}
