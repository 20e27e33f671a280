import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Knex } from 'knex';
import { loadConfig } from '../config';
import { migrateToLatest, openDatabase } from '../database';
import { DEMO_ANALYSES, DEMO_STUDY } from './demo-scenarios';
import { seedDemo } from './demo-seed';
import { DEMO_WATCH } from './demo-watch';

describe('demo seed', () => {
  let dataDir: string;
  let db: Knex;
  beforeAll(async () => {
    dataDir = mkdtempSync(join(tmpdir(), 'tallyfit-demo-seed-'));
    db = openDatabase(loadConfig({ TALLYFIT_DATA_DIR: dataDir, JWT_SECRET: 'x' }));
    await migrateToLatest(db);
  });
  afterAll(async () => {
    await db.destroy();
    rmSync(dataDir, { recursive: true, force: true });
  });

  it('puts the demo analyses in the demo study, owned by the analyst and readable by the viewer', async () => {
    const signIns = await seedDemo(db, dataDir, 'demo password here');
    expect(signIns.map((s) => s.email)).toContain('viewer@demo.tallyfit.local');
    const study = await db('studies').where({ name: DEMO_STUDY.name }).first();
    const members = await db('study_members').join('users', 'users.id', 'study_members.user_id').where({ study_id: study.id }).select('users.role', 'study_members.study_role');
    expect(members.sort((a, b) => a.role.localeCompare(b.role))).toEqual([
      { role: 'analyst', study_role: 'owner' },
      { role: 'viewer', study_role: 'reader' },
    ]);
    const analyses = await db('analyses')
      .where({ study_id: study.id })
      .whereNotIn('id', db('watch_batches').select('analysis_id'))
      .pluck('title');
    expect(analyses.sort()).toEqual(DEMO_ANALYSES.map((demo) => demo.title).sort());
    const [dataset] = await db('datasets').where({ study_id: study.id });
    expect(dataset.file_name).toBe('support-tickets.csv');
    expect(JSON.parse(dataset.selected_json)).toMatchObject({ labels: ['Fri', 'Mon', 'Thu', 'Tue', 'Wed'], counts: [58, 88, 69, 71, 64], total: 350 });
    const watch = await db('watches').where({ study_id: study.id }).first();
    expect(watch).toMatchObject({ name: DEMO_WATCH.name, batch_count: DEMO_WATCH.batches, state: 'alarm', alert_state: 'acknowledged' });
    const alerts = await db('watch_alerts').where({ watch_id: watch.id });
    expect(alerts).toEqual([expect.objectContaining({ kind: 'alarm', note: expect.stringContaining('caching rule') })]);
    // The alarm came after the fault began, not before (the first twelve periods are balanced).
    const alarmBatch = await db('watch_batches').where({ id: alerts[0].batch_id }).first();
    expect(alarmBatch.sequence).toBeGreaterThanOrEqual(DEMO_WATCH.faultFromBatch);
    // A second start seeds nothing more.
    await seedDemo(db, dataDir, 'demo password here');
    expect(await db('studies').count({ n: '*' })).toEqual([{ n: 1 }]);
  });
});
