import { z } from 'zod';
import { Cron } from 'croner';
import { hypothesisSchema } from '@tallyfit/engine';
import { countSelectionSchema } from './datasets';
import { booleanQueryText, idText, pageQueryFields } from './pagination';
import { personRefSchema } from './people-ref';

/**
 * Watches: a standing check that a feed of counts keeps matching a hypothesis, tested after every
 * batch with the engine's anytime-valid sequential test. A watch holds until the sequential p falls
 * below α (alarm); a paused watch takes no batches and skips its scheduled pulls.
 */
export const WATCH_STATES = ['holding', 'alarm', 'paused'] as const;
export const watchStateSchema = z.enum(WATCH_STATES);
export type WatchState = z.infer<typeof watchStateSchema>;

/** Whether the watch's latest alarm still waits for a lead: none (no open alarm), waiting, acknowledged. */
export const WATCH_ALERT_STATES = ['none', 'waiting', 'acknowledged'] as const;
export const watchAlertStateSchema = z.enum(WATCH_ALERT_STATES);
export type WatchAlertState = z.infer<typeof watchAlertStateSchema>;

export const BATCH_SOURCES = ['push', 'pull', 'upload'] as const;
export const batchSourceSchema = z.enum(BATCH_SOURCES);
export type BatchSource = z.infer<typeof batchSourceSchema>;

const positiveId = (what: string) => z.number().int().positive({ message: `${what} must be a positive whole number` });
const isoDateTime = (what: string) =>
  z.string().refine((value) => !Number.isNaN(Date.parse(value)), { message: `${what} must be a date-time (ISO 8601)` });

const watchName = z.string().trim().min(1, { message: 'name must not be empty' }).max(200, { message: 'name must be at most 200 characters' });
const watchDescription = z.string().trim().max(2000, { message: 'description must be at most 2000 characters' });
const watchLabel = z
  .string()
  .trim()
  .min(1, { message: 'labels must not be empty' })
  .max(200, { message: 'labels must be at most 200 characters' });
const watchLabels = z
  .array(watchLabel)
  .min(2, { message: 'a watch needs at least 2 categories' })
  .max(1000, { message: 'a watch takes at most 1000 categories' })
  .refine((labels) => new Set(labels).size === labels.length, { message: 'labels must be different from each other' });
const watchAlpha = z
  .number()
  .gt(0, { message: 'alpha must be above 0' })
  .lt(1, { message: 'alpha must be below 1' });

/** A cron pattern (five, six or seven fields) as croner reads it; the pull runs at each of its times. */
export const cronScheduleSchema = z
  .string()
  .trim()
  .min(1, { message: 'schedule must not be empty' })
  .max(120, { message: 'schedule must be at most 120 characters' })
  .superRefine((pattern, context) => {
    try {
      new Cron(pattern, { paused: true });
    } catch (error) {
      context.addIssue({ code: 'custom', message: `schedule is not a cron pattern: ${(error as Error).message}` });
    }
  });

/** An IANA time zone (Europe/Oslo); the schedule's times are read in it, UTC when absent. */
export const timeZoneSchema = z
  .string()
  .trim()
  .min(1, { message: 'timezone must not be empty' })
  .max(64, { message: 'timezone must be at most 64 characters' })
  .refine(
    (zone) => {
      try {
        new Intl.DateTimeFormat('en', { timeZone: zone });
        return true;
      } catch {
        return false;
      }
    },
    { message: 'timezone must be an IANA time zone such as Europe/Oslo or UTC' },
  );

/** The SQL a pull runs: one statement returning `category, count`, with `:periodStart` and `:periodEnd` bound. */
const pullQuery = z
  .string()
  .trim()
  .min(1, { message: 'query must not be empty' })
  .max(20_000, { message: 'query must be at most 20000 characters' });

/**
 * Where a watch's counts come from:
 * - `push`: a pipeline posts each batch (`POST /watches/:id/batches`, an API token works);
 * - `pull`: a read-only query against a connected database, run on a cron schedule, each run counting
 *   the period since the previous scheduled time;
 * - `upload`: a dataset uploaded to the study is appended as a batch.
 */
export const watchFeedSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ kind: z.literal('push') }),
    z.object({
      kind: z.literal('pull'),
      connectionId: positiveId('feed.connectionId'),
      query: pullQuery,
      schedule: cronScheduleSchema,
      timezone: timeZoneSchema.optional(),
    }),
    z.object({ kind: z.literal('upload') }),
  ],
  { error: 'feed.kind must be one of push, pull, upload' },
);
export type WatchFeed = z.infer<typeof watchFeedSchema>;

