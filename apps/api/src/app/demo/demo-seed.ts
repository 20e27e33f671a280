import { randomBytes } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Knex } from 'knex';
import { ROLES, type Role } from '@tallyfit/contracts';
import { createAnalysis } from '../analyses/analyses.service';
import { countUsers, createUser } from '../identity/users.service';
import { inProcessEngine } from '../engine/engine-runner';
import { addStudyMember, createStudy } from '../studies/studies.service';
import { seedDemoDataset } from './demo-dataset';
import { seedDemoWatch } from './demo-watch';
import { DEMO_ANALYSES, DEMO_STUDY } from './demo-scenarios';

export interface DemoSignIn {
  role: Role;
  email: string;
  password: string;
}

const DEMO_NAMES: Record<Role, string> = {
  admin: 'Ada Admin',
  lead: 'Lee Lead',
  analyst: 'Ana Analyst',
  viewer: 'Vic Viewer',
};

/**
 * On an empty database: one demo person per role, a demo study (the analyst owns it, the viewer
 * reads it), a few analyses of invented scenarios in it, and a watch with a day of history.
 * Passwords are generated per data folder (or fixed by TALLYFIT_DEMO_PASSWORD for tests) and kept
 * in a file readable by its owner only, so every start can print them again.
 */
export async function seedDemo(db: Knex, dataDir: string, fixedPassword?: string, publicUrl = 'http://localhost:3000'): Promise<DemoSignIn[]> {
  const file = join(dataDir, 'demo-sign-ins.json');
  if ((await countUsers(db)) > 0) {
    return existsSync(file) ? (JSON.parse(readFileSync(file, 'utf8')) as DemoSignIn[]) : [];
  }
  const signIns = ROLES.map((role) => ({
    role,
    email: `${role}@demo.tallyfit.local`,
    password: fixedPassword ?? randomBytes(9).toString('base64url'),
  }));
  await db.transaction(async (trx) => {
    const people = [];
    for (const signIn of signIns) {
      people.push(await createUser(trx, { ...signIn, name: DEMO_NAMES[signIn.role] }));
    }
    const analyst = people.find((person) => person.role === 'analyst')!;
    const viewer = people.find((person) => person.role === 'viewer')!;
    const study = await createStudy(trx, analyst, DEMO_STUDY);
    await addStudyMember(trx, analyst, study.id, { userId: viewer.id, studyRole: 'reader' });
    // A one-off seed before the server listens: running the few small demo specs in-process is fine.
    const engine = inProcessEngine();
    for (const demo of DEMO_ANALYSES) await createAnalysis(trx, engine, analyst, { ...demo, studyId: study.id });
    await seedDemoDataset(trx, dataDir, analyst, study.id);
    const lead = people.find((person) => person.role === 'lead')!;
    await seedDemoWatch(trx, engine, { analyst, lead }, study.id, publicUrl);
  });
  writeFileSync(file, JSON.stringify(signIns, null, 2) + '\n', { mode: 0o600 });
  return signIns;
}
