import { spawn, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createInterface } from 'node:readline';
import type { Knex } from 'knex';
import { openDatabase, migrateToLatest } from '../database';
import { createUser } from '../identity/users.service';
import { createTestDatabaseUrl } from '../../testing/test-database';

const root = join(__dirname, '../../../../..');
const PASSWORD = 'marble tundra whistle forty';

interface RunningServer {
  url: string;
  child: ChildProcess;
  dataDir: string;
}

/** One server process on the shared database, with a data folder of its own. */
async function startServer(databaseUrl: string): Promise<RunningServer> {
  const dataDir = mkdtempSync(join(tmpdir(), 'tallyfit-two-servers-'));
  const child = spawn(process.execPath, [require.resolve('tsx/cli'), '--tsconfig', join(root, 'tsconfig.base.json'), join(root, 'apps/api/src/testing/serve-for-test.ts')], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: databaseUrl, JWT_SECRET: 'shared by both servers', TALLYFIT_DATA_DIR: dataDir, LOGIN_ATTEMPTS_PER_15_MINUTES: '3', SMTP_URL: '' },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const url = await new Promise<string>((resolve, reject) => {
    child.once('exit', (code) => reject(new Error(`the test server stopped (exit ${code})`)));
    createInterface({ input: child.stdout! }).on('line', (line) => {
      const match = /^listening at (\S+)$/.exec(line);
      if (match) resolve(match[1]);
    });
  });
  return { url, child, dataDir };
}

async function stopServer(server: RunningServer): Promise<void> {
  if (server.child.exitCode === null) {
    server.child.kill('SIGTERM');
    await once(server.child, 'exit');
  }
  rmSync(server.dataDir, { recursive: true, force: true });
}

const call = (server: RunningServer, method: string, path: string, body?: object, token?: string) =>
  fetch(`${server.url}/api/v1${path}`, {
    method,
    headers: { 'content-type': 'application/json', ...(token ? { authorization: `Bearer ${token}` } : {}) },
    body: body ? JSON.stringify(body) : undefined,
  });

const onPostgres = process.env['TALLYFIT_TEST_POSTGRES_URL'] ? describe : describe.skip;

onPostgres('two server processes on one PostgreSQL database', () => {
  let database: Awaited<ReturnType<typeof createTestDatabaseUrl>>;
  let db: Knex;
  let first: RunningServer;
  let second: RunningServer;
  beforeAll(async () => {
    database = await createTestDatabaseUrl();
    db = openDatabase({ databaseUrl: database.url, dataDir: tmpdir() });
    await migrateToLatest(db);
    for (const name of ['guessed', 'traveller']) await createUser(db, { email: `${name}@test.local`, name, role: 'analyst', password: PASSWORD });
    [first, second] = await Promise.all([startServer(database.url!), startServer(database.url!)]);
  }, 120_000);
  afterAll(async () => {
    await Promise.all([first, second].filter(Boolean).map(stopServer));
    await db.destroy();
    await database.drop();
  });

  it('share one sign-in limit: failures on either count on both', async () => {
    const wrong = { email: 'guessed@test.local', password: 'not the password' };
    expect((await call(first, 'POST', '/auth/login', wrong)).status).toBe(401);
    expect((await call(second, 'POST', '/auth/login', wrong)).status).toBe(401);
    expect((await call(first, 'POST', '/auth/login', wrong)).status).toBe(401);
    const right = { email: 'guessed@test.local', password: PASSWORD };
    expect((await call(second, 'POST', '/auth/login', right)).status).toBe(429);
    expect((await call(first, 'POST', '/auth/login', right)).status).toBe(429);
  });

  it('both refuse a session signed out on one of them', async () => {
    const session = (await (await call(first, 'POST', '/auth/login', { email: 'traveller@test.local', password: PASSWORD })).json()) as {
      accessToken: string;
      refreshToken: string;
    };
    expect((await call(first, 'GET', '/auth/me', undefined, session.accessToken)).status).toBe(200);
    expect((await call(second, 'GET', '/auth/me', undefined, session.accessToken)).status).toBe(200);
    expect((await call(second, 'POST', '/auth/logout', { refreshToken: session.refreshToken })).status).toBe(204);
    expect((await call(first, 'GET', '/auth/me', undefined, session.accessToken)).status).toBe(401);
    expect((await call(second, 'GET', '/auth/me', undefined, session.accessToken)).status).toBe(401);
    expect((await call(first, 'POST', '/auth/refresh', { refreshToken: session.refreshToken })).status).toBe(401);
  });
});
