import type { Knex } from 'knex';
import type { ChangePasswordRequest, CreatePersonRequest, Person, UpdatePersonRequest, User } from '@tallyfit/contracts';
import { insertWithAudit, recordAudit } from '../audit/audit.service';
import { hashPassword, verifyPassword } from '../identity/password';
import { requireStrongPassword } from '../identity/password-strength';
import { revokeAllRefreshTokens } from '../identity/refresh-tokens.service';
import { findUserByEmail, findUserById } from '../identity/users.service';
import { isoDate } from '../http/db-time';
import { conflict, notFound, unprocessable } from '../http/http-error';

interface PersonRow {
  id: number;
  email: string;
  name: string;
  role: Person['role'];
  disabled: number | boolean;
  created_at: string | Date;
}

const PERSON_COLUMNS = ['id', 'email', 'name', 'role', 'disabled', 'created_at'];

const toPerson = (row: PersonRow): Person => ({
  id: row.id,
  email: row.email,
  name: row.name,
  role: row.role,
  disabled: Boolean(row.disabled),
  createdAt: isoDate(row.created_at),
});

const summary = (person: Pick<Person, 'email' | 'name' | 'role' | 'disabled'>) => ({
  email: person.email,
  name: person.name,
  role: person.role,
  disabled: person.disabled,
});

export async function listPeople(db: Knex, options: { enabledOnly?: boolean } = {}): Promise<Person[]> {
  const rows: PersonRow[] = await db('users')
    .select(PERSON_COLUMNS)
    .modify((builder) => {
      if (options.enabledOnly) builder.where('disabled', false);
    })
    .orderBy([{ column: 'name' }, { column: 'id' }]);
  return rows.map(toPerson);
}

export async function getPerson(db: Knex, id: number): Promise<Person> {
  const row: PersonRow | undefined = await db('users').select(PERSON_COLUMNS).where({ id }).first();
  if (!row) throw notFound(`person ${id} does not exist`);
  return toPerson(row);
}

/** An admin adds a person; e-mails are unique without regard to case. */
export async function createPerson(db: Knex, caller: User, request: CreatePersonRequest): Promise<Person> {
  if (await findUserByEmail(db, request.email)) throw conflict(`someone already signs in with ${request.email.toLowerCase()}`);
  await requireStrongPassword(request.password, 'password', [request.email, request.name]);
  const passwordHash = await hashPassword(request.password);
  const row = { email: request.email.toLowerCase(), name: request.name, role: request.role, password_hash: passwordHash };
  const id = await db.transaction((trx) =>
    insertWithAudit(trx, 'users', row, (personId) => ({
      actorId: caller.id,
      action: 'create',
      entityType: 'user',
      entityId: personId,
      summary: `added ${request.name} as ${request.role}`,
      after: { email: row.email, name: request.name, role: request.role, disabled: false },
    })),
  );
  return getPerson(db, id);
}

async function countActiveAdmins(db: Knex): Promise<number> {
  const [{ count }] = await db('users').where({ role: 'admin', disabled: false }).count({ count: '*' });
  return Number(count);
}

/** An admin renames a person, changes their role, or disables or enables them. */
export async function updatePerson(db: Knex, caller: User, id: number, request: UpdatePersonRequest): Promise<Person> {
  const before = await getPerson(db, id);
  const losesAdmin =
    before.role === 'admin' && !before.disabled && ((request.role !== undefined && request.role !== 'admin') || request.disabled === true);
  if (losesAdmin && (await countActiveAdmins(db)) === 1) {
    throw conflict('this is the only active admin; make someone else admin first');
  }
  const after = {
    ...summary(before),
    name: request.name ?? before.name,
    role: request.role ?? before.role,
    disabled: request.disabled ?? before.disabled,
  };
  await db.transaction(async (trx) => {
    await trx('users').where({ id }).update({ name: after.name, role: after.role, disabled: after.disabled });
    if (after.disabled && !before.disabled) await revokeAllRefreshTokens(trx, id);
    const roleChanged = after.role !== before.role;
    await recordAudit(trx, {
      actorId: caller.id,
      action: roleChanged ? 'role-change' : 'update',
      entityType: 'user',
      entityId: id,
      summary: roleChanged
        ? `changed ${after.name}'s role from ${before.role} to ${after.role}`
        : `${after.disabled !== before.disabled ? (after.disabled ? 'disabled' : 'enabled') : 'edited'} ${after.name}`,
      before: summary(before),
      after,
    });
  });
  return getPerson(db, id);
}

/** A person changes their own password; every other session is signed out. */
export async function changeOwnPassword(db: Knex, caller: User, request: ChangePasswordRequest): Promise<void> {
  const user = await findUserById(db, caller.id);
  if (!user || !(await verifyPassword(request.currentPassword, user.passwordHash))) {
    throw unprocessable('the current password is wrong', [{ path: 'currentPassword', message: 'is wrong' }]);
  }
  await requireStrongPassword(request.newPassword, 'newPassword', [user.email, user.name]);
  const passwordHash = await hashPassword(request.newPassword);
  await db.transaction(async (trx) => {
    await trx('users').where({ id: caller.id }).update({ password_hash: passwordHash });
    await revokeAllRefreshTokens(trx, caller.id);
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'update',
      entityType: 'user',
      entityId: caller.id,
      summary: `${user.name} changed their password`,
    });
  });
}
