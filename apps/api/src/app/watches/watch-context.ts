import type { Knex } from 'knex';
import type { EngineRunner } from '../engine/engine-runner';

/** What the watch services need from the server: its database, engine, key, and the background runtime's doorbells. */
export interface WatchContext {
  db: Knex;
  engine: EngineRunner;
  /** Seals connection passwords and webhook secrets (see secret-box.ts). */
  secretKey: Buffer;
  /** The console's address, for links in alert e-mails and webhook bodies. */
  publicUrl: string;
  /** A watch's schedule may have changed (created, edited, paused, resumed, deleted): re-arm it. */
  scheduleChanged(watchId: number): void;
  /** New alert deliveries are waiting: send them now rather than at the next poll. */
  deliveriesQueued(): void;
}
