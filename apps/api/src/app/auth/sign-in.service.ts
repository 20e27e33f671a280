import type { Knex } from 'knex';
import type { LoginResponse } from '@tallyfit/contracts';
import { recordAudit } from '../audit/audit.service';
import type { Config } from '../config';
import { unauthorized } from '../http/http-error';
import { verifyPasswordOf } from '../identity/password';
import { issueRefreshToken, revokeRefreshToken, rotateRefreshToken } from '../identity/refresh-tokens.service';
import { findUserByEmail, publicUser, type StoredUser } from '../identity/users.service';
import { signAccessToken } from './access-token';

export type SessionConfig = Pick<Config, 'jwtSecret' | 'accessTokenTtlSeconds' | 'refreshTokenTtlSeconds'>;

function sessionTokens(config: SessionConfig, user: StoredUser, refreshToken: string): LoginResponse {
  return {
    accessToken: signAccessToken(user, config.jwtSecret, config.accessTokenTtlSeconds),
    expiresIn: config.accessTokenTtlSeconds,
    refreshToken,
    user: publicUser(user),
  };
}

/**
 * Signs a person in: checks the password, then issues a refresh token and records the sign-in in
 * one transaction. Every failure gets one message, so the answer does not reveal which e-mails exist.
 */
export async function signIn(db: Knex, config: SessionConfig, email: string, password: string): Promise<LoginResponse> {
  const user = await findUserByEmail(db, email);
  const passwordOk = await verifyPasswordOf(user, password);
  if (!user || !passwordOk || user.disabled) {
    await recordAudit(db, {
      actorId: user?.id ?? null,
      action: 'sign-in-failed',
      entityType: 'user',
      entityId: user?.id ?? null,
      summary: `failed sign-in for ${email.toLowerCase()}`,
    });
    throw unauthorized('e-mail or password is wrong');
  }
  return db.transaction(async (trx) => {
    const refresh = await issueRefreshToken(trx, user.id, config.refreshTokenTtlSeconds);
    await recordAudit(trx, { actorId: user.id, action: 'sign-in', entityType: 'user', entityId: user.id, summary: `${user.name} signed in` });
    return sessionTokens(config, user, refresh.token);
  });
}

/** Exchanges a refresh token for a new session (the old token stops working). */
export async function renewSession(db: Knex, config: SessionConfig, refreshToken: string): Promise<LoginResponse> {
  const rotated = await rotateRefreshToken(db, refreshToken, config.refreshTokenTtlSeconds);
  return sessionTokens(config, rotated.user, rotated.token);
}

/** Ends a session: its refresh token stops working, and the sign-out is recorded. */
export async function signOut(db: Knex, refreshToken: string): Promise<void> {
  await db.transaction(async (trx) => {
    const userId = await revokeRefreshToken(trx, refreshToken);
    if (userId !== undefined) {
      await recordAudit(trx, { actorId: userId, action: 'sign-out', entityType: 'user', entityId: userId, summary: 'signed out' });
    }
  });
}
