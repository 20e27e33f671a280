import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { createTestApp, type TestContext } from '../../testing/test-app';
import { readManifest, restoreDataFolder, tableRows } from './backup';
import { LOCK_FILE } from './data-folder-lock';

const root = join(__dirname, '../../../../..');

/** Runs `npm run backup` as a separate process, as an operator would beside the running server. */
function runBackupCommand(dataDir: string, backupsDir: string): Promise<{ code: number | null; output: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [require.resolve('tsx/cli'), '--tsconfig', join(root, 'tsconfig.base.json'), join(root, 'apps/api/src/backup.ts'), '--to', backupsDir], {
      cwd: root,
      env: { ...process.env, TALLYFIT_DATA_DIR: dataDir, DATABASE_URL: '' },
    });
    let output = '';
    child.stdout.on('data', (chunk) => (output += chunk));
    child.stderr.on('data', (chunk) => (output += chunk));
    child.on('exit', (code) => resolve({ code, output }));
  });
}

const onSqlite = process.env['TALLYFIT_TEST_POSTGRES_URL'] ? describe.skip : describe;

onSqlite('backup and restore', () => {
  let ctx: TestContext;
  let scratch: string;
  beforeAll(async () => {
    ctx = await createTestApp();
    scratch = mkdtempSync(join(tmpdir(), 'tallyfit-backup-test-'));
  });
  afterAll(async () => {
    await ctx.close();
    rmSync(scratch, { recursive: true, force: true });
  });

  it('backs up under write load and restores every write acknowledged before the backup began, with the datasets', async () => {
    const studyId = (await ctx.as('analyst').post('/studies', { name: 'Backed-up study' })).body.id;
    const csv = 'variant\na\nb\na\nc\n';
    const upload = await ctx.as('analyst').post(`/studies/${studyId}/datasets`).field('shape', 'raw').field('column', 'variant').attach('file', Buffer.from(csv), 'split.csv');
    expect(upload.status).toBe(201);

    // Write load: studies (each with its audit event) created one after another until the backup ends.
    const acknowledged: number[] = [];
    let backupRunning = true;
    const writer = (async () => {
      for (let i = 0; backupRunning; i++) {
        const response = await ctx.as('analyst').post('/studies', { name: `Load ${i}` });
        if (response.status === 201) acknowledged.push(response.body.id);
      }
    })();
    await new Promise((resolve) => setTimeout(resolve, 300));
    const ackedBeforeBackup = [...acknowledged];
    const backup = await runBackupCommand(ctx.config.dataDir, join(scratch, 'backups'));
    backupRunning = false;
    await writer;
    expect(backup).toMatchObject({ code: 0 });
    expect(ackedBeforeBackup.length).toBeGreaterThan(0);
    expect(acknowledged.length).toBeGreaterThan(ackedBeforeBackup.length); // writes went on while it ran

    const [folder] = readdirSync(join(scratch, 'backups'));
    expect(folder).toMatch(/^tallyfit-backup-\d{4}-\d\d-\d\dT/);
    const backupDir = join(scratch, 'backups', folder);

    const restoredDir = join(scratch, 'restored');
    const manifest = restoreDataFolder(backupDir, restoredDir);
    expect(manifest).toEqual(readManifest(backupDir));
    const restored = new Database(join(restoredDir, 'tallyfit.sqlite'), { readonly: true });
    try {
      expect(restored.pragma('integrity_check', { simple: true })).toBe('ok');
      const studyIds = new Set(restored.prepare('select id from studies').pluck().all() as number[]);
      for (const id of [studyId, ...ackedBeforeBackup]) expect(studyIds.has(id)).toBe(true);
      // Each study came with its audit event in one transaction: the snapshot holds both or neither.
      const audited = restored.prepare("select count(*) from audit_events where entity_type = 'study' and action = 'create'").pluck().get();
      expect(audited).toBe(studyIds.size);
      const storedFile = restored.prepare('select stored_file from datasets where id = ?').pluck().get(upload.body.id) as string;
      expect(createHash('sha256').update(readFileSync(join(restoredDir, storedFile))).digest('hex')).toBe(upload.body.sha256);
    } finally {
      restored.close();
    }
    expect(tableRows(join(restoredDir, 'tallyfit.sqlite'))).toEqual(manifest.rows);
  }, 60_000);

  it('refuses to restore into a data folder a live server holds', () => {
    const [folder] = readdirSync(join(scratch, 'backups'));
    const held = mkdtempSync(join(tmpdir(), 'tallyfit-held-'));
    // A live process (the one that started this test run) stands for the server holding the folder.
    writeFileSync(join(held, LOCK_FILE), `${process.ppid}\n`);
    try {
      expect(() => restoreDataFolder(join(scratch, 'backups', folder), held)).toThrow(
        `another Tallyfit server (process ${process.ppid}) is using the data folder ${held}`,
      );
    } finally {
      rmSync(held, { recursive: true, force: true });
    }
  });
});
