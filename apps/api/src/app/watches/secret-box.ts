import { createCipheriv, createDecipheriv, randomBytes } from 'node:crypto';

/**
 * Credentials Tallyfit must read back (a connection's password, a webhook's signing secret) are
 * stored sealed with AES-256-GCM under the server's secret key (TALLYFIT_SECRET_KEY or the
 * generated data/secret-key): a fresh 12-byte nonce per value (NIST SP 800-38D, section 8.2.2),
 * and the 16-byte tag checked on opening, so a changed or foreign value is refused, not misread.
 * Stored as `v1.<nonce>.<tag>.<ciphertext>`, each part base64url.
 */
const VERSION = 'v1';

export function seal(key: Buffer, plaintext: string): string {
  const nonce = randomBytes(12);
  const cipher = createCipheriv('aes-256-gcm', key, nonce);
  const body = Buffer.concat([cipher.update(plaintext, 'utf8'), cipher.final()]);
  return [VERSION, nonce, cipher.getAuthTag(), body].map((part) => (typeof part === 'string' ? part : part.toString('base64url'))).join('.');
}

export class SealedValueError extends Error {}

export function open(key: Buffer, sealed: string): string {
  const [version, nonce, tag, body] = sealed.split('.');
  if (version !== VERSION || nonce === undefined || tag === undefined || body === undefined) {
    throw new SealedValueError('the stored credential is not in a form this server reads');
  }
  try {
    const decipher = createDecipheriv('aes-256-gcm', key, Buffer.from(nonce, 'base64url'));
    decipher.setAuthTag(Buffer.from(tag, 'base64url'));
    return Buffer.concat([decipher.update(Buffer.from(body, 'base64url')), decipher.final()]).toString('utf8');
  } catch {
    throw new SealedValueError('the stored credential cannot be opened with this server\'s secret key (was TALLYFIT_SECRET_KEY changed?)');
  }
}
