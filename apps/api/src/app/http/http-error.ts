export interface FieldProblem {
  path: string;
  message: string;
}

/** An error the client caused or must know about; the error handler turns it into JSON with this status. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: FieldProblem[],
    /** Response headers that belong to this answer, e.g. Retry-After on a 503. */
    readonly headers?: Record<string, string>,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, fields?: FieldProblem[]) =>
  new HttpError(400, 'invalid_input', message, fields);
export const unauthorized = (message = 'sign in first: this needs a valid bearer token') =>
  new HttpError(401, 'unauthorized', message);
export const forbidden = (message = 'your role does not allow this') => new HttpError(403, 'forbidden', message);
export const notFound = (message: string) => new HttpError(404, 'not_found', message);
export const conflict = (message: string) => new HttpError(409, 'conflict', message);
export const unprocessable = (message: string, fields?: FieldProblem[]) =>
  new HttpError(422, 'unprocessable', message, fields);

/** The server cannot take this now; `retryAfterSeconds` tells the client when to try again. */
export const unavailable = (code: string, message: string, retryAfterSeconds: number) =>
  new HttpError(503, code, message, undefined, { 'Retry-After': String(Math.max(1, Math.ceil(retryAfterSeconds))) });
