import { spawn, type ChildProcessWithoutNullStreams } from 'node:child_process';
import { createReadStream, createWriteStream, mkdtempSync, rmSync, statSync } from 'node:fs';
import { once } from 'node:events';
import { request } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createInterface } from 'node:readline';

/**
 * A large upload streams from disk to disk and through the parser without being held in memory.
 * Always run with a file of about 128 MB; with TALLYFIT_BIG_UPLOAD_TEST=1, with about 1 GB. The API
 * runs in its own process (see upload-memory-server.ts) so its resident memory is measured alone.
 */
const big = process.env['TALLYFIT_BIG_UPLOAD_TEST'] === '1';
const TARGET_BYTES = big ? 1024 ** 3 : 128 * 1024 ** 2;
const VARIANTS = ['control', 'treatment-a', 'treatment-b', 'treatment-c'];
const root = join(__dirname, '../../../../..');

/** Writes visitor rows (id, variant, a session column) until the file reaches the target size. */
async function writeAssignments(path: string, targetBytes: number): Promise<{ rows: number; counts: number[] }> {
  const out = createWriteStream(path);
  out.write('visitor,variant,session\n');
  const counts = VARIANTS.map(() => 0);
  let rows = 0;
  let bytes = 0;
  while (bytes < targetBytes) {
    let chunk = '';
    for (let i = 0; i < 10_000; i++, rows++) {
      const variant = (rows * 7919) % VARIANTS.length;
      counts[variant]++;
      chunk += `${rows + 1},${VARIANTS[variant]},s${(rows * 104729) % 1_000_003}\n`;
    }
    bytes += Buffer.byteLength(chunk);
    if (!out.write(chunk)) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
  return { rows, counts };
}

interface Server {
  child: ChildProcessWithoutNullStreams;
  port: number;
  token: string;
  studyId: number;
  /** the last resident memory the server reported */
  rss: number;
  /** the highest since the last reset */
  peak: number;
}

async function startServer(): Promise<Server> {
  const child = spawn(join(root, 'node_modules/.bin/tsx'), ['--tsconfig', join(root, 'tsconfig.base.json'), join(root, 'apps/api/src/testing/upload-memory-server.ts')], {
    cwd: root,
  });
  const lines = createInterface({ input: child.stdout });
  let errors = '';
  child.stderr.on('data', (chunk: Buffer) => (errors += chunk.toString()));
  return new Promise((resolve, reject) => {
    let server: Server | undefined;
    child.once('exit', (code) => reject(new Error(`the upload test server stopped (${code}): ${errors}`)));
    lines.on('line', (line) => {
      if (line.startsWith('rss ')) {
        if (!server) return;
        server.rss = Number(line.slice(4));
        server.peak = Math.max(server.peak, server.rss);
      } else if (line.startsWith('{')) {
        server = { child, ...JSON.parse(line), rss: 0, peak: 0 };
        resolve(server!);
      }
    });
  });
}

interface UploadAnswer {
  rowCount: number;
  sizeBytes: number;
  selectedCounts: unknown;
  columns: Array<{ distinctValues: number | null }>;
}

/** Posts a file as multipart/form-data, streamed from disk, with the column choice fields first. */
async function uploadFile(server: Server, path: string, fields: Record<string, string>): Promise<{ status: number; body: UploadAnswer }> {
  const boundary = `tallyfit-${Date.now()}`;
  const head =
    Object.entries(fields)
      .map(([name, value]) => `--${boundary}\r\nContent-Disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`)
      .join('') + `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="assignments.csv"\r\nContent-Type: text/csv\r\n\r\n`;
  const tail = `\r\n--${boundary}--\r\n`;
  const length = Buffer.byteLength(head) + statSync(path).size + Buffer.byteLength(tail);
  const call = request({
    host: '127.0.0.1',
    port: server.port,
    method: 'POST',
    path: `/api/v1/studies/${server.studyId}/datasets`,
    headers: { authorization: `Bearer ${server.token}`, 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': length },
  });
  const answer = new Promise<{ status: number; body: UploadAnswer }>((resolve, reject) => {
    call.on('response', (response) => {
      let text = '';
      response.on('data', (chunk: Buffer) => (text += chunk.toString()));
      response.on('end', () => resolve({ status: response.statusCode ?? 0, body: JSON.parse(text) }));
    });
    call.on('error', reject);
  });
  call.write(head);
  const file = createReadStream(path);
  file.pipe(call, { end: false });
  await once(file, 'end');
  call.end(tail);
  return answer;
}

describe(`a ${big ? '1 GB' : '128 MB'} upload`, () => {
  let dir: string;
  let server: Server;
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'tallyfit-large-upload-'));
    server = await startServer();
  }, 60_000);
  afterAll(async () => {
    if (server) {
      server.child.kill('SIGTERM');
      await once(server.child, 'exit');
    }
    rmSync(dir, { recursive: true, force: true });
  });

  it(
    'is counted correctly while the server’s memory stays far below the file size',
    async () => {
      const warmUpPath = join(dir, 'warm-up.csv');
      // An upload first, so loading modules, warming up the parser and starting the two scan threads
      // (files from 8 MB are counted in two threads) do not count as growth.
      await writeAssignments(warmUpPath, 9 * 1024 ** 2);
      expect((await uploadFile(server, warmUpPath, {})).status).toBe(201);

      const path = join(dir, 'assignments.csv');
      const expected = await writeAssignments(path, TARGET_BYTES);
      const size = statSync(path).size;
      await new Promise((resolve) => setTimeout(resolve, 100));
      const baseline = server.rss;
      server.peak = baseline;
      const response = await uploadFile(server, path, { shape: 'raw', column: 'variant' });

      expect(response.status).toBe(201);
      expect(response.body.rowCount).toBe(expected.rows);
      expect(response.body.sizeBytes).toBe(size);
      expect(response.body.selectedCounts).toMatchObject({ labels: VARIANTS, counts: expected.counts, total: expected.rows });
      // The visitor and session columns have too many different values to be offered as categories.
      expect(response.body.columns.map((column) => column.distinctValues)).toEqual([null, 4, null]);
      const growth = server.peak - baseline;
      process.stdout.write(`upload of ${(size / 1024 ** 2).toFixed(0)} MB: the server's resident memory grew by ${(growth / 1024 ** 2).toFixed(1)} MB at most\n`);
      expect(growth).toBeLessThan(Math.min(size / 2, 64 * 1024 ** 2));
    },
    big ? 30 * 60_000 : 180_000,
  );
});
