/**
 * The published package works for a consumer: build it (build.mjs), `npm pack` it, unpack the
 * tarball into node_modules of an empty folder as an install would, link the dependencies its
 * manifest names to the workspace's own copies (so neither the npm cache nor the network is
 * needed), link its bin, then run `tallyfit analyze`, import the library and type-check a
 * consumer against the packed declarations.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, renameSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { delimiter, dirname, join, resolve } from 'node:path';
import { ENGINE_VERSION } from './lib/engine-version';

const workspaceRoot = resolve(__dirname, '../../..');
const distDir = join(workspaceRoot, 'dist/libs/engine');

interface Manifest {
  name: string;
  version: string;
  bin: Record<string, string>;
  dependencies: Record<string, string>;
  exports: Record<string, Record<string, string> | string>;
}

/** `version` satisfies a caret range `^M.m.p` (the only kind the manifest uses): same major, not older. */
function satisfiesCaret(version: string, range: string): boolean {
  const wanted = /^\^(\d+)\.(\d+)\.(\d+)$/.exec(range);
  if (!wanted) throw new Error(`unexpected dependency range ${range}; use ^major.minor.patch`);
  const [major, minor, patch] = version.split('.').map((part) => Number.parseInt(part, 10));
  const [wantMajor, wantMinor, wantPatch] = wanted.slice(1).map(Number);
  if (major !== wantMajor) return false;
  return minor > wantMinor || (minor === wantMinor && patch >= wantPatch);
}

function run(command: string, args: string[], cwd: string, env: NodeJS.ProcessEnv = process.env): string {
  return execFileSync(command, args, { cwd, encoding: 'utf8', env, stdio: ['pipe', 'pipe', 'pipe'] });
}

