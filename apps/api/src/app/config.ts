import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { isAbsolute, join, resolve } from 'node:path';

export interface Config {
  port: number;
  host: string;
  /** Where the embedded database, the generated JWT secret and the demo sign-ins live. */
  dataDir: string;
  /** A PostgreSQL connection string; when absent the embedded SQLite file is used. */
  databaseUrl?: string;
  jwtSecret: string;
  accessTokenTtlSeconds: number;
  refreshTokenTtlSeconds: number;
  /** Failed sign-ins allowed per address and e-mail in a 15-minute window. */
  loginAttemptsPer15Minutes: number;
  /** Longest one engine run may compute (from when it starts on a thread) before it is stopped. */
  engineTimeLimitMs: number;
  /** Longest an engine run may wait for a thread before it is refused as queued too long. */
  engineQueueWaitMs: number;
  /** Largest dataset file accepted, in bytes. */
  uploadLimitBytes: number;
  /** The mail server (smtp:// or smtps:// URL); absent: the API starts its local SMTP stand-in. */
  smtpUrl?: string;
  /** The sender of shared reports. */
  mailFrom: string;
  /** The address people open Tallyfit at, for links in e-mails. */
  publicUrl: string;
  /** The shipped fonts (fonts/ in the repository), for PDF reports. */
  fontsDir: string;
  /** The built console to serve beside the API, if it exists. */
  consoleDir?: string;
  /** Origin the console is served from when it is not served by the API itself (CORS). */
  consoleOrigin?: string;
  seedDemo: boolean;
  /** A fixed password for every demo person (tests); otherwise one is generated per data folder. */
  demoPassword?: string;
  logLevel: string;
  /**
   * Which proxies may state the client's address in X-Forwarded-For (Express's "trust proxy"):
   * false unless TRUST_PROXY is set, so a client cannot pick its own address for the sign-in limit.
   */
  trustProxy: boolean | number | string;
}

export class ConfigError extends Error {}

type Env = Record<string, string | undefined>;

/** Reads and checks configuration from the environment. Throws ConfigError naming the bad variable. */
export function loadConfig(env: Env, cwd = process.cwd()): Config {
  const dataDir = dataDirFrom(env, cwd);
  mkdirSync(dataDir, { recursive: true, mode: 0o700 });
  const consoleDir = absolute(env['TALLYFIT_CONSOLE_DIR'] ?? 'dist/apps/console/browser', cwd);
  return {
    port: integer(env, 'PORT', 3000, 0, 65535),
    host: env['HOST'] ?? '127.0.0.1',
    dataDir,
    databaseUrl: env['DATABASE_URL'] || undefined,
    jwtSecret: env['JWT_SECRET'] || secretFromDataDir(dataDir),
    accessTokenTtlSeconds: integer(env, 'ACCESS_TOKEN_TTL_SECONDS', 900, 30, 86_400),
    refreshTokenTtlSeconds: integer(env, 'REFRESH_TOKEN_TTL_SECONDS', 14 * 86_400, 60, 365 * 86_400),
    loginAttemptsPer15Minutes: integer(env, 'LOGIN_ATTEMPTS_PER_15_MINUTES', 10, 1, 10_000),
    engineTimeLimitMs: integer(env, 'ENGINE_TIME_LIMIT_SECONDS', 30, 1, 3600) * 1000,
    engineQueueWaitMs: integer(env, 'ENGINE_QUEUE_WAIT_SECONDS', 30, 1, 3600) * 1000,
    uploadLimitBytes: integer(env, 'UPLOAD_LIMIT_MB', 2048, 1, 100_000) * 1024 * 1024,
    smtpUrl: env['SMTP_URL'] || undefined,
    mailFrom: env['MAIL_FROM'] || 'Tallyfit <tallyfit@localhost>',
    publicUrl: (env['PUBLIC_URL'] || `http://localhost:${integer(env, 'PORT', 3000, 0, 65535)}`).replace(/\/+$/, ''),
    fontsDir: absolute(env['TALLYFIT_FONTS_DIR'] ?? 'fonts', cwd),
    consoleDir: existsSync(join(consoleDir, 'index.html')) ? consoleDir : undefined,
    consoleOrigin: env['CONSOLE_ORIGIN'] || undefined,
    seedDemo: flag(env, 'TALLYFIT_DEMO_SEED', true),
    demoPassword: env['TALLYFIT_DEMO_PASSWORD'] || undefined,
    logLevel: env['LOG_LEVEL'] ?? 'info',
    trustProxy: trustProxy(env),
  };
}

/** The data folder (TALLYFIT_DATA_DIR, default ./data); also read by the backup and restore commands. */
export function dataDirFrom(env: Env, cwd = process.cwd()): string {
  return absolute(env['TALLYFIT_DATA_DIR'] ?? 'data', cwd);
}

function absolute(path: string, cwd: string): string {
  return isAbsolute(path) ? path : resolve(cwd, path);
}

function integer(env: Env, name: string, fallback: number, min: number, max: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const value = Number(raw);
  if (!Number.isInteger(value) || value < min || value > max) {
    throw new ConfigError(`${name} must be a whole number from ${min} to ${max}, got "${raw}"`);
  }
  return value;
}

/** TRUST_PROXY: unset or "false" trusts no proxy; a number of hops; or addresses/subnets/"loopback", comma-separated. */
function trustProxy(env: Env): boolean | number | string {
  const raw = (env['TRUST_PROXY'] ?? '').trim();
  if (raw === '' || raw.toLowerCase() === 'false') return false;
  if (/^\d+$/.test(raw)) return Number(raw);
  if (!/^[0-9A-Za-z.:/, -]+$/.test(raw)) {
    throw new ConfigError(`TRUST_PROXY must be false, a number of proxies, or addresses/subnets such as "loopback" or "10.0.0.0/8", got "${raw}"`);
  }
  return raw;
}

function flag(env: Env, name: string, fallback: boolean): boolean {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  if (['1', 'true', 'yes'].includes(raw.toLowerCase())) return true;
  if (['0', 'false', 'no'].includes(raw.toLowerCase())) return false;
  throw new ConfigError(`${name} must be true or false, got "${raw}"`);
}

/** A secret generated on first start and kept beside the database, readable by its owner only. */
function secretFromDataDir(dataDir: string): string {
  const file = join(dataDir, 'jwt-secret');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  const secret = randomBytes(48).toString('base64url');
  try {
    // 'wx': of two processes starting at once, one writes the secret and both read that one.
    writeFileSync(file, secret + '\n', { mode: 0o600, flag: 'wx' });
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
    return readFileSync(file, 'utf8').trim();
  }
  return secret;
}
