import { randomBytes } from 'node:crypto';
import { mkdirSync, rmSync } from 'node:fs';
import type { RequestHandler } from 'express';
import multer from 'multer';
import { HttpError, badRequest } from '../http/http-error';
import { fileKindOf, readableExtensions } from './file-kind';

export const unsupportedFileType = (fileName: string) =>
  new HttpError(415, 'unsupported_media_type', `"${fileName}" is not a kind of file we read; send a CSV, TSV or XLSX file (${readableExtensions.join(', ')})`);

/**
 * Receives one file in the multipart field `file`, written straight to a temporary folder on disk
 * (never held in memory), refusing a form without one, kinds we do not read and files over the
 * size limit. The file
 * is removed when the response closes; a handler that keeps it moves it first.
 */
export function receiveDatasetFile(tempDir: string, limitBytes: number): RequestHandler {
  mkdirSync(tempDir, { recursive: true });
  const upload = multer({
    storage: multer.diskStorage({
      destination: tempDir,
      filename: (_req, _file, callback) => callback(null, `upload-${randomBytes(12).toString('hex')}`),
    }),
    limits: { fileSize: limitBytes, files: 1, fields: 10, fieldSize: 1000, parts: 12 },
    fileFilter: (_req, file, callback) => {
      // A control character (a NUL above all) in a name would be stored and shown as is; refuse it.
      if (hasControlCharacter(file.originalname)) callback(controlCharacterInName());
      else if (fileKindOf(file.originalname)) callback(null, true);
      else callback(unsupportedFileType(file.originalname));
    },
  }).single('file');

  return (req, res, next) => {
    if (!req.is('multipart/form-data')) {
      next(new HttpError(415, 'unsupported_media_type', 'send the dataset as multipart/form-data with the file in the field named "file"'));
      return;
    }
    // The received file is temporary whatever the answer: removed once the response is done.
    res.once('close', () => {
      if (req.file) rmSync(req.file.path, { force: true });
    });
    upload(req, res, (error: unknown) => {
      if (error) return next(uploadError(error, limitBytes));
      if (!req.file) return next(badRequest('send the dataset in the multipart field named "file"', [{ path: 'file', message: 'a file is required' }]));
      next();
    });
  };
}

/** C0 controls (NUL to U+001F) and DEL. */
const hasControlCharacter = (name: string) => [...name].some((char) => char.charCodeAt(0) < 0x20 || char.charCodeAt(0) === 0x7f);

const controlCharacterInName = () =>
  badRequest('the file name contains a control character (such as NUL); rename the file and send it again', [
    { path: 'file', message: 'file name with a control character' },
  ]);

/**
 * The multipart parser's own complaints (no boundary, a body that ends early, a malformed part
 * header) are the client's: a 400 that passes the parser's reason on. Errors of the disk (a
 * system error with a code, such as ENOSPC) and our own HTTP errors pass through unchanged.
 */
function uploadError(error: unknown, limitBytes: number): unknown {
  if (error instanceof HttpError) return error;
  if (!(error instanceof multer.MulterError)) {
    if (!(error instanceof Error) || (error as NodeJS.ErrnoException).code !== undefined) return error;
    return new HttpError(400, 'malformed_upload', `the upload is not a well-formed multipart/form-data body (${error.message.replace(/^Multipart: /, '')}); send the file in the field named "file"`);
  }
  switch (error.code) {
    case 'LIMIT_FILE_SIZE':
      return new HttpError(413, 'payload_too_large', `the file is larger than the upload limit of ${formatBytes(limitBytes)}`);
    case 'LIMIT_UNEXPECTED_FILE':
    case 'LIMIT_FILE_COUNT':
      return badRequest('send exactly one file, in the field named "file"', [{ path: 'file', message: 'one file expected here' }]);
    default:
      return badRequest('the upload form has too many or too large fields; send the file and at most the column choice');
  }
}

export function formatBytes(bytes: number): string {
  if (bytes >= 1024 ** 3) return `${(bytes / 1024 ** 3).toFixed(bytes % 1024 ** 3 === 0 ? 0 : 1)} GB`;
  if (bytes >= 1024 ** 2) return `${(bytes / 1024 ** 2).toFixed(bytes % 1024 ** 2 === 0 ? 0 : 1)} MB`;
  return `${bytes} bytes`;
}