describe('the published package', () => {
  let folder: string;
  let packageDir: string;
  let manifest: Manifest;
  let packedFiles: string[];

  beforeAll(() => {
    folder = mkdtempSync(join(tmpdir(), 'tallyfit-engine-pack-'));
    run(process.execPath, [join(workspaceRoot, 'libs/engine/build.mjs')], workspaceRoot);
    // `npm pack` reads only the folder it packs: no cache, no registry.
    run('npm', ['pack', '--pack-destination', folder], distDir, { ...process.env, npm_config_offline: 'true', npm_config_update_notifier: 'false' });
    const tarball = readdirSync(folder).find((name) => name.endsWith('.tgz'));
    if (!tarball) throw new Error(`npm pack produced no tarball in ${folder}`);
    packedFiles = run('tar', ['-tzf', join(folder, tarball)], folder).trim().split('\n');

    writeFileSync(join(folder, 'package.json'), JSON.stringify({ name: 'consumer', private: true, type: 'module' }));
    const modules = join(folder, 'node_modules');
    mkdirSync(join(modules, '@tallyfit'), { recursive: true });
    run('tar', ['-xzf', join(folder, tarball), '-C', join(modules, '@tallyfit')], folder);
    packageDir = join(modules, '@tallyfit/engine');
    renameSync(join(modules, '@tallyfit/package'), packageDir);
    manifest = JSON.parse(readFileSync(join(packageDir, 'package.json'), 'utf8'));

    for (const [dependency, range] of Object.entries(manifest.dependencies)) {
      const target = join(workspaceRoot, 'node_modules', dependency);
      if (!existsSync(join(target, 'package.json'))) throw new Error(`the package depends on ${dependency}, which the workspace does not install`);
      const linked = JSON.parse(readFileSync(join(target, 'package.json'), 'utf8')).version as string;
      if (!satisfiesCaret(linked, range)) throw new Error(`the package asks for ${dependency}@${range} but the workspace has ${linked}`);
      mkdirSync(dirname(join(modules, dependency)), { recursive: true });
      symlinkSync(target, join(modules, dependency), 'dir');
    }
    mkdirSync(join(modules, '.bin'));
    for (const [command, file] of Object.entries(manifest.bin)) symlinkSync(join('..', '@tallyfit/engine', file), join(modules, '.bin', command));
  }, 180_000);

  afterAll(() => {
    if (folder) rmSync(folder, { recursive: true, force: true });
  });

  it('has the version of libs/engine/package.json and ships its code, declarations, README and CHANGELOG', () => {
    expect(manifest.name).toBe('@tallyfit/engine');
    expect(manifest.version).toBe(ENGINE_VERSION);
    expect(packedFiles).toEqual(
      expect.arrayContaining(['package/package.json', 'package/index.js', 'package/index.d.ts', 'package/cli.js', 'package/README.md', 'package/CHANGELOG.md']),
    );
    expect(packedFiles.filter((file) => file.endsWith('.spec.d.ts') || file.includes('/testing/'))).toEqual([]);
  });

  it('runs its `tallyfit` bin on a spec file', () => {
    // McDonald, Handbook of Biological Statistics, 3rd ed. (2014), "Chi-square test of goodness-of-fit":
    // 1752 vs 1895 under 1:1 gives X² = 5.607, 1 d.f., P = 0.0179 (from memory).
    const spec = { observed: { labels: ['left', 'right'], counts: [1752, 1895] }, hypothesis: { kind: 'equal' } };
    writeFileSync(join(folder, 'spec.json'), JSON.stringify(spec));
    const env = { ...process.env, PATH: `${join(folder, 'node_modules/.bin')}${delimiter}${process.env.PATH ?? ''}` };
    const result = JSON.parse(run('tallyfit', ['analyze', 'spec.json'], folder, env));
    expect(result.tests.pearson.statistic).toBeCloseTo(5.607, 3);
    expect(result.tests.pearson.p).toBeCloseTo(0.0179, 4);
    expect(result.engineVersion).toBe(ENGINE_VERSION);
  }, 120_000);

  it('runs `npx tallyfit sequential -` on batches from standard input', () => {
    const stream = { observed: { labels: ['left', 'right'] }, hypothesis: { kind: 'equal' }, batches: [[500, 500], [580, 420]] };
    const printed = execFileSync('npx', ['tallyfit', 'sequential', '-'], { cwd: folder, encoding: 'utf8', input: JSON.stringify(stream), env: { ...process.env, npm_config_offline: 'true' } });
    const result = JSON.parse(printed);
    expect(result.looks.map((look: { n: number }) => look.n)).toEqual([1000, 2000]);
    expect(result.looks[1].p).toBeLessThan(result.looks[0].p);
  });

  it('can be imported as an ES module', () => {
    const output = run(
      process.execPath,
      ['--input-type=module', '-e', "import { chiSquareSurvival, ENGINE_VERSION } from '@tallyfit/engine'; console.log(ENGINE_VERSION, chiSquareSurvival(5.6071, 1).toFixed(4));"],
      folder,
    );
    // P = 0.0179 for X² = 5.6071 on 1 d.f.: McDonald (2014), as above.
    expect(output.trim()).toBe(`${ENGINE_VERSION} 0.0179`);
  }, 120_000);

  it('offers no CommonJS entry point, as the README says (an ES module only)', () => {
    expect(Object.keys(manifest.exports['.'] as Record<string, string>)).toEqual(['types', 'import']);
    expect(readFileSync(join(packageDir, 'README.md'), 'utf8')).toMatch(/The package is an ES module/);
  });

  it('type-checks a consumer under Node ESM resolution against the packed declarations', () => {
    writeFileSync(
      join(folder, 'consumer.ts'),
      [
        "import { analyze, type AnalysisResult } from '@tallyfit/engine';",
        "const result: AnalysisResult = analyze({ observed: { labels: ['a', 'b'], counts: [1, 2] }, hypothesis: { kind: 'equal' } });",
        'export const p: number | undefined = result.tests.pearson?.p;',
      ].join('\n'),
    );
    writeFileSync(join(folder, 'wrong.ts'), "import { analyze } from '@tallyfit/engine';\nexport const n: string = analyze({ observed: { labels: [], counts: [] }, hypothesis: { kind: 'equal' } }).n;\n");
    const tsc = join(workspaceRoot, 'node_modules/typescript/bin/tsc');
    /** tsc's diagnostics (it prints them on stdout), or '' when the file type-checks. */
    const diagnostics = (file: string): string => {
      try {
        return run(process.execPath, [tsc, '--module', 'nodenext', '--moduleResolution', 'nodenext', '--target', 'es2022', '--strict', '--skipLibCheck', '--noEmit', file], folder);
      } catch (error) {
        return String((error as { stdout?: string }).stdout || error);
      }
    };
    expect(diagnostics('consumer.ts')).toBe('');
    // The declarations really are read: a wrong type is caught.
    expect(diagnostics('wrong.ts')).toMatch(/Type 'number' is not assignable to type 'string'/);
  }, 120_000);
});
