import request from 'supertest';
import { createTestApp, type TestContext } from '../../testing/test-app';
import { API_PREFIX } from '../http/route-table';

describe('OpenAPI document and docs page', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp()));
  afterAll(() => ctx.close());

  it('describes every /api/v1 route of the route table, with its access rule and schemas', async () => {
    const response = await request(ctx.app).get('/api/v1/openapi.json');
    expect(response.status).toBe(200);
    const doc = response.body;
    expect(doc.openapi).toBe('3.0.3');
    const documented = Object.entries(doc.paths as Record<string, Record<string, unknown>>).flatMap(([path, methods]) =>
      Object.keys(methods).map((method) => `${method} ${path}`),
    );
    const expected = ctx.routes
      .filter((route) => (route.basePath ?? API_PREFIX) === API_PREFIX)
      .map((route) => `${route.method} ${route.path.replace(/:(\w+)/g, '{$1}')}`);
    expect(documented.sort()).toEqual(expected.sort());

    const createStudy = doc.paths['/studies'].post;
    expect(createStudy.description).toBe('Roles: admin, analyst.');
    expect(createStudy.security).toEqual([{ bearer: [] }]);
    expect(createStudy.requestBody.content['application/json'].schema.properties.name.type).toBe('string');
    expect(createStudy.responses['201'].content['application/json'].schema.properties.members.type).toBe('array');
    expect(createStudy.responses['400'].content['application/json'].schema.$ref).toBe('#/components/schemas/Error');
    const history = doc.paths['/analyses'].get;
    expect(history.parameters.map((p: { name: string }) => p.name)).toEqual(
      expect.arrayContaining(['page', 'pageSize', 'sort', 'studyId', 'author', 'significant', 'q']),
    );
    expect(doc.paths['/auth/login'].post.security).toEqual([]);
    expect(doc.paths['/auth/login'].post.responses['429']).toBeDefined();
    expect(doc.paths['/analyses/{id}'].get.parameters[0]).toMatchObject({ name: 'id', in: 'path', required: true });
  });

  it('serves the browsable page and its files from this server only', async () => {
    const redirect = await request(ctx.app).get('/api/docs');
    expect(redirect.status).toBe(301);
    expect(redirect.headers['location']).toBe('/api/docs/');
    const page = await request(ctx.app).get('/api/docs/');
    expect(page.status).toBe(200);
    expect(page.text).toContain('<div id="swagger-ui"></div>');
    expect(page.text).not.toMatch(/src="https?:/);
    const csp = String(page.headers['content-security-policy']);
    expect(csp).toContain("script-src 'self'");

    const script = await request(ctx.app).get('/api/docs/swagger-ui-bundle.js');
    expect(script.status).toBe(200);
    expect(script.headers['content-type']).toMatch(/javascript/);
    const init = await request(ctx.app).get('/api/docs/swagger-ui-init.js');
    expect(init.text).toContain('/api/v1/openapi.json');
    expect((await request(ctx.app).get('/api/docs/swagger-ui.css')).status).toBe(200);
    const missing = await request(ctx.app).get('/api/docs/package.json');
    expect(missing.status).toBe(404);
    expect(missing.body.error.code).toBe('not_found');
  });
});
