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
    expect(createStudy.description).toMatch(/^Capability `studies.create` \(.+\)\. Roles: admin, analyst\.$/);
    expect(doc.paths['/studies/{id}'].patch.description).toContain('study role owner');
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

  it('documents every route’s responses, the upload form and both ways of creating an analysis', async () => {
    const doc = (await request(ctx.app).get('/api/v1/openapi.json')).body;
    for (const [path, methods] of Object.entries(doc.paths as Record<string, Record<string, { responses: Record<string, unknown> }>>)) {
      for (const [method, operation] of Object.entries(methods)) {
        const successes = Object.keys(operation.responses).filter((status) => status.startsWith('2'));
        expect({ route: `${method} ${path}`, successes: successes.length > 0 }).toEqual({ route: `${method} ${path}`, successes: true });
      }
    }
    expect(doc.paths['/health'].get.responses['200'].content['application/json'].schema.properties.status).toBeDefined();
    const upload = doc.paths['/studies/{studyId}/datasets'].post.requestBody.content['multipart/form-data'].schema;
    expect(JSON.stringify(upload)).toContain('"format":"binary"');
    expect(JSON.stringify(upload)).toContain('labelColumn');
    const create = JSON.stringify(doc.paths['/analyses'].post.requestBody.content['application/json'].schema);
    expect(create).toContain('datasetId');
    expect(create).toContain('observed');
  });

  it('refuses ids that are not plain decimal digits instead of reading them as a number', async () => {
    const token = ctx.tokens.admin;
    for (const id of ['0x1', '%201', '1e0', '01', '-1']) {
      const response = await request(ctx.app).get(`/api/v1/studies/${id}`).set('Authorization', `Bearer ${token}`);
      expect({ id, status: response.status }).toEqual({ id, status: 400 });
    }
    const rename = await request(ctx.app).patch('/api/v1/studies/0x1').set('Authorization', `Bearer ${token}`).send({ name: 'renamed' });
    expect(rename.status).toBe(400);
    expect(rename.body.error.fields[0].path).toBe('id');
  });

  it('serves the browsable page and its files from this server only', async () => {
    const redirect = await request(ctx.app).get('/api/docs');
    expect(redirect.status).toBe(301);
    expect(redirect.headers['location']).toBe('/api/docs/');
    const page = await request(ctx.app).get('/api/docs/');
    expect(page.status).toBe(200);
    expect(page.text).toContain('<div id="swagger-ui"></div>');
    expect(page.text).not.toMatch(/src="https?:/);
    // Our own header and colours: the explorer's top bar (with its logo) hidden, the title ours.
    expect(page.text).toContain('<title>Tallyfit API</title>');
    expect(page.text).toContain('.swagger-ui .topbar { display: none; }');
    expect(page.text).toContain('Tallyfit · API for goodness-of-fit checks');
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
