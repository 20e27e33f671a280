import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { API_BUNDLE, CONSOLE_BUILD, WORKSPACE_ROOT } from './paths';

export const DEMO_PASSWORD = 'e2e-demo-password';

export interface RunningServer {
  url: string;
  stop(): Promise<void>;
}

/** Starts the built product on a free port with a fresh data folder and the demo people seeded. */
export async function startTallyfit(): Promise<RunningServer> {
  for (const required of [API_BUNDLE, join(CONSOLE_BUILD, 'index.html')]) {
    if (!existsSync(required)) throw new Error(`${required} is missing: build api and console first (npx nx run-many -t build)`);
  }
  const port = await freePort();
  const dataDir = mkdtempSync(join(tmpdir(), 'tallyfit-e2e-'));
  const child = spawn(process.execPath, [API_BUNDLE], {
    cwd: WORKSPACE_ROOT,
    env: {
      ...process.env,
      PORT: String(port),
      HOST: '127.0.0.1',
      TALLYFIT_DATA_DIR: dataDir,
      TALLYFIT_CONSOLE_DIR: CONSOLE_BUILD,
      TALLYFIT_DEMO_PASSWORD: DEMO_PASSWORD,
      LOG_LEVEL: 'warn',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout?.on('data', (chunk) => (output += chunk));
  child.stderr?.on('data', (chunk) => (output += chunk));
  const url = `http://127.0.0.1:${port}`;
  await waitForHealth(url, child, () => output);
  return {
    url,
    stop: async () => {
      await stopProcess(child);
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

function freePort(): Promise<number> {
  return new Promise((resolvePort, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      server.close(() => (typeof address === 'object' && address ? resolvePort(address.port) : reject(new Error('no port'))));
    });
  });
}

async function waitForHealth(url: string, child: ChildProcess, output: () => string): Promise<void> {
  const deadline = Date.now() + 30_000;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`the server exited early:\n${output()}`);
    try {
      const response = await fetch(`${url}/api/v1/health`);
      if (response.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((resolveWait) => setTimeout(resolveWait, 200));
  }
  child.kill('SIGKILL');
  throw new Error(`the server did not become healthy within 30 s:\n${output()}`);
}

function stopProcess(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null) return Promise.resolve();
  return new Promise((resolveStop) => {
    child.once('exit', () => resolveStop());
    child.kill('SIGTERM');
    setTimeout(() => child.kill('SIGKILL'), 5_000).unref();
  });
}
