/**
 * The watch page's view logic as small pure functions: the headline in words, which alarm waits for a
 * lead, the deliveries in words, and the example a pipeline copies to send a batch.
 */
import type { AlertDelivery, Watch, WatchAlert, WatchShare } from '@tallyfit/contracts';
import { formatP } from '../../core/format/p-value';
import { DELIVERY_STATUS_WORDS } from '../../shared/watch-state/watch-words';

/** The category whose share so far is furthest from its expected share (the first of equals), or null without shares. */
export function furthestCategory(shares: readonly WatchShare[]): string | null {
  let furthest: WatchShare | null = null;
  for (const share of shares) {
    if (!furthest || Math.abs(share.estimate - share.expected) > Math.abs(furthest.estimate - furthest.expected)) furthest = share;
  }
  return furthest?.label ?? null;
}

/** What the sequential test says so far, in one sentence of figures (the state's meaning is said beside it). */
export function watchHeadline(watch: Pick<Watch, 'alarm' | 'batchCount' | 'n' | 'sequentialP' | 'alpha'>): string {
  if (watch.batchCount === 0) return 'No batches yet: the first one starts the sequential test.';
  const so = `After ${plural(watch.batchCount, 'batch', 'batches')} (${plural(watch.n, 'observation', 'observations')})`;
  const p = `the sequential p is ${pFigure(watch.sequentialP)}`;
  return `${so} ${p}, ${watch.alarm ? 'below' : 'not below'} alpha ${watch.alpha}.`;
}

/** A p-value standing alone in a table cell: ".005", "< .001", "> .999" (formatP without its "= "). */
export function pFigure(p: number): string {
  return formatP(p).replace(/^= /, '');
}

/** The alarm a lead can acknowledge: the newest alert, when it is an alarm no one has acknowledged. */
export function alarmToAcknowledge(watch: Pick<Watch, 'alertState'>, alertsNewestFirst: readonly WatchAlert[]): WatchAlert | null {
  if (watch.alertState !== 'waiting') return null;
  const newest = alertsNewestFirst[0];
  return newest && newest.kind === 'alarm' && newest.acknowledgedAt === null ? newest : null;
}

/** One delivery in words, e.g. "E-mail to lee@example.org: delivered after 1 attempt". */
export function deliveryText(delivery: AlertDelivery): string {
  const channel = delivery.channel === 'email' ? 'E-mail' : 'Webhook';
  const attempts = plural(delivery.attempts, 'attempt', 'attempts');
  const status = DELIVERY_STATUS_WORDS[delivery.status];
  const how = delivery.status === 'pending' ? `${status} (${attempts} so far)` : `${status} after ${attempts}`;
  return `${channel} to ${delivery.target}: ${how}${delivery.lastError ? ` — ${delivery.lastError}` : ''}`;
}

/** The placeholder the example uses where the person's own API token goes. */
export const TOKEN_PLACEHOLDER = 'paste-your-personal-API-token-here';

/**
 * A `curl` command that sends one batch to the watch, to copy into a shell. The period is the hour
 * before `now`, and the hour names the batch, so re-sending the same hour is counted once.
 */
export function pushExample(origin: string, watch: Pick<Watch, 'id' | 'labels'>, now: Date): string {
  const end = new Date(now);
  end.setUTCMinutes(0, 0, 0);
  const start = new Date(end.getTime() - 3_600_000);
  const iso = (date: Date) => date.toISOString().replace('.000Z', 'Z');
  const body = {
    idempotencyKey: `hour-${iso(start)}`,
    periodStart: iso(start),
    periodEnd: iso(end),
    counts: Object.fromEntries(watch.labels.map((label) => [label, 0])),
  };
  return [
    `TALLYFIT_TOKEN='${TOKEN_PLACEHOLDER}'`,
    `curl --fail-with-body -X POST '${origin}/api/v1/watches/${watch.id}/batches' \\`,
    `  -H "Authorization: Bearer $TALLYFIT_TOKEN" \\`,
    `  -H 'Content-Type: application/json' \\`,
    `  -d '${shellQuoted(JSON.stringify(body, null, 2))}'`,
  ].join('\n');
}

/** Text inside single quotes in a POSIX shell: a quote closes, is escaped, and reopens. */
function shellQuoted(text: string): string {
  return text.replace(/'/g, `'\\''`);
}

function plural(count: number, one: string, many: string): string {
  return `${count.toLocaleString('en-US')} ${count === 1 ? one : many}`;
}
