import { createServer, type Server } from 'node:http';
import express from 'express';
import { ConfigError } from '../config';
import { listen, StartupError } from './listen';
import { startupFailureLine } from './startup-failure';

describe('starting the server', () => {
  let occupier: Server;
  let port: number;
  beforeAll(async () => {
    occupier = createServer();
    await new Promise<void>((resolve) => occupier.listen(0, '127.0.0.1', resolve));
    port = (occupier.address() as { port: number }).port;
  });
  afterAll(() => new Promise((resolve) => occupier.close(resolve)));

  it('fails with a clear reason when the port is taken, instead of claiming to run', async () => {
    const error = await listen(express(), port, '127.0.0.1').catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(StartupError);
    expect(startupFailureLine(error)).toBe(
      `Tallyfit could not start: port ${port} on 127.0.0.1 is already in use (by another program or another Tallyfit); set PORT to a free port`,
    );
  });

  it('never prints the SQL and values Knex puts in a database error (a password hash among them)', () => {
    const hash = '$2b$12$abcdefghijklmnopqrstuuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ0';
    const error = Object.assign(
      new Error(`insert into \`users\` (\`email\`, \`password_hash\`) values ('admin@demo.tallyfit.local', '${hash}') - UNIQUE constraint failed: users.email`),
      { code: 'SQLITE_CONSTRAINT_UNIQUE' },
    );
    const line = startupFailureLine(error);
    expect(line).toBe('Tallyfit could not start: the database refused a start-up step (SQLITE_CONSTRAINT_UNIQUE: UNIQUE constraint failed: users.email)');
    expect(line).not.toContain(hash);
  });

  it('prints one line for configuration problems', () => {
    expect(startupFailureLine(new ConfigError('PORT must be a whole number from 0 to 65535, got "x"'))).toBe(
      'Tallyfit could not start: PORT must be a whole number from 0 to 65535, got "x"',
    );
  });
});
