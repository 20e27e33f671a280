import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { ENGINE_VERSION } from './engine-version';

const libraryRoot = join(__dirname, '..', '..');

describe('ENGINE_VERSION', () => {
  it('equals the version in libs/engine/package.json', () => {
    const manifest = JSON.parse(readFileSync(join(libraryRoot, 'package.json'), 'utf8')) as { version: string };
    expect(ENGINE_VERSION).toBe(manifest.version);
  });

  it('has its own entry in CHANGELOG.md, the newest one', () => {
    const changelog = readFileSync(join(libraryRoot, 'CHANGELOG.md'), 'utf8');
    const releases = [...changelog.matchAll(/^## (\S+)/gm)].map((match) => match[1]);
    expect(releases[0]).toBe(ENGINE_VERSION);
  });
});