/** The webhook a watch's alerts are posted to; the secret signs each body and is never returned. */
export const WEBHOOK_SIGNATURE_HEADER = 'X-Tallyfit-Signature';
/** The header's value: `sha256=` followed by the hex HMAC-SHA256 of the raw body under the secret. */
export const WEBHOOK_SIGNATURE_PREFIX = 'sha256=';

export const webhookSettingsRequestSchema = z.object({
  url: z
    .url({ protocol: /^https?$/, message: 'webhook.url must be an http or https address' })
    .max(2000, { message: 'webhook.url must be at most 2000 characters' }),
  /** Leave out on an update to keep the stored secret. */
  secret: z
    .string()
    .min(16, { message: 'webhook.secret must be at least 16 characters' })
    .max(200, { message: 'webhook.secret must be at most 200 characters' })
    .optional(),
});
export type WebhookSettingsRequest = z.infer<typeof webhookSettingsRequestSchema>;

export const webhookSettingsSchema = z.object({
  url: z.string(),
  hasSecret: z.boolean().describe('whether a signing secret is stored (the secret itself is never returned)'),
  signatureHeader: z.literal(WEBHOOK_SIGNATURE_HEADER),
});
export type WebhookSettings = z.infer<typeof webhookSettingsSchema>;

export const createWatchRequestSchema = z.object({
  studyId: positiveId('studyId'),
  name: watchName,
  description: watchDescription.optional(),
  labels: watchLabels,
  hypothesis: hypothesisSchema,
  alpha: watchAlpha.default(0.05),
  feed: watchFeedSchema,
  webhook: webhookSettingsRequestSchema.nullable().optional(),
});
export type CreateWatchRequest = z.input<typeof createWatchRequestSchema>;

/**
 * What can change after creation. Labels and hypothesis are fixed once batches exist (the
 * sequential test's evidence is about them); the service refuses such a change with a 409.
 */
export const updateWatchRequestSchema = z
  .object({
    name: watchName.optional(),
    description: watchDescription.nullable().optional(),
    labels: watchLabels.optional(),
    hypothesis: hypothesisSchema.optional(),
    alpha: watchAlpha.optional(),
    feed: watchFeedSchema.optional(),
    webhook: webhookSettingsRequestSchema.nullable().optional(),
  })
  .refine((body) => Object.values(body).some((value) => value !== undefined), {
    message: 'send at least one of name, description, labels, hypothesis, alpha, feed, webhook',
  });
export type UpdateWatchRequest = z.infer<typeof updateWatchRequestSchema>;

/**
 * Resuming a paused watch. The sequential p never increases, so an alarm stands until the test is
 * restarted: `restart` begins a fresh sequential test from the next batch (the batches so far stay
 * listed) and an alarm is cleared, for when the cause was found and fixed during the pause.
 */
export const resumeWatchRequestSchema = z.object({ restart: z.boolean().default(false) });
export type ResumeWatchRequest = z.input<typeof resumeWatchRequestSchema>;

/** A share's anytime-valid confidence sequence after a look, beside the hypothesis's share. */
export const watchShareSchema = z.object({
  label: z.string(),
  expected: z.number(),
  estimate: z.number(),
  lower: z.number(),
  upper: z.number(),
});
export type WatchShare = z.infer<typeof watchShareSchema>;

const studyRefSchema = z.object({ id: z.number().int(), name: z.string() });

