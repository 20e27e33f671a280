import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { ENGINE_VERSION } from './engine-version';

describe('ENGINE_VERSION', () => {
  it('equals the version in libs/engine/package.json', () => {
    const manifest = JSON.parse(readFileSync(join(__dirname, '..', '..', 'package.json'), 'utf8')) as { version: string };
    expect(ENGINE_VERSION).toBe(manifest.version);
  });

  it('is a semantic version', () => {
    expect(ENGINE_VERSION).toMatch(/^\d+\.\d+\.\d+(-[0-9A-Za-z.-]+)?$/);
  });
});
