/** Entry point of the `tallyfit` command: wires the CLI to the process. */
import { readFile } from 'node:fs/promises';
import { runCli } from './run-cli';

async function readStdin(): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(typeof chunk === 'string' ? Buffer.from(chunk) : chunk);
  return Buffer.concat(chunks).toString('utf8');
}

runCli(process.argv.slice(2), {
  readText: (path) => readFile(path, 'utf8'),
  readStdin,
  writeOut: (text) => process.stdout.write(text),
  writeErr: (text) => process.stderr.write(text),
}).then((code) => {
  process.exitCode = code;
});
