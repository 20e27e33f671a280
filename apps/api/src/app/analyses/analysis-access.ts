import type { Knex } from 'knex';
import { can, type User } from '@tallyfit/contracts';
import { memberStudyIds, readsEveryStudy, studyRoleOf } from '../studies/study-access';

/**
 * Limits a query on `analyses` to what the caller may read: leads and admins read everything;
 * analysts read their own analyses and those of their studies; viewers read their studies'.
 */
export function scopeToReader(builder: Knex.QueryBuilder, db: Knex, caller: User): Knex.QueryBuilder {
  if (readsEveryStudy(caller)) return builder;
  if (caller.role === 'viewer') return builder.whereIn('analyses.study_id', memberStudyIds(db, caller.id));
  return builder.where((inner) =>
    inner.whereIn('analyses.study_id', memberStudyIds(db, caller.id)).orWhere('analyses.author_id', caller.id),
  );
}

/** Who may re-run and edit an analysis: its author, an admin, or an owner/contributor of its study. */
export async function mayChangeAnalysis(
  db: Knex,
  caller: User,
  analysis: { author: { id: number }; study: { id: number } | null },
): Promise<boolean> {
  if (!can(caller.role, 'analyses.run')) return false;
  if (caller.role === 'admin' || analysis.author.id === caller.id) return true;
  if (!analysis.study) return false;
  return can(caller.role, 'analyses.run', (await studyRoleOf(db, analysis.study.id, caller.id)) ?? null);
}
