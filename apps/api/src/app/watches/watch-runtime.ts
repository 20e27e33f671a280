import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { Config } from '../config';
import type { EngineRunner } from '../engine/engine-runner';
import type { MailService } from '../mail/mail-service';
import { startAlertDispatcher, type AlertDispatcher, type DeliveryPolicy } from './alert-delivery';
import { startPullScheduler, type PullScheduler } from './pull-scheduler';
import type { WatchContext } from './watch-context';

/** The watches' background work: scheduled pulls and alert deliveries, beside the services' context. */
export interface WatchRuntime {
  context: WatchContext;
  scheduler: PullScheduler;
  dispatcher: AlertDispatcher;
  /** Waits until no pull or delivery is under way (tests). */
  idle(): Promise<void>;
  stop(): Promise<void>;
}

export interface WatchRuntimeOptions {
  db: Knex;
  engine: EngineRunner;
  mail: MailService;
  config: Pick<Config, 'secretKey' | 'publicUrl'>;
  logger: Logger;
  delivery?: Partial<DeliveryPolicy>;
  scheduleSyncMs?: number;
}

export function startWatchRuntime(options: WatchRuntimeOptions): WatchRuntime {
  const { db, engine, mail, config, logger } = options;
  const dispatcher = startAlertDispatcher({ db, mail, secretKey: config.secretKey, logger, policy: options.delivery });
  const context: WatchContext = {
    db,
    engine,
    secretKey: config.secretKey,
    publicUrl: config.publicUrl,
    // The scheduler is created just below; nothing calls this before then.
    scheduleChanged: () => void scheduler.sync().catch((error: unknown) => logger.error({ err: error }, 'schedules could not be re-read')),
    deliveriesQueued: () => dispatcher.kick(),
  };
  const scheduler = startPullScheduler({ ctx: context, logger, syncMs: options.scheduleSyncMs });
  return {
    context,
    scheduler,
    dispatcher,
    idle: async () => {
      await scheduler.idle();
      await dispatcher.idle();
    },
    stop: async () => {
      await scheduler.stop();
      await dispatcher.stop();
    },
  };
}
