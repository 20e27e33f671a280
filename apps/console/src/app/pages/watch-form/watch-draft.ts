/**
 * The watch form's values turned into the API's create and change requests, checked against the
 * contracts' own schemas (so the form says the same as the API), and the form filled back from a
 * stored watch.
 */
import {
  createWatchRequestSchema,
  updateWatchRequestSchema,
  type CreateWatchRequest,
  type UpdateWatchRequest,
  type WatchDetail,
  type WatchFeed,
  type WebhookSettingsRequest,
} from '@tallyfit/contracts';
import type { Hypothesis } from '@tallyfit/engine';
import { Cron } from 'croner';

export type FeedKind = WatchFeed['kind'];

export interface WatchDraft {
  studyId: number | null;
  name: string;
  description: string;
  /** the categories, one per line or separated by commas */
  labels: string;
  alpha: number | null;
  feedKind: FeedKind;
  connectionId: number | null;
  query: string;
  schedule: string;
  timezone: string;
  webhookUrl: string;
  /** empty keeps a stored secret when changing a watch */
  webhookSecret: string;
}

export type Checked<T> = { ok: true; request: T } | { ok: false; errors: string[] };

/** The categories as written: one per line, or separated by commas; blanks dropped. */
export function labelsFrom(text: string): string[] {
  return text
    .split(text.includes('\n') ? /\r?\n/ : /,/)
    .map((label) => label.trim())
    .filter((label) => label.length > 0);
}

function feedFrom(draft: WatchDraft): WatchFeed {
  switch (draft.feedKind) {
    case 'pull':
      return {
        kind: 'pull',
        connectionId: draft.connectionId ?? 0,
        query: draft.query,
        schedule: draft.schedule,
        ...(draft.timezone.trim() ? { timezone: draft.timezone.trim() } : {}),
      };
    case 'upload':
      return { kind: 'upload' };
    default:
      return { kind: 'push' };
  }
}

function webhookFrom(draft: WatchDraft): WebhookSettingsRequest | null {
  if (!draft.webhookUrl.trim()) return null;
  return { url: draft.webhookUrl.trim(), ...(draft.webhookSecret ? { secret: draft.webhookSecret } : {}) };
}

/** A new watch's request, or what is wrong with it in the contract's words. */
export function createRequestFrom(draft: WatchDraft, hypothesis: Hypothesis | null): Checked<CreateWatchRequest> {
  const errors: string[] = [];
  if (draft.studyId === null) errors.push('Choose the study the watch belongs to.');
  if (!hypothesis) errors.push('Say what shares are expected.');
  if (draft.feedKind === 'pull' && draft.connectionId === null) errors.push('Choose the database the query runs against.');
  const request: CreateWatchRequest = {
    studyId: draft.studyId ?? 0,
    name: draft.name,
    ...(draft.description.trim() ? { description: draft.description } : {}),
    labels: labelsFrom(draft.labels),
    hypothesis: hypothesis ?? { kind: 'equal' },
    alpha: draft.alpha ?? Number.NaN,
    feed: feedFrom(draft),
    webhook: webhookFrom(draft),
  };
  const checked = createWatchRequestSchema.safeParse(request);
  if (!checked.success) errors.push(...checked.error.issues.filter((issue) => !idIssue(issue.path)).map((issue) => issue.message));
  return errors.length > 0 ? { ok: false, errors: unique(errors) } : { ok: true, request };
}

/**
 * A change's request: only what differs from the stored watch. Categories and hypothesis are left
 * out once batches exist (the API refuses to change them then; the form shows them fixed).
 */
export function updateRequestFrom(watch: WatchDetail, draft: WatchDraft, hypothesis: Hypothesis | null): Checked<UpdateWatchRequest> {
  const errors: string[] = [];
  const request: UpdateWatchRequest = {};
  if (draft.name !== watch.name) request.name = draft.name;
  const description = draft.description.trim() ? draft.description : null;
  if (description !== watch.description) request.description = description;
  if (watch.batchCount === 0) {
    const labels = labelsFrom(draft.labels);
    if (JSON.stringify(labels) !== JSON.stringify(watch.labels)) request.labels = labels;
    if (!hypothesis) errors.push('Say what shares are expected.');
    else if (JSON.stringify(hypothesis) !== JSON.stringify(watch.hypothesis)) request.hypothesis = hypothesis;
  }
  if (draft.alpha !== watch.alpha) request.alpha = draft.alpha ?? Number.NaN;
  if (draft.feedKind === 'pull' && draft.connectionId === null) errors.push('Choose the database the query runs against.');
  const feed = feedFrom(draft);
  if (JSON.stringify(feed) !== JSON.stringify(watch.feed)) request.feed = feed;
  const webhook = webhookFrom(draft);
  if (webhook === null ? watch.webhook !== null : webhook.url !== watch.webhook?.url || webhook.secret !== undefined) request.webhook = webhook;
  if (errors.length === 0 && Object.keys(request).length === 0) return { ok: false, errors: ['Nothing has changed.'] };
  const checked = updateWatchRequestSchema.safeParse(request);
  if (!checked.success) errors.push(...checked.error.issues.filter((issue) => !idIssue(issue.path)).map((issue) => issue.message));
  return errors.length > 0 ? { ok: false, errors: unique(errors) } : { ok: true, request };
}

/** The form's values for a stored watch (the webhook secret is never returned, so it starts empty). */
export function draftFromWatch(watch: WatchDetail): WatchDraft {
  const pull = watch.feed.kind === 'pull' ? watch.feed : null;
  return {
    studyId: watch.study.id,
    name: watch.name,
    description: watch.description ?? '',
    labels: watch.labels.join('\n'),
    alpha: watch.alpha,
    feedKind: watch.feed.kind,
    connectionId: pull?.connectionId ?? null,
    query: pull?.query ?? '',
    schedule: pull?.schedule ?? '',
    timezone: pull?.timezone ?? '',
    webhookUrl: watch.webhook?.url ?? '',
    webhookSecret: '',
  };
}

/** The next times a cron pattern fires, or null while it is not a pattern croner reads. */
export function nextRuns(schedule: string, timezone: string, count = 3, after = new Date()): Date[] | null {
  try {
    const cron = new Cron(schedule.trim(), { paused: true, ...(timezone.trim() ? { timezone: timezone.trim() } : {}) });
    return cron.nextRuns(count, after);
  } catch {
    return null;
  }
}

/** A stored hypothesis in words, for a watch whose hypothesis is fixed. */
export function hypothesisWords(hypothesis: Hypothesis, labels: readonly string[]): string {
  switch (hypothesis.kind) {
    case 'equal':
      return 'Every category equally likely.';
    case 'proportions':
      return `Shares: ${labels.map((label, i) => `${label} ${hypothesis.values[i]}`).join(', ')}.`;
    case 'ratio':
      return `The ratio ${hypothesis.values.join(':')} across ${labels.join(', ')}.`;
    default:
      return `A ${hypothesis.kind} hypothesis.`;
  }
}

// Missing study or connection ids are said in plain words above; the schema's id messages would repeat them.
function idIssue(path: readonly PropertyKey[]): boolean {
  return path[0] === 'studyId' || (path[0] === 'feed' && path[1] === 'connectionId');
}

function unique(messages: string[]): string[] {
  return [...new Set(messages)];
}
