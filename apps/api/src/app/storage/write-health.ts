import { statfs } from 'node:fs/promises';
import type { ErrorRequestHandler, RequestHandler } from 'express';
import { isStorageFull } from './storage-full';

/** Below this much free space on the data folder's disk, health says writes will fail soon. */
export const LOW_DISK_BYTES = 16 * 1024 * 1024;

export interface WriteStatus {
  writable: boolean;
  /** Free bytes on the disk holding the data folder, when the system tells. */
  freeBytes: number | null;
  problem?: string;
}

/**
 * Whether writes are working, as health reports it: a write that failed for lack of space marks
 * storage as failing until a later write succeeds, and a nearly full disk counts as failing too.
 */
export class WriteHealth {
  private failedAt?: Date;

  constructor(private readonly dataDir: string) {}

  noteFailure(): void {
    this.failedAt = new Date();
  }

  noteSuccess(): void {
    this.failedAt = undefined;
  }

  async status(): Promise<WriteStatus> {
    const freeBytes = await freeBytesOn(this.dataDir);
    if (this.failedAt) {
      return { writable: false, freeBytes, problem: `a write failed for lack of disk space at ${this.failedAt.toISOString()}; none has succeeded since` };
    }
    if (freeBytes !== null && freeBytes < LOW_DISK_BYTES) {
      return { writable: false, freeBytes, problem: `the disk holding the data folder has only ${freeBytes} bytes free` };
    }
    return { writable: true, freeBytes };
  }

  /** Error middleware (before the error handler): notes storage-full failures and passes every error on. */
  readonly noteFailures: ErrorRequestHandler = (error, _req, _res, next) => {
    if (isStorageFull(error)) this.noteFailure();
    next(error);
  };

  /** Notes each write request that succeeded, which clears an earlier failure. */
  readonly noteSuccesses: RequestHandler = (req, res, next) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') {
      res.on('finish', () => {
        if (res.statusCode < 400) this.noteSuccess();
      });
    }
    next();
  };
}

async function freeBytesOn(folder: string): Promise<number | null> {
  try {
    const stats = await statfs(folder);
    return stats.bavail * stats.bsize;
  } catch {
    return null;
  }
}
