import type { Knex } from 'knex';
import { can, type ApiToken, type CreatedApiToken, type User } from '@tallyfit/contracts';
import { insertWithAudit, recordAudit } from '../audit/audit.service';
import { API_TOKEN_PREFIX, hashToken, newToken } from '../identity/token-hash';
import { findUserById, type StoredUser } from '../identity/users.service';
import { isoDate, now } from '../http/db-time';
import { notFound } from '../http/http-error';

interface TokenRow {
  id: number;
  user_id: number;
  owner_name: string;
  name: string;
  hint: string;
  created_at: string | Date;
  last_used_at: string | Date | null;
  revoked_at: string | Date | null;
}

const toApiToken = (row: TokenRow): ApiToken => ({
  id: row.id,
  name: row.name,
  hint: row.hint,
  owner: { id: row.user_id, name: row.owner_name },
  createdAt: isoDate(row.created_at),
  lastUsedAt: isoDate(row.last_used_at),
  revokedAt: isoDate(row.revoked_at),
});

const selectTokens = (db: Knex) =>
  db('api_tokens').join('users', 'users.id', 'api_tokens.user_id').select('api_tokens.*', 'users.name as owner_name');

/** Creates a personal token; the secret is in the answer and nowhere else (only its hash is stored). */
export async function createApiToken(db: Knex, owner: User, name: string): Promise<CreatedApiToken> {
  const token = newToken(API_TOKEN_PREFIX);
  const hint = token.slice(0, 8);
  const id = await db.transaction((trx) =>
    insertWithAudit(trx, 'api_tokens', { user_id: owner.id, name, token_hash: hashToken(token), hint }, (tokenId) => ({
      actorId: owner.id,
      action: 'create',
      entityType: 'api-token',
      entityId: tokenId,
      summary: `created API token "${name}"`,
      after: { name, hint },
    })),
  );
  return { ...toApiToken(await selectTokens(db).where('api_tokens.id', id).first()), token };
}

/** A person's tokens, or everyone's (admins), newest first; never the secrets. */
export async function listApiTokens(db: Knex, ownerId: number | 'all'): Promise<ApiToken[]> {
  const rows: TokenRow[] = await selectTokens(db)
    .modify((builder) => {
      if (ownerId !== 'all') builder.where('api_tokens.user_id', ownerId);
    })
    .orderBy([
      { column: 'api_tokens.created_at', order: 'desc' },
      { column: 'api_tokens.id', order: 'desc' },
    ]);
  return rows.map(toApiToken);
}

/** Revokes a token of the caller's own, or anyone's for an admin; others' tokens are answered 404. */
export async function revokeApiToken(db: Knex, caller: User, id: number): Promise<ApiToken> {
  const row: TokenRow | undefined = await selectTokens(db).where('api_tokens.id', id).first();
  if (!row || (row.user_id !== caller.id && !can(caller.role, 'people.manage'))) throw notFound(`API token ${id} does not exist`);
  if (row.revoked_at === null) {
    await db.transaction(async (trx) => {
      await trx('api_tokens').where({ id }).update({ revoked_at: now(trx) });
      await recordAudit(trx, {
        actorId: caller.id,
        action: 'revoke',
        entityType: 'api-token',
        entityId: id,
        summary: `revoked API token "${row.name}" of ${row.owner_name}`,
        before: { revoked: false },
        after: { revoked: true },
      });
    });
  }
  return toApiToken(await selectTokens(db).where('api_tokens.id', id).first());
}

/** Used at most this often per token, so a busy pipeline does not write on every request. */
const LAST_USED_RESOLUTION_MS = 60_000;

/** The owner of a live token, or undefined for an unknown, revoked or disabled one. Notes the use. */
export async function ownerOfApiToken(db: Knex, token: string): Promise<StoredUser | undefined> {
  const row = await db('api_tokens').where({ token_hash: hashToken(token) }).whereNull('revoked_at').first('id', 'user_id', 'last_used_at');
  if (!row) return undefined;
  const user = await findUserById(db, row.user_id);
  if (!user || user.disabled) return undefined;
  const lastUsed = row.last_used_at === null ? 0 : new Date(isoDate(row.last_used_at)).getTime();
  if (Date.now() - lastUsed >= LAST_USED_RESOLUTION_MS) {
    await db('api_tokens').where({ id: row.id }).update({ last_used_at: now(db) });
  }
  return user;
}
