import type { Connection } from '@tallyfit/contracts';
import { createConnectionFrom, draftFromConnection, EMPTY_CONNECTION, updateConnectionFrom } from './connection-draft';

const stored: Connection = {
  id: 1,
  name: 'Shop events',
  kind: 'postgres',
  host: 'events.internal',
  port: 5432,
  database: 'shop',
  user: 'tallyfit_reader',
  ssl: true,
  hasPassword: true,
  createdBy: { id: 2, name: 'Ana Analyst' },
  createdAt: '2026-12-01T00:00:00Z',
  updatedAt: '2026-12-01T00:00:00Z',
};

describe('the connection form', () => {
  it('builds a new connection, password included', () => {
    const draft = { ...EMPTY_CONNECTION, name: 'Shop events', host: 'events.internal', database: 'shop', user: 'reader', password: 'pw' };
    expect(createConnectionFrom(draft)).toEqual({
      ok: true,
      request: { name: 'Shop events', kind: 'postgres', host: 'events.internal', port: 5432, database: 'shop', user: 'reader', ssl: false, password: 'pw' },
    });
  });

  it('names what is missing or out of range in the contract’s words', () => {
    const outcome = createConnectionFrom({ ...EMPTY_CONNECTION, port: 70_000 });
    expect(outcome.ok ? [] : outcome.errors).toEqual(
      expect.arrayContaining(['name must not be empty', 'host must not be empty', 'port must be between 1 and 65535']),
    );
  });

  it('sends only what changed and keeps the stored password when the field is left empty', () => {
    expect(updateConnectionFrom(stored, { ...draftFromConnection(stored), port: 6432 })).toEqual({ ok: true, request: { port: 6432 } });
    expect(updateConnectionFrom(stored, { ...draftFromConnection(stored), password: 'new' })).toEqual({ ok: true, request: { password: 'new' } });
    expect(updateConnectionFrom(stored, draftFromConnection(stored))).toEqual({ ok: false, errors: ['Nothing has changed.'] });
  });
});
