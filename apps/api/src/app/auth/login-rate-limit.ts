import type { RequestHandler } from 'express';
import type { Knex } from 'knex';
import { insertedId } from '../http/db-time';
import { HttpError } from '../http/http-error';

const WINDOW_MS = 15 * 60 * 1000;
/** One address may fail this many times the per-account limit (an office behind one address, many people). */
const ADDRESS_FACTOR = 5;

/**
 * Limits failed sign-ins per account (the e-mail tried) and per address, counted in the database
 * so every server sharing it applies one limit. Each attempt is written before the password is
 * checked, then counted with those before it: parallel guesses are counted too. A sign-in that
 * succeeds (or is refused for bad input) removes its row, so only failures count. The address is
 * the client's unless TRUST_PROXY names a proxy whose X-Forwarded-For is believed.
 */
export function loginRateLimit(db: Knex, attemptsPer15Minutes: number): RequestHandler {
  return (req, res, next) => {
    const email = typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase().slice(0, 320) : '';
    const address = (req.ip ?? '').slice(0, 64);
    const nowMs = Date.now();
    const since = nowMs - WINDOW_MS;
    void (async () => {
      await db('sign_in_attempts').where('attempted_at_ms', '<', since).delete();
      const [row] = await db('sign_in_attempts').insert({ email, address, attempted_at_ms: nowMs }).returning('id');
      const id = insertedId(row);
      const count = async (column: 'email' | 'address', value: string) => {
        const [{ n }] = await db('sign_in_attempts').where(column, value).andWhere('attempted_at_ms', '>=', since).andWhere('id', '<=', id).count({ n: '*' });
        return Number(n);
      };
      if ((await count('email', email)) > attemptsPer15Minutes || (await count('address', address)) > attemptsPer15Minutes * ADDRESS_FACTOR) {
        return next(
          new HttpError(429, 'too_many_attempts', `too many failed sign-ins for this e-mail or from this address; wait ${WINDOW_MS / 60_000} minutes and try again`, undefined, {
            'Retry-After': String(WINDOW_MS / 1000),
          }),
        );
      }
      res.on('finish', () => {
        if (res.statusCode !== 401) void db('sign_in_attempts').where({ id }).delete().catch(() => undefined);
      });
      next();
    })().catch(next);
  };
}
