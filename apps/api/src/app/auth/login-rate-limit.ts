import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { HttpError } from '../http/http-error';

const WINDOW_MS = 15 * 60 * 1000;

/**
 * Failed sign-ins are limited per address and e-mail (successful ones do not count), so guessing
 * passwords is slow while one person's typos do not lock out a whole office behind one address.
 * One limiter per app instance: its counts live in memory.
 */
export function loginRateLimit(attemptsPer15Minutes: number): RequestHandler {
  return rateLimit({
    windowMs: WINDOW_MS,
    limit: attemptsPer15Minutes,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    keyGenerator: (req) => {
      const email = typeof req.body?.email === 'string' ? req.body.email.toLowerCase() : '';
      return `${ipKeyGenerator(req.ip ?? '')}|${email}`;
    },
    handler: (_req, _res, next) => {
      next(
        new HttpError(
          429,
          'too_many_attempts',
          `too many failed sign-ins for this e-mail from this address; wait ${WINDOW_MS / 60_000} minutes and try again`,
        ),
      );
    },
  });
}
