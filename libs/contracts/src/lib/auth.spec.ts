import { apiErrorSchema } from './api-error';
import { loginRequestSchema } from './auth';
import { ROLES, roleSchema } from './roles';

describe('shared schemas', () => {
  it('knows the four roles of the design, most powerful first', () => {
    expect(ROLES).toEqual(['admin', 'lead', 'analyst', 'viewer']);
    expect(roleSchema.safeParse('owner').success).toBe(false);
  });

  it('names each bad sign-in field', () => {
    const parsed = loginRequestSchema.safeParse({ email: 'not an address', password: '' });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues.map((issue) => [issue.path.join('.'), issue.message])).toEqual([
      ['email', 'email must be an e-mail address'],
      ['password', 'password is required'],
    ]);
  });

  it('accepts a well-formed sign-in', () => {
    expect(loginRequestSchema.parse({ email: 'ana@example.org', password: 'x' })).toEqual({ email: 'ana@example.org', password: 'x' });
  });

  it('describes the one error shape of the API', () => {
    expect(apiErrorSchema.safeParse({ error: { code: 'not_found', message: 'no such analysis' } }).success).toBe(true);
    expect(apiErrorSchema.safeParse({ message: 'bare' }).success).toBe(false);
  });
});