export const watchSchema = z.object({
  id: z.number().int(),
  study: studyRefSchema,
  name: z.string(),
  description: z.string().nullable(),
  labels: z.array(z.string()),
  hypothesis: hypothesisSchema,
  alpha: z.number(),
  feed: watchFeedSchema,
  webhook: webhookSettingsSchema.nullable(),
  state: watchStateSchema,
  /** Whether the sequential test is below α (kept while paused; resuming returns to alarm or holding by it). */
  alarm: z.boolean(),
  alertState: watchAlertStateSchema,
  batchCount: z.number().int(),
  /** Observations the sequential test has taken in (since its last restart). */
  n: z.number().int(),
  sequentialP: z.number().describe('the anytime-valid p-value after the latest batch (1 before any batch; never increases)'),
  lastBatchAt: z.string().nullable().describe('when the latest batch was taken in'),
  lastPeriodEnd: z.string().nullable(),
  /** The latest failure of a scheduled pull or a delivery, kept until the next success. */
  lastError: z.string().nullable(),
  lastErrorAt: z.string().nullable(),
  nextPullAt: z.string().nullable(),
  createdBy: personRefSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Watch = z.infer<typeof watchSchema>;

/** The latest look's shares, returned with one watch (the list leaves them out). */
export const watchDetailSchema = watchSchema.extend({ shares: z.array(watchShareSchema) });
export type WatchDetail = z.infer<typeof watchDetailSchema>;

export const listWatchesQuerySchema = z.object({
  ...pageQueryFields(25),
  studyId: idText('studyId').optional(),
  state: watchStateSchema.optional(),
  feed: z.enum(['push', 'pull', 'upload'], { message: 'feed must be one of push, pull, upload' }).optional(),
  /** Only watches whose latest alarm waits for acknowledgement. */
  waiting: booleanQueryText('waiting').optional(),
  q: z.string().trim().min(1, { message: 'q must not be empty' }).max(200).optional(),
});
export type ListWatchesQuery = z.input<typeof listWatchesQuerySchema>;
export type ListWatchesFilters = z.output<typeof listWatchesQuerySchema>;

const idempotencyKey = z
  .string()
  .trim()
  .min(1, { message: 'idempotencyKey must not be empty' })
  .max(200, { message: 'idempotencyKey must be at most 200 characters' });

const batchCount = z
  .number({ message: 'each count must be a number' })
  .int({ message: 'counts must be whole numbers' })
  .nonnegative({ message: 'counts must not be negative' })
  .max(Number.MAX_SAFE_INTEGER, { message: 'counts must be at most 2^53 − 1' });

const period = {
  periodStart: isoDateTime('periodStart'),
  periodEnd: isoDateTime('periodEnd'),
};
const periodInOrder = (body: { periodStart: string; periodEnd: string }) => Date.parse(body.periodStart) <= Date.parse(body.periodEnd);
const periodOrderMessage = { message: 'periodStart must not be after periodEnd', path: ['periodEnd'] };

/**
 * A batch pushed by a pipeline: counts for every one of the watch's categories over one period.
 * Sending the same idempotency key again answers with the batch already stored, counted once.
 */
export const pushBatchRequestSchema = z
  .object({
    idempotencyKey,
    ...period,
    counts: z.record(z.string(), batchCount, { message: 'counts must be an object of category: count' }),
  })
  .refine(periodInOrder, periodOrderMessage);
export type PushBatchRequest = z.infer<typeof pushBatchRequestSchema>;

/** A dataset of the watch's study appended as a batch; the selection says which column(s) hold the categories. */
export const datasetBatchRequestSchema = z
  .object({
    datasetId: positiveId('datasetId'),
    selection: countSelectionSchema,
    ...period,
    /** Defaults to `dataset-<id>`, so the same dataset is appended once. */
    idempotencyKey: idempotencyKey.optional(),
  })
  .refine(periodInOrder, periodOrderMessage);
export type DatasetBatchRequest = z.infer<typeof datasetBatchRequestSchema>;

export const watchBatchSchema = z.object({
  id: z.number().int(),
  watchId: z.number().int(),
  sequence: z.number().int().describe('1 for the first batch of the watch, then 2, 3, …'),
  periodStart: z.string(),
  periodEnd: z.string(),
  counts: z.record(z.string(), z.number().int()),
  n: z.number().int().describe("this batch's observations"),
  idempotencyKey: z.string(),
  source: batchSourceSchema,
  datasetId: z.number().int().nullable(),
  analysisId: z.number().int().describe("the batch's own one-look analysis (today's fixed-sample tests)"),
  batchP: z.number().nullable().describe('the p-value of that one-look analysis'),
  cumulativeN: z.number().int(),
  sequentialP: z.number(),
  logBayesFactor: z.number(),
  alarm: z.boolean(),
  shares: z.array(watchShareSchema),
  createdBy: personRefSchema.nullable().describe('who pushed or uploaded it; null for a scheduled pull'),
  createdAt: z.string(),
});
export type WatchBatch = z.infer<typeof watchBatchSchema>;

/** The answer to a push: the batch, whether it was new, and the watch after it. */
export const pushBatchResponseSchema = z.object({
  batch: watchBatchSchema,
  /** false when the idempotency key had been seen: the stored batch is returned and nothing was counted again */
  created: z.boolean(),
  watch: watchSchema,
});
export type PushBatchResponse = z.infer<typeof pushBatchResponseSchema>;

export const listBatchesQuerySchema = z.object({ ...pageQueryFields(50) });
export type ListBatchesQuery = z.input<typeof listBatchesQuerySchema>;

export const ALERT_KINDS = ['alarm', 'cleared'] as const;
export const alertKindSchema = z.enum(ALERT_KINDS);
export type AlertKind = z.infer<typeof alertKindSchema>;

export const DELIVERY_CHANNELS = ['email', 'webhook'] as const;
export const deliveryChannelSchema = z.enum(DELIVERY_CHANNELS);
export const DELIVERY_STATUSES = ['pending', 'delivered', 'failed'] as const;
export const deliveryStatusSchema = z.enum(DELIVERY_STATUSES);
export type DeliveryStatus = z.infer<typeof deliveryStatusSchema>;

export const alertDeliverySchema = z.object({
  channel: deliveryChannelSchema,
  /** the e-mail address or the webhook URL */
  target: z.string(),
  status: deliveryStatusSchema,
  attempts: z.number().int(),
  lastError: z.string().nullable(),
  deliveredAt: z.string().nullable(),
});
export type AlertDelivery = z.infer<typeof alertDeliverySchema>;

/** A change of a watch's state: into alarm, or back to holding. */
export const watchAlertSchema = z.object({
  id: z.number().int(),
  watchId: z.number().int(),
  kind: alertKindSchema,
  /** The batch that changed the state; null when a restart cleared the alarm. */
  batchId: z.number().int().nullable(),
  sequentialP: z.number(),
  createdAt: z.string(),
  acknowledgedBy: personRefSchema.nullable(),
  acknowledgedAt: z.string().nullable(),
  note: z.string().nullable(),
  deliveries: z.array(alertDeliverySchema),
});
export type WatchAlert = z.infer<typeof watchAlertSchema>;

export const listAlertsQuerySchema = z.object({ ...pageQueryFields(25) });
export type ListAlertsQuery = z.input<typeof listAlertsQuerySchema>;

export const acknowledgeAlertRequestSchema = z.object({
  note: z.string().trim().max(2000, { message: 'note must be at most 2000 characters' }).optional(),
});
export type AcknowledgeAlertRequest = z.infer<typeof acknowledgeAlertRequestSchema>;

/** The body a webhook receives (signed; see WEBHOOK_SIGNATURE_HEADER). */
export const webhookPayloadSchema = z.object({
  event: z.enum(['watch.alarm', 'watch.cleared']),
  alertId: z.number().int(),
  watch: z.object({ id: z.number().int(), name: z.string(), studyId: z.number().int(), url: z.string() }),
  batch: z.object({ id: z.number().int(), periodStart: z.string(), periodEnd: z.string(), cumulativeN: z.number().int() }).nullable(),
  sequentialP: z.number(),
  alpha: z.number(),
  shares: z.array(watchShareSchema),
  at: z.string(),
});
export type WebhookPayload = z.infer<typeof webhookPayloadSchema>;

/** A team's own database a pull-fed watch reads from. The password is write-only. */
export const CONNECTION_KINDS = ['postgres'] as const;
export const connectionKindSchema = z.enum(CONNECTION_KINDS);

const connectionFields = {
  name: z.string().trim().min(1, { message: 'name must not be empty' }).max(200, { message: 'name must be at most 200 characters' }),
  kind: connectionKindSchema.default('postgres'),
  host: z.string().trim().min(1, { message: 'host must not be empty' }).max(255, { message: 'host must be at most 255 characters' }),
  port: z.number().int().min(1, { message: 'port must be between 1 and 65535' }).max(65535, { message: 'port must be between 1 and 65535' }).default(5432),
  database: z.string().trim().min(1, { message: 'database must not be empty' }).max(255, { message: 'database must be at most 255 characters' }),
  user: z.string().trim().min(1, { message: 'user must not be empty' }).max(255, { message: 'user must be at most 255 characters' }),
  ssl: z.boolean().default(false),
};
const connectionPassword = z.string().max(1000, { message: 'password must be at most 1000 characters' });

export const createConnectionRequestSchema = z.object({ ...connectionFields, password: connectionPassword });
export type CreateConnectionRequest = z.input<typeof createConnectionRequestSchema>;

/** Leave out the password to keep the stored one. */
export const updateConnectionRequestSchema = z
  .object({
    name: connectionFields.name.optional(),
    host: connectionFields.host.optional(),
    port: z.number().int().min(1, { message: 'port must be between 1 and 65535' }).max(65535, { message: 'port must be between 1 and 65535' }).optional(),
    database: connectionFields.database.optional(),
    user: connectionFields.user.optional(),
    ssl: z.boolean().optional(),
    password: connectionPassword.optional(),
  })
  .refine((body) => Object.values(body).some((value) => value !== undefined), {
    message: 'send at least one of name, host, port, database, user, ssl, password',
  });
export type UpdateConnectionRequest = z.infer<typeof updateConnectionRequestSchema>;

export const connectionSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  kind: connectionKindSchema,
  host: z.string(),
  port: z.number().int(),
  database: z.string(),
  user: z.string(),
  ssl: z.boolean(),
  hasPassword: z.boolean().describe('whether a password is stored (it is never returned)'),
  createdBy: personRefSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Connection = z.infer<typeof connectionSchema>;

export const connectionTestResultSchema = z.object({
  ok: z.boolean(),
  /** what the server said, in plain words (the database's version, or why it failed) */
  message: z.string(),
  elapsedMs: z.number(),
});
export type ConnectionTestResult = z.infer<typeof connectionTestResultSchema>;
