import request from 'supertest';
import { ROLES } from '@tallyfit/contracts';
import { createTestApp, type TestContext } from '../../testing/test-app';
import { API_PREFIX, type RouteDefinition } from './route-table';

/**
 * Deny by default, proven for every route and every role: each declared route is called as
 * anonymous and as each role; the answer must be 401/403 exactly where the route's rule says.
 * Every route Express has mounted under /api must appear in the route table with a rule.
 */
describe('who may call which route', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp()));
  afterAll(() => ctx.close());

  const concretePath = (route: RouteDefinition) => API_PREFIX + route.path.replace(/:(\w+)/g, '1');

  function call(route: RouteDefinition, token?: string) {
    const agent = request(ctx.app)[route.method](concretePath(route));
    if (token) agent.set('Authorization', `Bearer ${token}`);
    return route.method === 'get' || route.method === 'delete' ? agent : agent.send({});
  }

  it('mounts no API route outside the route table', () => {
    const declared = new Set(ctx.routes.map((route) => `${route.method.toUpperCase()} ${API_PREFIX}${route.path}`));
    const layers = (ctx.app as unknown as { router: { stack: Array<{ route?: { path: string; methods: Record<string, boolean> } }> } })
      .router.stack;
    const mounted = layers
      .filter((layer) => layer.route?.path.startsWith(API_PREFIX))
      .flatMap((layer) => Object.keys(layer.route!.methods).map((method) => `${method.toUpperCase()} ${layer.route!.path}`));
    expect(mounted.length).toBeGreaterThan(0);
    for (const route of mounted) expect(declared).toContain(route);
  });

  it('answers every route as its rule says, for anonymous and for every role', async () => {
    for (const route of ctx.routes) {
      const name = `${route.method.toUpperCase()} ${route.path}`;
      const anonymous = await call(route);
      if (route.access.kind === 'public') {
        expect({ name, status: anonymous.status === 401 ? 401 : 'not refused' }).toEqual({ name, status: 'not refused' });
        continue;
      }
      expect({ name, caller: 'anonymous', status: anonymous.status }).toEqual({ name, caller: 'anonymous', status: 401 });
      for (const role of ROLES) {
        const { status } = await call(route, ctx.tokens[role]);
        const expected = route.access.roles.includes(role) ? 'let through' : 403;
        const actual = status === 401 || status === 403 ? status : 'let through';
        expect({ name, caller: role, status: actual }).toEqual({ name, caller: role, status: expected });
      }
    }
  });

  it('answers 401 for a garbled token', async () => {
    const route = ctx.routes.find((candidate) => candidate.access.kind !== 'public')!;
    expect((await call(route, 'not-a-jwt')).status).toBe(401);
  });
});
