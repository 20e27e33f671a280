import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ConfigError, loadConfig } from './config';

describe('the secret key for stored credentials', () => {
  let dataDir: string;
  beforeEach(() => (dataDir = mkdtempSync(join(tmpdir(), 'tallyfit-secret-key-'))));
  afterEach(() => rmSync(dataDir, { recursive: true, force: true }));

  it('is generated once into the data folder, readable by its owner only', () => {
    const first = loadConfig({ TALLYFIT_DATA_DIR: dataDir, JWT_SECRET: 'x' }).secretKey;
    expect(first).toHaveLength(32);
    expect(statSync(join(dataDir, 'secret-key')).mode & 0o777).toBe(0o600);
    expect(loadConfig({ TALLYFIT_DATA_DIR: dataDir, JWT_SECRET: 'x' }).secretKey.equals(first)).toBe(true);
  });

  it('is read from TALLYFIT_SECRET_KEY as hex or base64, and a wrong length is named', () => {
    const hex = 'ab'.repeat(32);
    expect(loadConfig({ TALLYFIT_DATA_DIR: dataDir, JWT_SECRET: 'x', TALLYFIT_SECRET_KEY: hex }).secretKey.toString('hex')).toBe(hex);
    const base64 = Buffer.alloc(32, 7).toString('base64');
    expect(loadConfig({ TALLYFIT_DATA_DIR: dataDir, JWT_SECRET: 'x', TALLYFIT_SECRET_KEY: base64 }).secretKey).toEqual(Buffer.alloc(32, 7));
    expect(() => loadConfig({ TALLYFIT_DATA_DIR: dataDir, JWT_SECRET: 'x', TALLYFIT_SECRET_KEY: 'too short' })).toThrow(ConfigError);
    expect(() => loadConfig({ TALLYFIT_DATA_DIR: dataDir, JWT_SECRET: 'x', TALLYFIT_SECRET_KEY: 'too short' })).toThrow(/TALLYFIT_SECRET_KEY must be 32 bytes/);
  });
});
