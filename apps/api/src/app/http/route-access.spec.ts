import request from 'supertest';
import { can, CAPABILITY_NAMES, ROLES, type Role } from '@tallyfit/contracts';
import { createTestApp, type TestContext } from '../../testing/test-app';
import { fullPath, type RouteDefinition } from './route-table';

/**
 * Deny by default, proven for every route and every role: each declared route is called as
 * anonymous, with a revoked API token, and as each role both through a sign-in token and
 * through a personal API token; the answer must be 401/403 exactly where `can()` — the function
 * the console uses to offer actions — says so for the route's capability. Every route Express
 * has mounted under /api must appear in the route table with a rule, and every capability in the
 * table guards at least one route, so the console never offers what no route enforces.
 */
describe('who may call which route', () => {
  let ctx: TestContext;
  const apiTokens = {} as Record<Role, string>;
  let revokedToken: string;

  beforeAll(async () => {
    ctx = await createTestApp();
    // Routes are called with id 1; token 1 is a spare, so revoking it leaves the matrix tokens working.
    await ctx.as('viewer').post('/tokens', { name: 'spare' }).expect(201);
    for (const role of ROLES) apiTokens[role] = (await ctx.as(role).post('/tokens', { name: `matrix ${role}` })).body.token;
    const revoked = (await ctx.as('admin').post('/tokens', { name: 'revoked' })).body;
    await ctx.as('admin').delete(`/tokens/${revoked.id}`).expect(200);
    revokedToken = revoked.token;
  });
  afterAll(() => ctx.close());

  const concretePath = (route: RouteDefinition) => fullPath(route).replace(/:(\w+)/g, '1');

  function call(route: RouteDefinition, token?: string) {
    const agent = request(ctx.app)[route.method](concretePath(route));
    if (token) agent.set('Authorization', `Bearer ${token}`);
    return route.method === 'get' || route.method === 'delete' ? agent : agent.send({});
  }

  it('mounts no API route outside the route table', () => {
    const declared = new Set(ctx.routes.map((route) => `${route.method.toUpperCase()} ${fullPath(route)}`));
    const layers = (ctx.app as unknown as { router: { stack: Array<{ route?: { path: string; methods: Record<string, boolean> } }> } })
      .router.stack;
    const mounted = layers
      .filter((layer) => layer.route?.path.startsWith('/api'))
      .flatMap((layer) => Object.keys(layer.route!.methods).map((method) => `${method.toUpperCase()} ${layer.route!.path}`));
    expect(mounted.length).toBeGreaterThan(0);
    for (const route of mounted) expect(declared).toContain(route);
  });

  it('guards some route with every capability of the table', () => {
    const used = new Set(ctx.routes.map((route) => route.access));
    expect(CAPABILITY_NAMES.filter((capability) => !used.has(capability))).toEqual([]);
  });

  it('answers every route as its rule says, for anonymous, a revoked token and every role', async () => {
    const outcome = (status: number) => (status === 401 || status === 403 ? status : 'let through');
    for (const route of ctx.routes) {
      const name = `${route.method.toUpperCase()} ${fullPath(route)}`;
      const anonymous = await call(route);
      if (route.access === 'public') {
        expect({ name, status: anonymous.status === 401 ? 401 : 'not refused' }).toEqual({ name, status: 'not refused' });
        continue;
      }
      expect({ name, caller: 'anonymous', status: anonymous.status }).toEqual({ name, caller: 'anonymous', status: 401 });
      const revoked = await call(route, revokedToken);
      expect({ name, caller: 'revoked API token', status: revoked.status }).toEqual({ name, caller: 'revoked API token', status: 401 });
      for (const role of ROLES) {
        const expected = can(role, route.access) ? 'let through' : 403;
        const signedIn = outcome((await call(route, ctx.tokens[role])).status);
        expect({ name, caller: role, status: signedIn }).toEqual({ name, caller: role, status: expected });
        const viaToken = outcome((await call(route, apiTokens[role])).status);
        expect({ name, caller: `${role} API token`, status: viaToken }).toEqual({ name, caller: `${role} API token`, status: expected });
      }
    }
    // Ten calls per route; a generous limit because the machine is shared, not a speed target.
  }, 120_000);

  it('answers 401 for a garbled token', async () => {
    const route = ctx.routes.find((candidate) => candidate.access !== 'public')!;
    expect((await call(route, 'not-a-jwt')).status).toBe(401);
  });
});
