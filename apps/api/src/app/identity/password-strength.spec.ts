import { createTestApp, TEST_PASSWORD, type TestContext } from '../../testing/test-app';

describe('password strength', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp()));
  afterAll(() => ctx.close());

  // Repeats, a common password with the usual decorations, and one's own e-mail: each at least 10 characters.
  it.each(['aaaaaaaaaa', 'Password123!', 'lead@test.local'])('refuses "%s" as a new password, saying why', async (weak) => {
    const response = await ctx.as('lead').post('/auth/password', { currentPassword: TEST_PASSWORD, newPassword: weak });
    expect(response.status).toBe(422);
    expect(response.body.error.message).toMatch(/^the password is too easy to guess\. /);
    expect(response.body.error.fields).toEqual([{ path: 'newPassword', message: expect.stringMatching(/^too easy to guess\. \S/) }]);
  });

  it('refuses a weak password when an admin adds a person, and accepts a passphrase', async () => {
    const person = { email: 'nora@test.local', name: 'Nora North', role: 'viewer' };
    const weak = await ctx.as('admin').post('/people', { ...person, password: 'nora@test.local' });
    expect(weak.status).toBe(422);
    expect(weak.body.error.fields).toEqual([{ path: 'password', message: expect.stringMatching(/^too easy to guess/) }]);
    expect(await ctx.db('users').where({ email: 'nora@test.local' }).first()).toBeUndefined();
    expect((await ctx.as('admin').post('/people', { ...person, password: 'lantern gravel quietly seven' })).status).toBe(201);
  });
});
