import type { Knex } from 'knex';
import type { StudyRole, User } from '@tallyfit/contracts';

/** Leads and admins read every study; everyone else reads the studies they are members of. */
export const readsEveryStudy = (user: Pick<User, 'role'>): boolean => user.role === 'admin' || user.role === 'lead';

export async function studyRoleOf(db: Knex, studyId: number, userId: number): Promise<StudyRole | undefined> {
  const row = await db('study_members').where({ study_id: studyId, user_id: userId }).first('study_role');
  return row?.study_role;
}

/** A subquery of the ids of the studies a person belongs to. */
export const memberStudyIds = (db: Knex, userId: number) => db('study_members').select('study_id').where('user_id', userId);
