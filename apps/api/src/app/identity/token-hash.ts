import { createHash, randomBytes } from 'node:crypto';

/**
 * Opaque tokens (API tokens, refresh tokens) carry 256 random bits, so a plain SHA-256 is enough
 * to store them: unlike a password, nobody can guess one to test against the hash.
 */
export const hashToken = (token: string): string => createHash('sha256').update(token).digest('hex');

export const newToken = (prefix: string): string => prefix + randomBytes(32).toString('base64url');

export const API_TOKEN_PREFIX = 'tf_';
export const REFRESH_TOKEN_PREFIX = 'tfr_';
