/**
 * A server process for tests that need more than one (two servers on one database): the app on
 * an open, migrated database named by the environment (DATABASE_URL, JWT_SECRET, its own
 * TALLYFIT_DATA_DIR), with the in-process engine, on a free loopback port. Prints
 * "listening at <url>" once ready; SIGTERM stops it.
 */
import pino from 'pino';
import { loadConfig } from '../app/config';
import { createApp } from '../app/create-app';
import { openDatabase } from '../app/database';
import { inProcessEngine } from '../app/engine/engine-runner';
import { startMailService } from '../app/mail/mail-service';
import { listen } from '../app/server/listen';

async function serve(): Promise<void> {
  const config = loadConfig(process.env);
  const db = openDatabase(config);
  const mail = await startMailService({ smtpUrl: config.smtpUrl, from: config.mailFrom, timeoutMs: 5000 });
  const { app } = createApp({ config, db, engine: inProcessEngine(), mail, logger: pino({ level: 'silent' }) });
  const server = await listen(app, 0, '127.0.0.1');
  const { port } = server.address() as { port: number };
  process.stdout.write(`listening at http://127.0.0.1:${port}\n`);
  process.on('SIGTERM', () => server.close(() => void Promise.all([mail.stop(), db.destroy()]).then(() => process.exit(0))));
}

serve().catch((error: unknown) => {
  process.stderr.write(`test server could not start: ${error instanceof Error ? error.message : String(error)}\n`);
  process.exit(1);
});
