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
