import request from 'supertest';
import { createTestApp, TEST_PASSWORD, type TestContext } from '../../testing/test-app';

/** Sign-out and password change end access tokens at once, not when they expire. */
describe('ending sessions', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp()));
  afterAll(() => ctx.close());

  const login = async (email: string, password = TEST_PASSWORD) => {
    const response = await request(ctx.app).post('/api/v1/auth/login').send({ email, password });
    expect(response.status).toBe(200);
    return response.body as { accessToken: string; refreshToken: string };
  };
  const me = (accessToken: string) => ctx.as(accessToken).get('/auth/me');

  it('refuses an access token after its session signed out; another session renews once with its refresh token', async () => {
    const laptop = await login('viewer@test.local');
    const phone = await login('viewer@test.local');
    expect((await me(laptop.accessToken)).status).toBe(200);
    expect((await request(ctx.app).post('/api/v1/auth/logout').send({ refreshToken: laptop.refreshToken })).status).toBe(204);

    expect((await me(laptop.accessToken)).status).toBe(401);
    // The phone's access token ended too (the time is per person); its refresh token still works.
    expect((await me(phone.accessToken)).status).toBe(401);
    const renewed = await request(ctx.app).post('/api/v1/auth/refresh').send({ refreshToken: phone.refreshToken });
    expect(renewed.status).toBe(200);
    expect((await me(renewed.body.accessToken)).status).toBe(200);
  });

  it('refuses other sessions’ access tokens after a password change; API tokens keep working', async () => {
    const other = await login('analyst@test.local');
    const here = await login('analyst@test.local');
    const apiToken = (await ctx.as(here.accessToken).post('/tokens', { name: 'nightly pipeline' })).body.token as string;
    const newPassword = 'plum kettle orbit sixty';
    const changed = await ctx.as(here.accessToken).post('/auth/password', { currentPassword: TEST_PASSWORD, newPassword });
    expect(changed.status).toBe(204);

    expect((await me(other.accessToken)).status).toBe(401);
    expect((await me(here.accessToken)).status).toBe(401);
    expect((await request(ctx.app).post('/api/v1/auth/refresh').send({ refreshToken: other.refreshToken })).status).toBe(401);
    // Decided: personal API tokens are not sessions; they stay valid until revoked (README, "Sessions and tokens").
    expect((await me(apiToken)).status).toBe(200);
    expect((await me((await login('analyst@test.local', newPassword)).accessToken)).status).toBe(200);
  });
});
