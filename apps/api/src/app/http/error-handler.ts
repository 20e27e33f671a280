import type { ErrorRequestHandler, RequestHandler } from 'express';
import { EngineInputError } from '@tallyfit/engine';
import { isStorageFull, storageFull } from '../storage/storage-full';
import { HttpError } from './http-error';

/** Any /api path no route claimed. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, 'not_found', `no such API route: ${req.method} ${req.path}`));
};

/**
 * The one place errors become responses: `{ error: { code, message, fields? } }`.
 * Unexpected errors are logged and answered with a generic 500, never with a stack trace.
 */
export const errorHandler: ErrorRequestHandler = (error, req, res, _next) => {
  const known = toHttpError(error);
  if (!known) {
    req.log?.error({ err: error }, 'unhandled error');
    res.status(500).json({ error: { code: 'internal', message: 'something went wrong on our side' } });
    return;
  }
  const body: { code: string; message: string; fields?: unknown } = { code: known.code, message: known.message };
  if (known.fields?.length) body.fields = known.fields;
  if (known.headers) res.set(known.headers);
  res.status(known.status).json({ error: body });
};

function toHttpError(error: unknown): HttpError | undefined {
  if (error instanceof HttpError) return error;
  if (isStorageFull(error)) return storageFull();
  if (error instanceof EngineInputError) {
    return new HttpError(400, 'invalid_input', error.message, error.issues);
  }
  // Body-parser errors carry a status and a type.
  const parserError = error as { status?: number; type?: string; message?: string };
  if (parserError?.type === 'entity.too.large') {
    return new HttpError(413, 'payload_too_large', 'the request body is larger than the limit');
  }
  if (parserError?.type === 'entity.parse.failed') {
    return new HttpError(400, 'invalid_json', 'the request body is not valid JSON');
  }
  if (typeof parserError?.status === 'number' && parserError.status >= 400 && parserError.status < 500) {
    return new HttpError(parserError.status, 'bad_request', parserError.message ?? 'bad request');
  }
  return undefined;
}
