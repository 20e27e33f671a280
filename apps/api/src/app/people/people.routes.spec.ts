import request from 'supertest';
import { createTestApp, rowCounts, type TestContext } from '../../testing/test-app';
import { refuseAuditWrites } from '../../testing/refuse-audit-writes';

describe('people (admins)', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp()));
  afterAll(() => ctx.close());

  const newPerson = { email: 'New.Person@Test.local', name: 'New person', role: 'analyst', password: 'a long first password' };

  it('adds a person who can then sign in; the e-mail is stored in lower case', async () => {
    const created = await ctx.as('admin').post('/people', newPerson);
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ email: 'new.person@test.local', name: 'New person', role: 'analyst', disabled: false });
    expect(created.body).not.toHaveProperty('passwordHash');
    const login = await request(ctx.app).post('/api/v1/auth/login').send({ email: 'new.person@test.local', password: newPerson.password });
    expect(login.status).toBe(200);
    const audit = await ctx.db('audit_events').where({ entity_type: 'user', entity_id: String(created.body.id), action: 'create' }).first();
    expect(JSON.parse(audit.after_json)).toEqual({ email: 'new.person@test.local', name: 'New person', role: 'analyst', disabled: false });
    expect(audit.after_json).not.toContain(newPerson.password);
  });

  it('answers 409 for an e-mail already in use, whatever its case', async () => {
    const response = await ctx.as('admin').post('/people', { ...newPerson, email: 'ANALYST@test.local' });
    expect(response.status).toBe(409);
    expect(response.body.error).toEqual({ code: 'conflict', message: 'someone already signs in with analyst@test.local' });
  });

  it('names each bad field with a 400', async () => {
    const response = await ctx.as('admin').post('/people', { email: 'nope', name: '', role: 'boss', password: 'short' });
    expect(response.status).toBe(400);
    expect(response.body.error.fields.map((f: { path: string }) => f.path).sort()).toEqual(['email', 'name', 'password', 'role']);
  });

  it('changes roles (audited as a role change), disables and re-enables', async () => {
    const person = (await ctx.as('admin').post('/people', { ...newPerson, email: 'promote@test.local' })).body;
    const promoted = await ctx.as('admin').patch(`/people/${person.id}`, { role: 'lead' });
    expect(promoted.body.role).toBe('lead');
    const event = await ctx.db('audit_events').where({ entity_type: 'user', entity_id: String(person.id), action: 'role-change' }).first();
    expect(event.summary).toBe("changed New person's role from analyst to lead");
    expect(JSON.parse(event.before_json).role).toBe('analyst');

    const session = (await request(ctx.app).post('/api/v1/auth/login').send({ email: 'promote@test.local', password: newPerson.password })).body;
    expect((await ctx.as(session.accessToken).get('/auth/me')).body.role).toBe('lead');
    await ctx.as('admin').patch(`/people/${person.id}`, { disabled: true }).expect(200);
    expect((await ctx.as(session.accessToken).get('/auth/me')).status).toBe(401);
    expect((await request(ctx.app).post('/api/v1/auth/refresh').send({ refreshToken: session.refreshToken })).status).toBe(401);
    expect((await ctx.as('admin').get(`/people/${person.id}`)).body.disabled).toBe(true);
    expect((await ctx.as('analyst').get('/people/directory')).body.map((p: { id: number }) => p.id)).not.toContain(person.id);
  });

  it('keeps at least one active admin (409) and answers 404 for an unknown person', async () => {
    const demote = await ctx.as('admin').patch(`/people/${ctx.userIds.admin}`, { role: 'viewer' });
    expect(demote.status).toBe(409);
    expect(demote.body.error.message).toBe('this is the only active admin; make someone else admin first');
    expect((await ctx.as('admin').patch('/people/999999', { name: 'Nobody' })).status).toBe(404);
    expect((await ctx.as('admin').get('/people/999999')).status).toBe(404);
  });

  it('lists everyone for admins only; the directory is for everyone', async () => {
    expect((await ctx.as('lead').get('/people')).status).toBe(403);
    const everyone = await ctx.as('admin').get('/people');
    expect(everyone.body.map((p: { email: string }) => p.email)).toContain('viewer@test.local');
    const directory = await ctx.as('viewer').get('/people/directory');
    expect(Object.keys(directory.body[0]).sort()).toEqual(['email', 'id', 'name', 'role']);
  });

  it('stores no person when the audit write fails', async () => {
    const before = await rowCounts(ctx.db, ['users', 'audit_events']);
    const allowAuditWrites = await refuseAuditWrites(ctx.db, "new.entity_type = 'user'");
    try {
      expect((await ctx.as('admin').post('/people', { ...newPerson, email: 'half@test.local' })).status).toBe(500);
    } finally {
      await allowAuditWrites();
    }
    expect(await rowCounts(ctx.db, ['users', 'audit_events'])).toEqual(before);
  });
});
