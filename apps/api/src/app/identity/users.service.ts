import type { Knex } from 'knex';
import type { Role, User } from '@tallyfit/contracts';
import { hashPassword } from './password';

interface UserRow {
  id: number;
  email: string;
  name: string;
  password_hash: string;
  role: Role;
  disabled: number | boolean;
  sessions_valid_after_ms: number | string | null;
}

export interface StoredUser extends User {
  passwordHash: string;
  disabled: boolean;
  /** Access tokens issued before this moment (ms since 1970) are refused; null: none refused. */
  sessionsValidAfterMs: number | null;
}

const toStoredUser = (row: UserRow): StoredUser => ({
  id: row.id,
  email: row.email,
  name: row.name,
  role: row.role,
  passwordHash: row.password_hash,
  disabled: Boolean(row.disabled),
  // PostgreSQL returns bigint as a string.
  sessionsValidAfterMs: row.sessions_valid_after_ms === null ? null : Number(row.sessions_valid_after_ms),
});

export const publicUser = ({ id, email, name, role }: User): User => ({ id, email, name, role });

export async function findUserByEmail(db: Knex, email: string): Promise<StoredUser | undefined> {
  const row = await db<UserRow>('users').whereRaw('lower(email) = ?', [email.toLowerCase()]).first();
  return row && toStoredUser(row);
}

export async function findUserById(db: Knex, id: number): Promise<StoredUser | undefined> {
  const row = await db<UserRow>('users').where({ id }).first();
  return row && toStoredUser(row);
}

export async function createUser(
  db: Knex,
  user: { email: string; name: string; role: Role; password: string },
): Promise<User> {
  const [row] = await db<UserRow>('users')
    .insert({
      email: user.email.toLowerCase(),
      name: user.name,
      role: user.role,
      password_hash: await hashPassword(user.password),
    })
    .returning(['id', 'email', 'name', 'role']);
  return publicUser(row as User);
}

export async function countUsers(db: Knex): Promise<number> {
  const [{ count }] = await db('users').count({ count: '*' });
  return Number(count);
}

/**
 * Ends every access token issued so far to this person (sign-out, password change): the check on
 * each request refuses tokens issued before now. Refresh tokens are a separate matter: sign-out
 * revokes one, a password change all.
 */
export async function endAccessTokensIssuedSoFar(db: Knex, userId: number, nowMs = Date.now()): Promise<void> {
  await db('users').where({ id: userId }).update({ sessions_valid_after_ms: nowMs });
}
