import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Knex } from 'knex';
import pino from 'pino';
import request from 'supertest';
import type { Role } from '@tallyfit/contracts';
import { loadConfig, type Config } from '../app/config';
import { createApp, type TallyfitApp } from '../app/create-app';
import { migrateToLatest, openDatabase } from '../app/database';
import { createUser } from '../app/auth/users.service';

export const TEST_PASSWORD = 'correct horse battery staple';

export interface TestContext extends TallyfitApp {
  config: Config;
  db: Knex;
  /** A bearer token per role, for a person created for this suite. */
  tokens: Record<Role, string>;
  close(): Promise<void>;
}

/** A fresh app on a fresh, migrated database in its own temporary folder, with one person per role. */
export async function createTestApp(): Promise<TestContext> {
  const dataDir = mkdtempSync(join(tmpdir(), 'tallyfit-api-test-'));
  const config = loadConfig({ TALLYFIT_DATA_DIR: dataDir, JWT_SECRET: 'test-secret', TALLYFIT_CONSOLE_DIR: join(dataDir, 'none') });
  const db = openDatabase(config);
  await migrateToLatest(db);
  const app = createApp({ config, db, logger: pino({ level: 'silent' }) });
  const roles: Role[] = ['admin', 'lead', 'analyst', 'viewer'];
  const tokens = {} as Record<Role, string>;
  for (const role of roles) {
    const email = `${role}@test.local`;
    await createUser(db, { email, name: `Test ${role}`, role, password: TEST_PASSWORD });
    const response = await request(app.app).post('/api/v1/auth/login').send({ email, password: TEST_PASSWORD });
    tokens[role] = response.body.accessToken;
  }
  return {
    ...app,
    config,
    db,
    tokens,
    close: async () => {
      await db.destroy();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
