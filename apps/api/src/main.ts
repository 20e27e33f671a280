import pino from 'pino';
import { join } from 'node:path';
import { ENGINE_VERSION } from '@tallyfit/engine';
import { loadConfig } from './app/config';
import { createApp } from './app/create-app';
import { migrateToLatest, openDatabase } from './app/database';
import { seedDemo } from './app/demo/demo-seed';
import { createEnginePool } from './app/engine/engine-pool';
import { startMailService } from './app/mail/mail-service';
import { listen } from './app/server/listen';
import { startupFailureLine } from './app/server/startup-failure';
import { clearUnfinishedUploads, makeDataFolderPrivate } from './app/storage/data-folder';
import { lockDataFolder } from './app/storage/data-folder-lock';

async function main(): Promise<void> {
  // Everything this process creates (database, datasets, uploads, backups) is for its own account.
  process.umask(0o077);
  const config = loadConfig(process.env);
  makeDataFolderPrivate(config.dataDir);
  const lock = lockDataFolder(config.dataDir);
  process.on('exit', () => lock.release());
  const interrupted = clearUnfinishedUploads(config.dataDir);
  const logger = pino({ level: config.logLevel });
  if (interrupted) logger.warn({ files: interrupted }, 'removed uploads a previous run left unfinished');
  const db = openDatabase(config);
  await migrateToLatest(db);
  const signIns = config.seedDemo ? await seedDemo(db, config.dataDir, config.demoPassword) : [];
  // The worker is built beside main.js (see additionalEntryPoints in apps/api/project.json).
  const engine = createEnginePool({
    workerFile: join(__dirname, 'engine-worker.js'),
    timeLimitMs: config.engineTimeLimitMs,
    queueWaitLimitMs: config.engineQueueWaitMs,
  });
  // Without SMTP_URL a local SMTP stand-in receives the mail; admins read it in the outbox.
  const mail = await startMailService({ smtpUrl: config.smtpUrl, from: config.mailFrom });
  const { app } = createApp({ config, db, engine, mail, logger });

  const server = await listen(app, config.port, config.host);
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.port;
  const url = `http://${config.host === '127.0.0.1' || config.host === '0.0.0.0' ? 'localhost' : config.host}:${port}`;
  const lines = [
    '',
    `Tallyfit is running at ${url}  (engine ${ENGINE_VERSION}, data in ${config.dataDir})`,
    `Mail goes to ${mail.destination}.`,
    config.consoleDir ? '' : 'The console is not built; only the API is served (run `npx nx build console`).',
    ...(signIns.length ? ['Demo sign-ins (local only):', ...signIns.map((s) => `  ${s.role.padEnd(8)} ${s.email.padEnd(30)} ${s.password}`)] : []),
    '',
  ];
  process.stdout.write(lines.filter((line, i) => line !== '' || i === 0 || i === lines.length - 1).join('\n') + '\n');

  const shutdown = () => {
    server.close(() => void Promise.all([engine.close(), mail.stop(), db.destroy()]).then(() => process.exit(0)));
  };
  process.on('SIGINT', shutdown);
  process.on('SIGTERM', shutdown);
}

main().catch((error: unknown) => {
  process.stderr.write(`${startupFailureLine(error)}\n`);
  // The engine threads, the mail stand-in and the database would keep the process alive: leave now.
  process.exit(1);
});
