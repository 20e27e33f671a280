/**
 * The published package works on its own: build it (build.mjs), `npm pack` it, install the tarball
 * into an empty folder without the network (decimal.js and zod come from the npm cache), then run
 * `npx tallyfit analyze`, import the library and type-check a consumer against its declarations.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { ENGINE_VERSION } from './lib/engine-version';

const workspaceRoot = resolve(__dirname, '../../..');
const distDir = join(workspaceRoot, 'dist/libs/engine');

function run(command: string, args: string[], cwd: string): string {
  return execFileSync(command, args, {
    cwd,
    encoding: 'utf8',
    env: { ...process.env, npm_config_offline: 'true', npm_config_audit: 'false', npm_config_fund: 'false', npm_config_update_notifier: 'false' },
    stdio: ['pipe', 'pipe', 'pipe'],
  });
}

describe('the published package', () => {
  let folder: string;

  beforeAll(() => {
    folder = mkdtempSync(join(tmpdir(), 'tallyfit-engine-pack-'));
    run(process.execPath, [join(workspaceRoot, 'libs/engine/build.mjs')], workspaceRoot);
    run('npm', ['pack', '--pack-destination', folder], distDir);
    const tarball = readdirSync(folder).find((name) => name.endsWith('.tgz'));
    if (!tarball) throw new Error(`npm pack produced no tarball in ${folder}`);
    writeFileSync(join(folder, 'package.json'), JSON.stringify({ name: 'consumer', private: true, type: 'module' }));
    run('npm', ['install', '--offline', '--no-audit', '--no-fund', join(folder, tarball)], folder);
  }, 180_000);

  afterAll(() => {
    if (folder) rmSync(folder, { recursive: true, force: true });
  });

  it('has the version of libs/engine/package.json and ships its README and CHANGELOG', () => {
    const manifest = JSON.parse(readFileSync(join(folder, 'node_modules/@tallyfit/engine/package.json'), 'utf8'));
    expect(manifest.version).toBe(ENGINE_VERSION);
    const shipped = readdirSync(join(folder, 'node_modules/@tallyfit/engine'));
    expect(shipped).toEqual(expect.arrayContaining(['index.js', 'index.d.ts', 'cli.js', 'README.md', 'CHANGELOG.md']));
  });

  it('runs `npx tallyfit analyze` on a spec file', () => {
    const spec = { observed: { labels: ['left', 'right'], counts: [1752, 1895] }, hypothesis: { kind: 'equal' } };
    writeFileSync(join(folder, 'spec.json'), JSON.stringify(spec));
    const result = JSON.parse(run('npx', ['tallyfit', 'analyze', 'spec.json'], folder));
    expect(result.tests.pearson.statistic).toBeCloseTo(5.6071, 4);
    expect(result.engineVersion).toBe(ENGINE_VERSION);
  });

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
    expect(output.trim()).toBe(`${ENGINE_VERSION} 0.0179`);
  });

  it('type-checks a consumer under Node ESM resolution', () => {
    writeFileSync(
      join(folder, 'consumer.ts'),
      [
        "import { analyze, type AnalysisResult } from '@tallyfit/engine';",
        "const result: AnalysisResult = analyze({ observed: { labels: ['a', 'b'], counts: [1, 2] }, hypothesis: { kind: 'equal' } });",
        'export const p: number | undefined = result.tests.pearson?.p;',
      ].join('\n'),
    );
    const tsc = join(workspaceRoot, 'node_modules/typescript/bin/tsc');
    expect(() =>
      run(process.execPath, [tsc, '--module', 'nodenext', '--moduleResolution', 'nodenext', '--target', 'es2022', '--strict', '--skipLibCheck', '--noEmit', 'consumer.ts'], folder),
    ).not.toThrow();
  });
});
