import jwt from 'jsonwebtoken';
import type { User } from '@tallyfit/contracts';

export interface AccessTokenClaims {
  sub: string;
  role: User['role'];
  /** When it was issued, in ms (the standard iat has whole seconds only, too coarse to tell a token from a sign-out in the same second). */
  issuedAtMs: number;
  /** Standard JWT issue time, in seconds. */
  iat?: number;
}

/** The moment a token was issued, in ms; tokens from before issuedAtMs existed fall back to iat. */
export const tokenIssuedAtMs = (claims: AccessTokenClaims): number => claims.issuedAtMs ?? (claims.iat ?? 0) * 1000;

export const JWT_ALGORITHM = 'HS256';

/** A short-lived bearer token naming the person and the role they had when they signed in. */
export function signAccessToken(user: User, secret: string, ttlSeconds: number, nowMs = Date.now()): string {
  const claims: AccessTokenClaims = { sub: String(user.id), role: user.role, issuedAtMs: nowMs };
  return jwt.sign(claims, secret, { algorithm: JWT_ALGORITHM, expiresIn: ttlSeconds, issuer: 'tallyfit' });
}
