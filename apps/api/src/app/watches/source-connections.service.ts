import knex, { type Knex } from 'knex';
import type { Connection, ConnectionTestResult, User, UpdateConnectionRequest, createConnectionRequestSchema } from '@tallyfit/contracts';
import type { z } from 'zod';
import { recordAudit } from '../audit/audit.service';
import { insertedId, isoDate, now } from '../http/db-time';
import { conflict, forbidden, notFound } from '../http/http-error';
import { open, seal } from './secret-box';

type CreateConnection = z.output<typeof createConnectionRequestSchema>;

interface ConnectionRow {
  id: number;
  name: string;
  kind: 'postgres';
  host: string;
  port: number;
  database_name: string;
  user_name: string;
  ssl: number | boolean;
  password_encrypted: string;
  created_by: number;
  creator_name: string;
  created_at: string | Date;
  updated_at: string | Date;
}

const toConnection = (row: ConnectionRow): Connection => ({
  id: row.id,
  name: row.name,
  kind: row.kind,
  host: row.host,
  port: row.port,
  database: row.database_name,
  user: row.user_name,
  ssl: Boolean(row.ssl),
  hasPassword: row.password_encrypted !== '',
  createdBy: { id: row.created_by, name: row.creator_name },
  createdAt: isoDate(row.created_at),
  updatedAt: isoDate(row.updated_at),
});

/** What the audit trail keeps of a connection: never the password. */
const auditView = (row: Pick<ConnectionRow, 'name' | 'host' | 'port' | 'database_name' | 'user_name'>) => ({
  name: row.name,
  host: row.host,
  port: row.port,
  database: row.database_name,
  user: row.user_name,
});

const selectConnections = (db: Knex) =>
  db('source_connections')
    .join('users', 'users.id', 'source_connections.created_by')
    .select('source_connections.*', 'users.name as creator_name')
    .whereNull('source_connections.deleted_at');

async function connectionRow(db: Knex, id: number): Promise<ConnectionRow> {
  const row = await selectConnections(db).where('source_connections.id', id).first();
  if (!row) throw notFound(`connection ${id} does not exist`);
  return row;
}

/** Connections are shared by the team's analysts; changing one is for its creator or an admin. */
async function changeableRow(db: Knex, caller: User, id: number): Promise<ConnectionRow> {
  const row = await connectionRow(db, id);
  if (caller.role !== 'admin' && row.created_by !== caller.id) throw forbidden('only its creator or an admin may change this connection');
  return row;
}

export async function listConnections(db: Knex): Promise<Connection[]> {
  const rows: ConnectionRow[] = await selectConnections(db).orderBy('source_connections.name');
  return rows.map(toConnection);
}

export async function getConnection(db: Knex, id: number): Promise<Connection> {
  return toConnection(await connectionRow(db, id));
}

export async function createConnection(db: Knex, key: Buffer, caller: User, request: CreateConnection): Promise<Connection> {
  const columns = {
    name: request.name,
    kind: request.kind,
    host: request.host,
    port: request.port,
    database_name: request.database,
    user_name: request.user,
    ssl: request.ssl,
    password_encrypted: seal(key, request.password),
    created_by: caller.id,
  };
  const id = await db.transaction(async (trx) => {
    const [row] = await trx('source_connections').insert(columns).returning('id');
    const newId = insertedId(row);
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'create',
      entityType: 'connection',
      entityId: newId,
      summary: `added the connection "${request.name}" (${request.user}@${request.host}:${request.port}/${request.database})`,
      after: auditView(columns),
    });
    return newId;
  });
  return getConnection(db, id);
}

export async function updateConnection(db: Knex, key: Buffer, caller: User, id: number, request: UpdateConnectionRequest): Promise<Connection> {
  const before = await changeableRow(db, caller, id);
  const changes = {
    ...(request.name !== undefined ? { name: request.name } : {}),
    ...(request.host !== undefined ? { host: request.host } : {}),
    ...(request.port !== undefined ? { port: request.port } : {}),
    ...(request.database !== undefined ? { database_name: request.database } : {}),
    ...(request.user !== undefined ? { user_name: request.user } : {}),
    ...(request.ssl !== undefined ? { ssl: request.ssl } : {}),
    ...(request.password !== undefined ? { password_encrypted: seal(key, request.password) } : {}),
  };
  await db.transaction(async (trx) => {
    await trx('source_connections').where({ id }).update({ ...changes, updated_at: now(trx) });
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'update',
      entityType: 'connection',
      entityId: id,
      summary: `edited the connection "${request.name ?? before.name}"${request.password !== undefined ? ' (new password)' : ''}`,
      before: auditView(before),
      after: auditView({ ...before, ...changes }),
    });
  });
  return getConnection(db, id);
}

/** Deletes a connection no watch reads from (soft: the audit trail still names it). */
export async function deleteConnection(db: Knex, caller: User, id: number): Promise<void> {
  const before = await changeableRow(db, caller, id);
  const users = await db('watches').where({ connection_id: id, feed_kind: 'pull' }).whereNull('deleted_at').pluck('name');
  if (users.length) throw conflict(`connection ${id} feeds ${users.length} watch(es) (${users.join(', ')}); change their feed first`);
  await db.transaction(async (trx) => {
    await trx('source_connections').where({ id }).update({ deleted_at: now(trx) });
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'delete',
      entityType: 'connection',
      entityId: id,
      summary: `deleted the connection "${before.name}"`,
      before: auditView(before),
    });
  });
}

/** A Knex pool of one connection to a team's database (the caller destroys it). */
export async function openSourceDatabase(db: Knex, key: Buffer, id: number): Promise<Knex> {
  const row = await connectionRow(db, id);
  return knex({
    client: 'pg',
    connection: {
      host: row.host,
      port: row.port,
      database: row.database_name,
      user: row.user_name,
      password: open(key, row.password_encrypted),
      ssl: Boolean(row.ssl),
      connectionTimeoutMillis: 10_000,
      application_name: 'tallyfit-watch',
    },
    pool: { min: 0, max: 1 },
    // Failures reach the caller as errors (and the watch's lastError); knex need not print them too.
    log: { warn: () => undefined, error: () => undefined, deprecate: () => undefined, debug: () => undefined },
  });
}

/** Connects and asks the server its version, in plain words either way. */
export async function testConnection(db: Knex, key: Buffer, id: number): Promise<ConnectionTestResult> {
  const started = performance.now();
  const source = await openSourceDatabase(db, key, id);
  try {
    const result = await source.raw('select version() as version');
    const version = String(result.rows?.[0]?.version ?? 'PostgreSQL').split(' on ')[0];
    return { ok: true, message: `connected: ${version}`, elapsedMs: Math.round(performance.now() - started) };
  } catch (error) {
    return { ok: false, message: `could not connect: ${error instanceof Error ? error.message : String(error)}`, elapsedMs: Math.round(performance.now() - started) };
  } finally {
    await source.destroy();
  }
}
