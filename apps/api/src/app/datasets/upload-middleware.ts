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
      if (fileKindOf(file.originalname)) callback(null, true);
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

function uploadError(error: unknown, limitBytes: number): unknown {
  if (!(error instanceof multer.MulterError)) return error;
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
