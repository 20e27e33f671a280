/**
 * Build the publishable @tallyfit/engine package into dist/libs/engine:
 * - index.js: the library as one ES module (esbuild), decimal.js and zod left as dependencies;
 * - cli.js: the `tallyfit` command (shebang, Node), importing ./index.js rather than a copy;
 * - *.d.ts: declarations from tsc, with relative imports given explicit .js paths so that
 *   TypeScript projects using Node's ESM resolution can follow them;
 * - package.json, README.md, CHANGELOG.md.
 * Run with `node libs/engine/build.mjs` (or `nx build engine`).
 */
import { build } from 'esbuild';
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { chmod, copyFile, mkdir, readdir, readFile, rm, stat, writeFile } from 'node:fs/promises';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const libraryRoot = dirname(fileURLToPath(import.meta.url));
const workspaceRoot = resolve(libraryRoot, '../..');
const outDir = join(workspaceRoot, 'dist/libs/engine');
const external = ['decimal.js', 'zod'];

/** Resolve the CLI's import of the public entry point to the published index.js. */
const entryPointAsSibling = {
  name: 'entry-point-as-sibling',
  setup(context) {
    context.onResolve({ filter: /^\.\.\/index$/ }, () => ({ path: './index.js', external: true }));
  },
};

async function bundle() {
  await build({
    entryPoints: [join(libraryRoot, 'src/index.ts')],
    outfile: join(outDir, 'index.js'),
    bundle: true,
    format: 'esm',
    platform: 'neutral',
    target: 'es2022',
    external,
    legalComments: 'none',
    logLevel: 'warning',
  });
  await build({
    entryPoints: [join(libraryRoot, 'src/cli/main.ts')],
    outfile: join(outDir, 'cli.js'),
    bundle: true,
    format: 'esm',
    platform: 'node',
    target: 'node20',
    external,
    plugins: [entryPointAsSibling],
    banner: { js: '#!/usr/bin/env node' },
    logLevel: 'warning',
  });
  await chmod(join(outDir, 'cli.js'), 0o755);
}

function declarations() {
  const tsc = join(workspaceRoot, 'node_modules/typescript/bin/tsc');
  execFileSync(
    process.execPath,
    [
      tsc,
      '-p',
      join(libraryRoot, 'tsconfig.lib.json'),
      '--emitDeclarationOnly',
      '--declaration',
      '--sourceMap',
      'false',
      '--rootDir',
      join(libraryRoot, 'src'),
      '--outDir',
      outDir,
    ],
    { stdio: 'inherit' },
  );
}

async function* declarationFiles(folder) {
  for (const entry of await readdir(folder, { withFileTypes: true })) {
    const path = join(folder, entry.name);
    if (entry.isDirectory()) yield* declarationFiles(path);
    else if (entry.name.endsWith('.d.ts')) yield path;
  }
}

/** './lib/analyze' → './lib/analyze.js', './lib/exact' → './lib/exact/index.js'. */
async function explicitImportPaths() {
  for await (const file of declarationFiles(outDir)) {
    const text = await readFile(file, 'utf8');
    const rewritten = text.replace(/(from\s+|import\()(['"])(\.{1,2}\/[^'"]+)\2/g, (match, keyword, quote, specifier) => {
      if (specifier.endsWith('.js')) return match;
      const target = resolve(dirname(file), specifier);
      const asFolder = existsSync(join(target, 'index.d.ts'));
      return `${keyword}${quote}${specifier}${asFolder ? '/index.js' : '.js'}${quote}`;
    });
    if (rewritten !== text) await writeFile(file, rewritten);
  }
}

async function copyMetadata() {
  for (const name of ['package.json', 'README.md', 'CHANGELOG.md']) {
    await copyFile(join(libraryRoot, name), join(outDir, name));
  }
}

await rm(outDir, { recursive: true, force: true });
await mkdir(outDir, { recursive: true });
await bundle();
declarations();
await explicitImportPaths();
await copyMetadata();
const size = (await stat(join(outDir, 'index.js'))).size;
console.log(`built ${relative(workspaceRoot, outDir)} (index.js ${(size / 1024).toFixed(0)} kB)`);
