import jwt from 'jsonwebtoken';
import type { User } from '@tallyfit/contracts';

export interface AccessTokenClaims {
  sub: string;
  role: User['role'];
}

export const JWT_ALGORITHM = 'HS256';

/** A short-lived bearer token naming the person and the role they had when they signed in. */
export function signAccessToken(user: User, secret: string, ttlSeconds: number): string {
  const claims: AccessTokenClaims = { sub: String(user.id), role: user.role };
  return jwt.sign(claims, secret, { algorithm: JWT_ALGORITHM, expiresIn: ttlSeconds, issuer: 'tallyfit' });
}
