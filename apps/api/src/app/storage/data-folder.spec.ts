import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createTestApp } from '../../testing/test-app';
import { clearUnfinishedUploads, makeDataFolderPrivate } from './data-folder';
import { DataFolderLockedError, LOCK_FILE, lockDataFolder } from './data-folder-lock';

const mode = (path: string) => statSync(path).mode & 0o777;

describe('the data folder', () => {
  let dataDir: string;
  beforeEach(() => (dataDir = mkdtempSync(join(tmpdir(), 'tallyfit-data-folder-'))));
  afterEach(() => rmSync(dataDir, { recursive: true, force: true }));

  describe('lock', () => {
    let other: ChildProcess;
    beforeAll(() => (other = spawn('sleep', ['60'])));
    afterAll(() => other.kill());

    it('refuses a second server while the first one lives, naming its process', () => {
      writeFileSync(join(dataDir, LOCK_FILE), `${other.pid}\n`);
      expect(() => lockDataFolder(dataDir)).toThrow(DataFolderLockedError);
      expect(() => lockDataFolder(dataDir)).toThrow(`another Tallyfit server (process ${other.pid}) is using the data folder ${dataDir}`);
    });

    it('holds the lock with its process id, refuses another process, and lets go on release', () => {
      const lock = lockDataFolder(dataDir);
      expect(readFileSync(join(dataDir, LOCK_FILE), 'utf8').trim()).toBe(String(process.pid));
      expect(mode(join(dataDir, LOCK_FILE))).toBe(0o600);
      expect(() => lockDataFolder(dataDir, other.pid)).toThrow(DataFolderLockedError);
      lock.release();
      expect(existsSync(join(dataDir, LOCK_FILE))).toBe(false);
    });

    it('takes over a stale lock left by a process that no longer exists', async () => {
      const gone = spawn('true');
      await new Promise((resolve) => gone.once('exit', resolve));
      writeFileSync(join(dataDir, LOCK_FILE), `${gone.pid}\n`);
      const lock = lockDataFolder(dataDir);
      expect(readFileSync(join(dataDir, LOCK_FILE), 'utf8').trim()).toBe(String(process.pid));
      lock.release();
    });
  });

  it('is made private (0700) even when it was created open', () => {
    const open = join(dataDir, 'open');
    mkdirSync(open, { mode: 0o755 });
    makeDataFolderPrivate(open);
    expect(mode(open)).toBe(0o700);
  });

  it('loses the uploads a crash left unfinished', () => {
    const folder = join(dataDir, 'uploads-in-progress');
    mkdirSync(folder);
    writeFileSync(join(folder, 'upload-0123'), 'half a file');
    expect(clearUnfinishedUploads(dataDir)).toBe(1);
    expect(readdirSync(folder)).toEqual([]);
  });
});

const onSqlite = process.env['TALLYFIT_TEST_POSTGRES_URL'] ? describe.skip : describe;

onSqlite('files in the data folder', () => {
  it('keeps the database and stored datasets readable by the owner only (0600)', async () => {
    const ctx = await createTestApp();
    try {
      const studyId = (await ctx.as('analyst').post('/studies', { name: 'Private files' })).body.id;
      const upload = await ctx
        .as('analyst')
        .post(`/studies/${studyId}/datasets`)
        .field('shape', 'raw')
        .field('column', 'variant')
        .attach('file', Buffer.from('variant\na\nb\na\n'), 'split.csv');
      expect(upload.status).toBe(201);
      expect(mode(join(ctx.config.dataDir, 'tallyfit.sqlite'))).toBe(0o600);
      expect(mode(join(ctx.config.dataDir, 'tallyfit.sqlite-wal'))).toBe(0o600);
      const stored = readdirSync(join(ctx.config.dataDir, 'datasets'));
      expect(stored).toHaveLength(1);
      expect(mode(join(ctx.config.dataDir, 'datasets', stored[0]))).toBe(0o600);
    } finally {
      await ctx.close();
    }
  });
});
