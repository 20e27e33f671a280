import bcrypt from 'bcryptjs';
import pino from 'pino';
import request from 'supertest';
import { createApp } from '../create-app';
import { inProcessEngine } from '../engine/engine-runner';
import { hashPassword, verifyPasswordOf } from '../identity/password';
import { createTestApp, TEST_PASSWORD, type TestContext } from '../../testing/test-app';

describe('the sign-in limit', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp({ env: { LOGIN_ATTEMPTS_PER_15_MINUTES: '3' } })));
  afterAll(() => ctx.close());

  const login = (app: TestContext['app'], email: string, password: string, forwardedFor?: string) => {
    const call = request(app).post('/api/v1/auth/login');
    if (forwardedFor) call.set('X-Forwarded-For', forwardedFor);
    return call.send({ email, password });
  };

  it('is not bypassed by a new X-Forwarded-For on each try (no proxy is trusted unless TRUST_PROXY says so)', async () => {
    expect(ctx.app.get('trust proxy')).toBe(false);
    for (let i = 1; i <= 3; i++) expect((await login(ctx.app, 'viewer@test.local', 'wrong guess', `203.0.113.${i}`)).status).toBe(401);
    const blocked = await login(ctx.app, 'viewer@test.local', TEST_PASSWORD, '203.0.113.99');
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('too_many_attempts');
    expect(blocked.headers['retry-after']).toBe('900');
  });

  it('is shared by two servers on one database: failures on one count on the other', async () => {
    // A second app on the same database stands for a second server process.
    const second = createApp({ config: ctx.config, db: ctx.db, engine: inProcessEngine(), mail: ctx.mail, logger: pino({ level: 'silent' }) }).app;
    expect((await login(ctx.app, 'lead@test.local', 'wrong guess')).status).toBe(401);
    expect((await login(second, 'lead@test.local', 'wrong guess')).status).toBe(401);
    expect((await login(ctx.app, 'lead@test.local', 'wrong guess')).status).toBe(401);
    expect((await login(second, 'lead@test.local', TEST_PASSWORD)).status).toBe(429);
  });

  it('does not count successful sign-ins', async () => {
    for (let i = 0; i < 5; i++) expect((await login(ctx.app, 'analyst@test.local', TEST_PASSWORD)).status).toBe(200);
  });

  it('believes X-Forwarded-For from the proxies TRUST_PROXY names', async () => {
    const behindProxy = await createTestApp({ env: { TRUST_PROXY: 'loopback' } });
    try {
      expect(behindProxy.app.get('trust proxy')).toBe('loopback');
      await login(behindProxy.app, 'nobody@test.local', 'wrong guess', '198.51.100.7');
      const [attempt] = await behindProxy.db('sign_in_attempts').select('address');
      expect(attempt.address).toBe('198.51.100.7');
    } finally {
      await behindProxy.close();
    }
  });
});

describe('signing in with an unknown e-mail', () => {
  it('spends a bcrypt comparison at the real cost, as a wrong password for a real account does, and says no', async () => {
    const compare = jest.spyOn(bcrypt, 'compare');
    try {
      expect(await verifyPasswordOf(undefined, TEST_PASSWORD)).toBe(false);
      expect(compare).toHaveBeenCalledTimes(1);
      const hashUsed = compare.mock.calls[0][1] as string;
      expect(bcrypt.getRounds(hashUsed)).toBe(bcrypt.getRounds(await hashPassword('any password at all')));
    } finally {
      compare.mockRestore();
    }
  });
});
