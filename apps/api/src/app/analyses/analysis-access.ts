import type { Knex } from 'knex';
import type { User } from '@tallyfit/contracts';
import { memberStudyIds, readsEveryStudy, RUNS_ANALYSES, studyRoleOf } from '../studies/study-access';

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
  if (caller.role === 'admin') return true;
  if (caller.role === 'viewer' || caller.role === 'lead') return false;
  if (analysis.author.id === caller.id) return true;
  if (!analysis.study) return false;
  const studyRole = await studyRoleOf(db, analysis.study.id, caller.id);
  return studyRole !== undefined && RUNS_ANALYSES.includes(studyRole);
}
