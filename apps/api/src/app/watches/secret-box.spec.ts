import { randomBytes } from 'node:crypto';
import { open, seal, SealedValueError } from './secret-box';

describe('secret box', () => {
  const key = randomBytes(32);

  it('opens what it sealed, and seals the same text differently each time', () => {
    const first = seal(key, 'pässword');
    expect(open(key, first)).toBe('pässword');
    expect(seal(key, 'pässword')).not.toBe(first);
    expect(first).not.toContain('pässword');
  });

  it('refuses a value sealed under another key or changed after sealing', () => {
    const sealed = seal(key, 'secret');
    expect(() => open(randomBytes(32), sealed)).toThrow(SealedValueError);
    const parts = sealed.split('.');
    parts[3] = Buffer.from('public').toString('base64url');
    expect(() => open(key, parts.join('.'))).toThrow(SealedValueError);
    expect(() => open(key, 'plain text')).toThrow(SealedValueError);
  });
});
