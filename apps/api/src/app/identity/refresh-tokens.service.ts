import type { Knex } from 'knex';
import { recordAudit } from '../audit/audit.service';
import { insertedId, now } from '../http/db-time';
import { unauthorized } from '../http/http-error';
import { hashToken, newToken, REFRESH_TOKEN_PREFIX } from './token-hash';
import { endAccessTokensIssuedSoFar, findUserById, type StoredUser } from './users.service';

const expiry = (ttlSeconds: number) => new Date(Date.now() + ttlSeconds * 1000);
const expired = (value: string | Date | number) => new Date(typeof value === 'string' && !value.includes('T') ? value.replace(' ', 'T') + 'Z' : value).getTime() <= Date.now();

/** Stores a new refresh token (hashed) and returns it in clear, once. */
export async function issueRefreshToken(db: Knex, userId: number, ttlSeconds: number): Promise<{ token: string; id: number }> {
  const token = newToken(REFRESH_TOKEN_PREFIX);
  const [row] = await db('refresh_tokens')
    .insert({ user_id: userId, token_hash: hashToken(token), expires_at: expiry(ttlSeconds).toISOString() })
    .returning('id');
  return { token, id: insertedId(row) };
}

/**
 * Exchanges a refresh token for a new one: the old one is revoked and points to its successor.
 * A token used twice means a copy leaked, so every refresh token of that person is revoked.
 */
export async function rotateRefreshToken(db: Knex, token: string, ttlSeconds: number): Promise<{ user: StoredUser; token: string }> {
  const refused = () => unauthorized('the refresh token is not valid; sign in again');
  return db.transaction(async (trx) => {
    const row = await trx('refresh_tokens').where({ token_hash: hashToken(token) }).first();
    if (!row) throw refused();
    if (row.revoked_at !== null) {
      await revokeAllRefreshTokens(trx, row.user_id);
      await recordAudit(trx, {
        actorId: row.user_id,
        action: 'revoke',
        entityType: 'refresh-token',
        entityId: row.id,
        summary: 'a used refresh token was presented again; every session of this person was signed out',
      });
      return { reused: true as const };
    }
    const user = await findUserById(trx, row.user_id);
    if (expired(row.expires_at) || !user || user.disabled) throw refused();
    const next = await issueRefreshToken(trx, user.id, ttlSeconds);
    await trx('refresh_tokens').where({ id: row.id }).update({ revoked_at: now(trx), replaced_by: next.id });
    return { reused: false as const, user, token: next.token };
  }).then((outcome) => {
    // The revocation above must be committed, so the refusal is thrown after the transaction.
    if (outcome.reused) throw refused();
    return { user: outcome.user, token: outcome.token };
  });
}

/**
 * Signs out: revokes this refresh token and ends every access token the person holds (the
 * timestamp is per person, not per session, so other sessions renew theirs once with their own
 * refresh tokens). Unknown or already revoked tokens are ignored.
 */
export async function revokeRefreshToken(db: Knex, token: string): Promise<number | undefined> {
  const row = await db('refresh_tokens').where({ token_hash: hashToken(token) }).whereNull('revoked_at').first('id', 'user_id');
  if (!row) return undefined;
  await db.transaction(async (trx) => {
    await trx('refresh_tokens').where({ id: row.id }).update({ revoked_at: now(trx) });
    await endAccessTokensIssuedSoFar(trx, row.user_id);
  });
  return row.user_id;
}

/** Signs a person out everywhere (password change, account disabled): refresh and access tokens. */
export async function revokeAllRefreshTokens(db: Knex, userId: number): Promise<void> {
  await db('refresh_tokens').where({ user_id: userId }).whereNull('revoked_at').update({ revoked_at: now(db) });
  await endAccessTokensIssuedSoFar(db, userId);
}
