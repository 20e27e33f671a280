/**
 * Upload speed: a CSV of visitor assignments (one row per visitor) is generated in a temporary
 * folder, uploaded to the API with the variant column chosen, and timed until the API answers;
 * `awk` counts the same column of the same file, for comparison.
 */
import { execFileSync } from 'node:child_process';
import { createReadStream, createWriteStream, statSync } from 'node:fs';
import { once } from 'node:events';
import { request } from 'node:http';
import { join } from 'node:path';

const VARIANTS = ['control', 'treatment-a', 'treatment-b', 'treatment-c'];

export async function writeAssignmentsCsv(dir: string, rows: number): Promise<string> {
  const path = join(dir, `assignments-${rows}.csv`);
  const out = createWriteStream(path);
  out.write('visitor,variant,session\n');
  for (let start = 0; start < rows; start += 10_000) {
    let chunk = '';
    for (let i = start; i < Math.min(rows, start + 10_000); i++) {
      chunk += `${i + 1},${VARIANTS[(i * 7919) % VARIANTS.length]},s${(i * 104729) % 1_000_003}\n`;
    }
    if (!out.write(chunk)) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
  return path;
}

/** Streams the file as multipart/form-data and answers the seconds until the API's reply and its row count. */
export async function timeUpload(baseUrl: string, token: string, studyId: number, path: string): Promise<{ seconds: number; rowCount: number }> {
  const boundary = `tallyfit-bench-${Date.now()}`;
  const head =
    `--${boundary}\r\nContent-Disposition: form-data; name="shape"\r\n\r\nraw\r\n` +
    `--${boundary}\r\nContent-Disposition: form-data; name="column"\r\n\r\nvariant\r\n` +
    `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="assignments.csv"\r\nContent-Type: text/csv\r\n\r\n`;
  const tail = `\r\n--${boundary}--\r\n`;
  const url = new URL(`${baseUrl}/api/v1/studies/${studyId}/datasets`);
  const started = performance.now();
  const call = request({
    host: url.hostname,
    port: url.port,
    path: url.pathname,
    method: 'POST',
    headers: {
      authorization: `Bearer ${token}`,
      'content-type': `multipart/form-data; boundary=${boundary}`,
      'content-length': Buffer.byteLength(head) + statSync(path).size + Buffer.byteLength(tail),
    },
  });
  const answer = new Promise<{ status: number; text: string }>((resolve, reject) => {
    call.on('response', (response) => {
      let text = '';
      response.on('data', (chunk: Buffer) => (text += chunk.toString()));
      response.on('end', () => resolve({ status: response.statusCode ?? 0, text }));
    });
    call.on('error', reject);
  });
  call.write(head);
  const file = createReadStream(path, { highWaterMark: 1024 * 1024 });
  file.pipe(call, { end: false });
  await once(file, 'end');
  call.end(tail);
  const { status, text } = await answer;
  const seconds = (performance.now() - started) / 1000;
  if (status !== 201) throw new Error(`the upload was refused: HTTP ${status} ${text.slice(0, 300)}`);
  return { seconds, rowCount: (JSON.parse(text) as { rowCount: number }).rowCount };
}

/** Seconds for awk to count the variant column of the same file. */
export function timeAwk(path: string): number {
  const started = performance.now();
  execFileSync('awk', ['-F,', 'NR > 1 { seen[$2]++ } END { for (v in seen) print v, seen[v] }', path], { stdio: ['ignore', 'ignore', 'inherit'] });
  return (performance.now() - started) / 1000;
}
