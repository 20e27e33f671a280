import type { Knex } from 'knex';
import {
  can,
  type AddStudyMemberRequest,
  type CreateStudyRequest,
  type Study,
  type StudyDetail,
  type StudyMember,
  type StudyRole,
  type UpdateStudyRequest,
  type User,
} from '@tallyfit/contracts';
import { insertWithAudit, recordAudit } from '../audit/audit.service';
import { isoDate, now } from '../http/db-time';
import { conflict, forbidden, notFound, unprocessable } from '../http/http-error';
import { memberStudyIds, readsEveryStudy, studyRoleOf } from './study-access';

interface StudyRow {
  id: number;
  name: string;
  description: string | null;
  created_by: number;
  creator_name: string;
  created_at: string | Date;
  updated_at: string | Date;
  archived_at: string | Date | null;
  member_count: number | string;
  analysis_count: number | string;
  my_study_role: StudyRole | null;
}

function selectStudies(db: Knex, caller: User) {
  return db('studies')
    .join('users as creator', 'creator.id', 'studies.created_by')
    .select(
      'studies.*',
      'creator.name as creator_name',
      db('study_members').count('*').whereRaw('study_members.study_id = studies.id').as('member_count'),
      db('analyses')
        .count('*')
        .whereRaw('analyses.study_id = studies.id')
        .whereNull('analyses.deleted_at')
        .where('analyses.is_latest', true)
        .as('analysis_count'),
      db('study_members')
        .select('study_role')
        .whereRaw('study_members.study_id = studies.id')
        .where('study_members.user_id', caller.id)
        .as('my_study_role'),
    );
}

const toStudy = (row: StudyRow): Study => ({
  id: row.id,
  name: row.name,
  description: row.description,
  createdBy: { id: row.created_by, name: row.creator_name },
  createdAt: isoDate(row.created_at),
  updatedAt: isoDate(row.updated_at),
  archived: row.archived_at !== null,
  archivedAt: isoDate(row.archived_at),
  memberCount: Number(row.member_count),
  analysisCount: Number(row.analysis_count),
  myStudyRole: row.my_study_role ?? null,
});

/** The studies the caller may read, by name; archived ones only when asked for. */
export async function listStudies(db: Knex, caller: User, includeArchived = false): Promise<Study[]> {
  const rows: StudyRow[] = await selectStudies(db, caller)
    .modify((builder) => {
      if (!readsEveryStudy(caller)) builder.whereIn('studies.id', memberStudyIds(db, caller.id));
      if (!includeArchived) builder.whereNull('studies.archived_at');
    })
    .orderBy([{ column: 'studies.name' }, { column: 'studies.id' }]);
  return rows.map(toStudy);
}

async function listMembers(db: Knex, studyId: number): Promise<StudyMember[]> {
  const rows = await db('study_members')
    .join('users', 'users.id', 'study_members.user_id')
    .where('study_members.study_id', studyId)
    .select('users.id', 'users.name', 'users.email', 'users.role', 'study_members.study_role', 'study_members.added_at')
    .orderBy([{ column: 'users.name' }, { column: 'users.id' }]);
  return rows.map((row) => ({
    userId: row.id,
    name: row.name,
    email: row.email,
    role: row.role,
    studyRole: row.study_role,
    addedAt: isoDate(row.added_at),
  }));
}

/** One study with its members; 404 when it does not exist or the caller may not read it. */
export async function getStudy(db: Knex, caller: User, id: number): Promise<StudyDetail> {
  const row: StudyRow | undefined = await selectStudies(db, caller).where('studies.id', id).first();
  if (!row || (!readsEveryStudy(caller) && row.my_study_role === null)) throw notFound(`study ${id} does not exist`);
  return { ...toStudy(row), members: await listMembers(db, id) };
}

/** Admins and the study's owners manage a study; others who can read it get 403, the rest 404. */
async function requireManager(db: Knex, caller: User, id: number): Promise<StudyDetail> {
  const study = await getStudy(db, caller, id);
  if (!can(caller.role, 'studies.manage', study.myStudyRole)) {
    throw forbidden('only an owner of this study or an admin may change it');
  }
  return study;
}

const studySummary = (study: Pick<StudyDetail, 'name' | 'description' | 'archived'>) => ({
  name: study.name,
  description: study.description,
  archived: study.archived,
});

/** Creates a study with its creator as owner, in one transaction with its audit event. */
export async function createStudy(db: Knex, caller: User, request: CreateStudyRequest): Promise<StudyDetail> {
  const id = await db.transaction(async (trx) => {
    const study = { name: request.name, description: request.description ?? null, created_by: caller.id };
    const studyId = await insertWithAudit(trx, 'studies', study, (newId) => ({
      actorId: caller.id,
      action: 'create',
      entityType: 'study',
      entityId: newId,
      studyId: newId,
      summary: `created study "${request.name}"`,
      after: { name: request.name, description: study.description, archived: false },
    }));
    await trx('study_members').insert({ study_id: studyId, user_id: caller.id, study_role: 'owner' });
    return studyId;
  });
  return getStudy(db, caller, id);
}

