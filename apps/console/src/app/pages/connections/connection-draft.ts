/**
 * The connection form's values as the API's create and change requests, checked with the
 * contracts' own schemas. The password is write-only: left empty on a change, the stored one stays.
 */
import {
  createConnectionRequestSchema,
  updateConnectionRequestSchema,
  type Connection,
  type CreateConnectionRequest,
  type UpdateConnectionRequest,
} from '@tallyfit/contracts';

export interface ConnectionDraft {
  name: string;
  host: string;
  port: number | null;
  database: string;
  user: string;
  ssl: boolean;
  password: string;
}

export type ConnectionOutcome<T> = { ok: true; request: T } | { ok: false; errors: string[] };

export const EMPTY_CONNECTION: ConnectionDraft = { name: '', host: '', port: 5432, database: '', user: '', ssl: false, password: '' };

export function draftFromConnection(connection: Connection): ConnectionDraft {
  const { name, host, port, database, user, ssl } = connection;
  return { name, host, port, database, user, ssl, password: '' };
}

export function createConnectionFrom(draft: ConnectionDraft): ConnectionOutcome<CreateConnectionRequest> {
  const request: CreateConnectionRequest = { ...draft, kind: 'postgres', port: draft.port ?? Number.NaN };
  const checked = createConnectionRequestSchema.safeParse(request);
  return checked.success ? { ok: true, request } : { ok: false, errors: checked.error.issues.map((issue) => issue.message) };
}

/** Only what changed; nothing changed is said in words rather than sent. */
export function updateConnectionFrom(connection: Connection, draft: ConnectionDraft): ConnectionOutcome<UpdateConnectionRequest> {
  const request: UpdateConnectionRequest = {};
  const before = draftFromConnection(connection);
  for (const key of ['name', 'host', 'database', 'user'] as const) {
    if (draft[key] !== before[key]) request[key] = draft[key];
  }
  if (draft.port !== before.port) request.port = draft.port ?? Number.NaN;
  if (draft.ssl !== before.ssl) request.ssl = draft.ssl;
  if (draft.password) request.password = draft.password;
  if (Object.keys(request).length === 0) return { ok: false, errors: ['Nothing has changed.'] };
  const checked = updateConnectionRequestSchema.safeParse(request);
  return checked.success ? { ok: true, request } : { ok: false, errors: checked.error.issues.map((issue) => issue.message) };
}
