import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Knex } from 'knex';
import pino from 'pino';
import request from 'supertest';
import type { Role } from '@tallyfit/contracts';
import { loadConfig, type Config } from '../app/config';
import { createApp, type AppContext, type TallyfitApp } from '../app/create-app';
import { migrateToLatest, openDatabase } from '../app/database';
import { createUser } from '../app/identity/users.service';
import { inProcessEngine, type EngineRunner } from '../app/engine/engine-runner';
import { createTestDatabaseUrl } from './test-database';
import { startMailService, type MailService } from '../app/mail/mail-service';

export const TEST_PASSWORD = 'correct horse battery staple';

export interface TestContext extends TallyfitApp {
  config: Config;
  db: Knex;
  /** A bearer token per role, for a person created for this suite. */
  tokens: Record<Role, string>;
  /** Mail delivery: the local SMTP stand-in unless SMTP_URL was given in `env`. */
  mail: MailService;
  /** The id of the person behind each role's token. */
  userIds: Record<Role, number>;
  /** supertest calls signed in as a role (or with any bearer token). */
  as(roleOrToken: Role | string): CallAs;
  close(): Promise<void>;
}

export interface CallAs {
  get(path: string): request.Test;
  post(path: string, body?: object): request.Test;
  patch(path: string, body?: object): request.Test;
  put(path: string, body?: object): request.Test;
  delete(path: string): request.Test;
}

const withBody = (test: request.Test, body?: object) => (body === undefined ? test : test.send(body));

/** Counts the rows of each table, to prove a failed write left nothing behind. */
export async function rowCounts(db: Knex, tables: string[]): Promise<Record<string, number>> {
  const counts: Record<string, number> = {};
  for (const table of tables) {
    const [{ count }] = await db(table).count({ count: '*' });
    counts[table] = Number(count);
  }
  return counts;
}

export interface TestAppOptions {
  /** Extra environment for loadConfig (e.g. a low LOGIN_ATTEMPTS_PER_15_MINUTES). */
  env?: Record<string, string>;
  /**
   * The engine runner. Default: in-process, chosen explicitly here because ts-jest cannot load the
   * TypeScript worker file in a piscina thread; the pool itself is tested against the built worker
   * in engine-pool.spec.ts.
   */
  engine?: EngineRunner;
  /** Shorter waits for alert retries and schedule re-reads. */
  watchOptions?: AppContext['watchOptions'];
}

/** A fresh app on a fresh, migrated database in its own temporary folder, with one person per role. */
export async function createTestApp(options: TestAppOptions = {}): Promise<TestContext> {
  const dataDir = mkdtempSync(join(tmpdir(), 'tallyfit-api-test-'));
  const database = await createTestDatabaseUrl();
  const config = loadConfig({
    ...(database.url ? { DATABASE_URL: database.url } : {}),
    TALLYFIT_DATA_DIR: dataDir,
    JWT_SECRET: 'test-secret',
    TALLYFIT_CONSOLE_DIR: join(dataDir, 'none'),
    TALLYFIT_FONTS_DIR: join(__dirname, '../../../../fonts'),
    ...options.env,
  });
  const db = openDatabase(config);
  await migrateToLatest(db);
  const engine = options.engine ?? inProcessEngine();
  const mail = await startMailService({ smtpUrl: config.smtpUrl, from: config.mailFrom, timeoutMs: 5000 });
  const app = createApp({ config, db, engine, mail, logger: pino({ level: 'silent' }), watchOptions: options.watchOptions });
  const roles: Role[] = ['admin', 'lead', 'analyst', 'viewer'];
  const tokens = {} as Record<Role, string>;
  const userIds = {} as Record<Role, number>;
  for (const role of roles) {
    const email = `${role}@test.local`;
    userIds[role] = (await createUser(db, { email, name: `Test ${role}`, role, password: TEST_PASSWORD })).id;
    const response = await request(app.app).post('/api/v1/auth/login').send({ email, password: TEST_PASSWORD });
    tokens[role] = response.body.accessToken;
  }
  return {
    ...app,
    config,
    db,
    tokens,
    mail,
    userIds,
    as: (roleOrToken) => {
      const bearer = `Bearer ${(tokens as Record<string, string>)[roleOrToken] ?? roleOrToken}`;
      const api = (path: string) => (path.startsWith('/api') ? path : `/api/v1${path}`);
      return {
        get: (path) => request(app.app).get(api(path)).set('Authorization', bearer),
        post: (path, body) => withBody(request(app.app).post(api(path)).set('Authorization', bearer), body),
        patch: (path, body) => withBody(request(app.app).patch(api(path)).set('Authorization', bearer), body),
        put: (path, body) => withBody(request(app.app).put(api(path)).set('Authorization', bearer), body),
        delete: (path) => request(app.app).delete(api(path)).set('Authorization', bearer),
      };
    },
    close: async () => {
      await app.watches.stop();
      await engine.close();
      await mail.stop();
      await db.destroy();
      await database.drop();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
