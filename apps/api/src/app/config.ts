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
  /** 32 bytes that encrypt stored credentials (connection passwords, webhook secrets) with AES-256-GCM. */
  secretKey: Buffer;
  accessTokenTtlSeconds: number;
  refreshTokenTtlSeconds: number;
  /** Failed sign-ins allowed per address and e-mail in a 15-minute window. */
  loginAttemptsPer15Minutes: number;
  /** Longest one engine run may take before it is stopped. */
  engineTimeLimitMs: number;
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
}

export class ConfigError extends Error {}

type Env = Record<string, string | undefined>;

/** Reads and checks configuration from the environment. Throws ConfigError naming the bad variable. */
export function loadConfig(env: Env, cwd = process.cwd()): Config {
  const dataDir = absolute(env['TALLYFIT_DATA_DIR'] ?? 'data', cwd);
  mkdirSync(dataDir, { recursive: true });
  const consoleDir = absolute(env['TALLYFIT_CONSOLE_DIR'] ?? 'dist/apps/console/browser', cwd);
  return {
    port: integer(env, 'PORT', 3000, 0, 65535),
    host: env['HOST'] ?? '127.0.0.1',
    dataDir,
    databaseUrl: env['DATABASE_URL'] || undefined,
    jwtSecret: env['JWT_SECRET'] || secretFromDataDir(dataDir),
    secretKey: env['TALLYFIT_SECRET_KEY'] ? parseSecretKey(env['TALLYFIT_SECRET_KEY']) : secretKeyFromDataDir(dataDir),
    accessTokenTtlSeconds: integer(env, 'ACCESS_TOKEN_TTL_SECONDS', 900, 30, 86_400),
    refreshTokenTtlSeconds: integer(env, 'REFRESH_TOKEN_TTL_SECONDS', 14 * 86_400, 60, 365 * 86_400),
    loginAttemptsPer15Minutes: integer(env, 'LOGIN_ATTEMPTS_PER_15_MINUTES', 10, 1, 10_000),
    engineTimeLimitMs: integer(env, 'ENGINE_TIME_LIMIT_SECONDS', 30, 1, 3600) * 1000,
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
  };
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

function flag(env: Env, name: string, fallback: boolean): boolean {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  if (['1', 'true', 'yes'].includes(raw.toLowerCase())) return true;
  if (['0', 'false', 'no'].includes(raw.toLowerCase())) return false;
  throw new ConfigError(`${name} must be true or false, got "${raw}"`);
}

/** A secret generated on first start and kept beside the database, readable by its owner only. */
function secretFromDataDir(dataDir: string, fileName = 'jwt-secret', bytes = 48): string {
  const file = join(dataDir, fileName);
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  const secret = randomBytes(bytes).toString('base64url');
  writeFileSync(file, secret + '\n', { mode: 0o600 });
  return secret;
}

function secretKeyFromDataDir(dataDir: string): Buffer {
  const key = Buffer.from(secretFromDataDir(dataDir, 'secret-key', 32), 'base64url');
  if (key.length !== 32) throw new ConfigError(`${join(dataDir, 'secret-key')} must hold 32 bytes (base64url); remove it only if nothing was encrypted with it`);
  return key;
}

/** TALLYFIT_SECRET_KEY: 32 bytes written as 64 hex digits or as base64. */
function parseSecretKey(raw: string): Buffer {
  const text = raw.trim();
  const key = /^[0-9a-fA-F]{64}$/.test(text) ? Buffer.from(text, 'hex') : Buffer.from(text, 'base64');
  if (key.length !== 32) {
    throw new ConfigError('TALLYFIT_SECRET_KEY must be 32 bytes written as 64 hex digits or as base64 (e.g. `openssl rand -hex 32`)');
  }
  return key;
}
