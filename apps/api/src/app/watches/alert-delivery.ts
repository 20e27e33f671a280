import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { WEBHOOK_SIGNATURE_HEADER } from '@tallyfit/contracts';
import { dbTime, now } from '../http/db-time';
import type { MailService } from '../mail/mail-service';
import { open } from './secret-box';
import type { AlertMail } from './watch-alerts.service';
import { webhookSignature } from './webhook-signature';

export interface DeliveryPolicy {
  /** Tries per delivery before it is marked failed. */
  maxAttempts: number;
  /** The wait after the first failed try; each further failure doubles it (capped at an hour). */
  firstRetryMs: number;
  /** How often due deliveries are looked for (retries, and anything another server queued). */
  pollMs: number;
  /** How long one server holds a delivery it is trying, so no other server tries it meanwhile. */
  claimMs: number;
  /** How long a webhook receiver may take to answer. */
  webhookTimeoutMs: number;
}

export const DEFAULT_DELIVERY_POLICY: DeliveryPolicy = {
  maxAttempts: 6,
  firstRetryMs: 10_000,
  pollMs: 5_000,
  claimMs: 60_000,
  webhookTimeoutMs: 10_000,
};

interface DueDelivery {
  id: number;
  channel: 'email' | 'webhook';
  target: string;
  payload_json: string;
  attempts: number;
  webhook_secret_encrypted: string | null;
}

/** Exponential back-off: first, 2×first, 4×first, … capped at one hour. */
export const retryDelayMs = (policy: Pick<DeliveryPolicy, 'firstRetryMs'>, failedAttempts: number): number =>
  Math.min(policy.firstRetryMs * 2 ** (failedAttempts - 1), 3_600_000);

export interface AlertDispatcher {
  /** Send what is due now (called after a commit that queued deliveries). */
  kick(): void;
  /** Resolves once no sending is under way (tests wait on it). */
  idle(): Promise<void>;
  stop(): Promise<void>;
}

export interface DispatcherDeps {
  db: Knex;
  mail: MailService;
  secretKey: Buffer;
  logger: Logger;
  policy?: Partial<DeliveryPolicy>;
}

/**
 * Sends alert deliveries: e-mails through the mail service, webhooks as signed POSTs. Each try is
 * recorded; a failure is retried with exponential back-off until `maxAttempts`, then marked failed
 * with the last error. Deliveries live in the database, so a restart resumes them.
 */
export function startAlertDispatcher(deps: DispatcherDeps): AlertDispatcher {
  const policy = { ...DEFAULT_DELIVERY_POLICY, ...deps.policy };
  const { db } = deps;
  let running: Promise<void> | undefined;
  let again = false;
  let stopped = false;

  const at = (offsetMs: number) => dbTime(db, new Date(Date.now() + offsetMs).toISOString());

  async function attempt(delivery: DueDelivery): Promise<void> {
    if (delivery.channel === 'email') {
      const mail = JSON.parse(delivery.payload_json) as AlertMail;
      await deps.mail.send({ to: [delivery.target], subject: mail.subject, text: mail.text });
      return;
    }
    if (!delivery.webhook_secret_encrypted) throw new Error('the watch no longer has a webhook secret');
    const body = delivery.payload_json;
    const response = await fetch(delivery.target, {
      method: 'POST',
      headers: {
        'content-type': 'application/json',
        'user-agent': 'Tallyfit alerts',
        [WEBHOOK_SIGNATURE_HEADER]: webhookSignature(open(deps.secretKey, delivery.webhook_secret_encrypted), body),
      },
      body,
      redirect: 'manual',
      signal: AbortSignal.timeout(policy.webhookTimeoutMs),
    });
    if (!response.ok) throw new Error(`the receiver answered HTTP ${response.status}`);
  }

  async function sendDue(): Promise<void> {
    for (;;) {
      const due: DueDelivery[] = await db('alert_deliveries')
        .join('watch_alerts', 'watch_alerts.id', 'alert_deliveries.alert_id')
        .join('watches', 'watches.id', 'watch_alerts.watch_id')
        .where('alert_deliveries.status', 'pending')
        .where('alert_deliveries.next_attempt_at', '<=', at(0))
        .where((inner) => inner.whereNull('alert_deliveries.claimed_until').orWhere('alert_deliveries.claimed_until', '<', at(0)))
        .orderBy('alert_deliveries.id')
        .limit(20)
        .select('alert_deliveries.id', 'channel', 'target', 'payload_json', 'attempts', 'watches.webhook_secret_encrypted');
      if (!due.length || stopped) return;
      for (const delivery of due) {
        // Claimed by a guarded update: of two servers, only one finds it still unclaimed.
        const claimed = await db('alert_deliveries')
          .where({ id: delivery.id, status: 'pending' })
          .where((inner) => inner.whereNull('claimed_until').orWhere('claimed_until', '<', at(0)))
          .update({ claimed_until: at(policy.claimMs) });
        if (claimed !== 1) continue;
        const attempts = delivery.attempts + 1;
        try {
          await attempt(delivery);
          await db('alert_deliveries').where({ id: delivery.id }).update({ status: 'delivered', attempts, delivered_at: now(db), claimed_until: null });
        } catch (error) {
          const reason = error instanceof Error ? error.message : String(error);
          const finalTry = attempts >= policy.maxAttempts;
          deps.logger.warn({ deliveryId: delivery.id, channel: delivery.channel, attempts, reason }, 'alert delivery failed');
          await db('alert_deliveries')
            .where({ id: delivery.id })
            .update({
              status: finalTry ? 'failed' : 'pending',
              attempts,
              last_error: reason.slice(0, 1000),
              next_attempt_at: at(finalTry ? 0 : retryDelayMs(policy, attempts)),
              claimed_until: null,
            });
        }
      }
    }
  }

  function kick(): void {
    if (stopped) return;
    if (running) {
      again = true;
      return;
    }
    running = sendDue()
      .catch((error: unknown) => deps.logger.error({ err: error }, 'alert deliveries could not be sent'))
      .finally(() => {
        running = undefined;
        if (again) {
          again = false;
          kick();
        }
      });
  }

  const timer = setInterval(kick, policy.pollMs);
  timer.unref();
  kick();

  return {
    kick,
    idle: async () => {
      while (running) await running;
    },
    stop: async () => {
      stopped = true;
      clearInterval(timer);
      while (running) await running;
    },
  };
}
