/**
 * Starts the built API (dist/apps/api/main.js: the production bundle with its engine worker pool
 * and the local mail stand-in) on a free loopback port with a fresh data folder and demo people.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createInterface } from 'node:readline';

export interface BuiltServer {
  baseUrl: string;
  dataDir: string;
  /** a bearer token for the demo person of a role */
  token(role: 'admin' | 'lead' | 'analyst' | 'viewer'): Promise<string>;
  stop(): Promise<void>;
}

const DEMO_PASSWORD = 'bench password for demo people';

export function buildApi(root: string): void {
  const build = spawnSync('npx', ['nx', 'build', 'api', '--outputStyle=static'], { cwd: root, stdio: ['ignore', 'ignore', 'inherit'] });
  if (build.status !== 0) throw new Error('building the API failed');
}

export async function startBuiltServer(root: string): Promise<BuiltServer> {
  const dataDir = mkdtempSync(join(tmpdir(), 'tallyfit-api-bench-'));
  const child: ChildProcess = spawn(process.execPath, [join(root, 'dist/apps/api/main.js')], {
    cwd: root,
    env: {
      ...process.env,
      PORT: '0',
      HOST: '127.0.0.1',
      TALLYFIT_DATA_DIR: dataDir,
      TALLYFIT_CONSOLE_DIR: join(dataDir, 'no-console'),
      TALLYFIT_DEMO_SEED: 'true',
      TALLYFIT_DEMO_PASSWORD: DEMO_PASSWORD,
      LOG_LEVEL: 'warn',
      UPLOAD_LIMIT_MB: '4096',
    },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const baseUrl = await new Promise<string>((resolve, reject) => {
    child.once('exit', (code) => reject(new Error(`the API stopped before it was ready (exit ${code})`)));
    createInterface({ input: child.stdout! }).on('line', (line) => {
      const match = /running at (http:\/\/\S+)/.exec(line);
      if (match) resolve(match[1].replace('localhost', '127.0.0.1'));
    });
  });
  const tokens = new Map<string, string>();
  return {
    baseUrl,
    dataDir,
    async token(role) {
      if (!tokens.has(role)) {
        const response = await fetch(`${baseUrl}/api/v1/auth/login`, {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ email: `${role}@demo.tallyfit.local`, password: DEMO_PASSWORD }),
        });
        if (!response.ok) throw new Error(`signing in as the demo ${role} failed: HTTP ${response.status}`);
        tokens.set(role, ((await response.json()) as { accessToken: string }).accessToken);
      }
      return tokens.get(role)!;
    },
    async stop() {
      child.kill('SIGTERM');
      if (child.exitCode === null) await once(child, 'exit');
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