/** Renames, describes, archives or restores a study. */
export async function updateStudy(db: Knex, caller: User, id: number, request: UpdateStudyRequest): Promise<StudyDetail> {
  const before = await requireManager(db, caller, id);
  const changes: Record<string, unknown> = {};
  if (request.name !== undefined) changes['name'] = request.name;
  if (request.description !== undefined) changes['description'] = request.description;
  if (request.archived !== undefined && request.archived !== before.archived) {
    changes['archived_at'] = request.archived ? now(db) : null;
  }
  await db.transaction(async (trx) => {
    await trx('studies').where({ id }).update({ ...changes, updated_at: now(trx) });
    const after = {
      name: request.name ?? before.name,
      description: request.description === undefined ? before.description : request.description,
      archived: request.archived ?? before.archived,
    };
    const verb = request.archived === true && !before.archived ? 'archived' : request.archived === false && before.archived ? 'restored' : 'changed';
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'update',
      entityType: 'study',
      entityId: id,
      studyId: id,
      summary: `${verb} study "${after.name}"`,
      before: studySummary(before),
      after,
    });
  });
  return getStudy(db, caller, id);
}

async function requireActiveStudy(study: StudyDetail): Promise<void> {
  if (study.archived) throw conflict(`study ${study.id} is archived; restore it before changing its members`);
}

/** A viewer may only read, whatever study role they are given. */
function checkStudyRoleFits(role: User['role'], studyRole: StudyRole): void {
  if (role === 'viewer' && studyRole !== 'reader') {
    throw unprocessable('a viewer can only be a reader of a study', [
      { path: 'studyRole', message: 'a viewer can only be a reader' },
    ]);
  }
}

export async function addStudyMember(db: Knex, caller: User, studyId: number, request: AddStudyMemberRequest): Promise<StudyDetail> {
  const study = await requireManager(db, caller, studyId);
  await requireActiveStudy(study);
  const person = await db('users').where({ id: request.userId }).first('id', 'name', 'role', 'disabled');
  if (!person) throw notFound(`person ${request.userId} does not exist`);
  if (person.disabled) throw unprocessable(`${person.name} is disabled`, [{ path: 'userId', message: 'this person is disabled' }]);
  checkStudyRoleFits(person.role, request.studyRole);
  if (study.members.some((member) => member.userId === request.userId)) {
    throw conflict(`${person.name} is already a member of this study`);
  }
  await db.transaction(async (trx) => {
    await trx('study_members').insert({ study_id: studyId, user_id: request.userId, study_role: request.studyRole });
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'create',
      entityType: 'study-member',
      entityId: `${studyId}:${request.userId}`,
      studyId,
      summary: `added ${person.name} to study "${study.name}" as ${request.studyRole}`,
      after: { userId: request.userId, studyRole: request.studyRole },
    });
  });
  return getStudy(db, caller, studyId);
}

function requireMember(study: StudyDetail, userId: number): StudyMember {
  const member = study.members.find((candidate) => candidate.userId === userId);
  if (!member) throw notFound(`person ${userId} is not a member of study ${study.id}`);
  return member;
}

/** A study always keeps at least one owner. */
function checkOwnerRemains(study: StudyDetail, userId: number): void {
  const owners = study.members.filter((member) => member.studyRole === 'owner');
  if (owners.length === 1 && owners[0].userId === userId) {
    throw conflict('a study needs at least one owner; make someone else owner first');
  }
}

export async function updateStudyMember(
  db: Knex,
  caller: User,
  studyId: number,
  userId: number,
  studyRole: StudyRole,
): Promise<StudyDetail> {
  const study = await requireManager(db, caller, studyId);
  await requireActiveStudy(study);
  const member = requireMember(study, userId);
  checkStudyRoleFits(member.role, studyRole);
  if (member.studyRole === 'owner' && studyRole !== 'owner') checkOwnerRemains(study, userId);
  await db.transaction(async (trx) => {
    await trx('study_members').where({ study_id: studyId, user_id: userId }).update({ study_role: studyRole });
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'role-change',
      entityType: 'study-member',
      entityId: `${studyId}:${userId}`,
      studyId,
      summary: `made ${member.name} ${studyRole} of study "${study.name}"`,
      before: { studyRole: member.studyRole },
      after: { studyRole },
    });
  });
  return getStudy(db, caller, studyId);
}

export async function removeStudyMember(db: Knex, caller: User, studyId: number, userId: number): Promise<void> {
  const study = await requireManager(db, caller, studyId);
  await requireActiveStudy(study);
  const member = requireMember(study, userId);
  if (member.studyRole === 'owner') checkOwnerRemains(study, userId);
  await db.transaction(async (trx) => {
    await trx('study_members').where({ study_id: studyId, user_id: userId }).delete();
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'delete',
      entityType: 'study-member',
      entityId: `${studyId}:${userId}`,
      studyId,
      summary: `removed ${member.name} from study "${study.name}"`,
      before: { userId, studyRole: member.studyRole },
    });
  });
}

/**
 * Checks that the caller may add analyses to a study (admin, or an owner or contributor of an
 * active study). Used by analyses and datasets alike.
 */
export async function requireStudyContributor(db: Knex, caller: User, studyId: number): Promise<void> {
  const study = await db('studies').where({ id: studyId }).first('id', 'archived_at');
  const studyRole = study ? await studyRoleOf(db, studyId, caller.id) : undefined;
  if (!study || (!readsEveryStudy(caller) && !studyRole)) throw notFound(`study ${studyId} does not exist`);
  if (!can(caller.role, 'analyses.run', studyRole ?? null)) {
    throw forbidden('only owners and contributors of this study may add work to it');
  }
  if (study.archived_at !== null) throw conflict(`study ${studyId} is archived; restore it before adding work to it`);
}
