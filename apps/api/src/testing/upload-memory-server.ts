/**
 * The API in a process of its own, for the large-upload test: it measures this process's resident
 * memory alone (not the test runner's) and parses at full speed, outside Jest's sandbox. Prints
 * one JSON line with the port, a token and a study to upload into, then `rss <bytes>` every 20 ms.
 * Run with tsx; stops on SIGTERM.
 */
import type { AddressInfo } from 'node:net';
import { createTestApp } from './test-app';

async function main(): Promise<void> {
  const ctx = await createTestApp();
  const studyId = (await ctx.as('analyst').post('/studies', { name: 'Large upload' })).body.id;
  const server = ctx.app.listen(0, '127.0.0.1', () => {
    const { port } = server.address() as AddressInfo;
    process.stdout.write(JSON.stringify({ port, token: ctx.tokens.analyst, studyId }) + '\n');
  });
  const sampler = setInterval(() => process.stdout.write(`rss ${process.memoryUsage().rss}\n`), 20);
  process.on('SIGTERM', () => {
    clearInterval(sampler);
    server.close(() => void ctx.close().then(() => process.exit(0)));
  });
}

main().catch((error: unknown) => {
  process.stderr.write(`the upload test server could not start: ${error instanceof Error ? error.stack : String(error)}\n`);
  process.exit(1);
});
