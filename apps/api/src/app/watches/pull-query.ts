import type { Knex } from 'knex';

/** How long one pull's query may run on the team's server before it is cancelled. */
export const PULL_STATEMENT_TIMEOUT_MS = 30_000;

export class PullQueryError extends Error {}

/**
 * Runs a watch's query on the team's database for one period: in a READ ONLY transaction (the
 * server refuses any write) with `SET LOCAL statement_timeout`, so a slow or careless query can
 * neither change data nor hold the server. `:periodStart` and `:periodEnd` are bound as
 * timestamps; the answer must have the columns `category` and `count`, one row per category.
 */
export async function runPullQuery(source: Knex, query: string, period: { start: Date; end: Date }, timeoutMs = PULL_STATEMENT_TIMEOUT_MS): Promise<Record<string, number>> {
  const rows = await source.transaction(
    async (trx) => {
      await trx.raw(`set local statement_timeout = ${Math.round(timeoutMs)}`);
      // Only the named bindings are placeholders: a `?` (in a text, or PostgreSQL's jsonb operator)
      // is escaped so knex does not turn it into a positional parameter.
      const result = await trx.raw(query.replace(/\?/g, '\\?'), { periodStart: period.start, periodEnd: period.end });
      return (result.rows ?? []) as Array<Record<string, unknown>>;
    },
    { readOnly: true },
  );
  const counts: Record<string, number> = {};
  for (const [index, row] of rows.entries()) {
    if (!('category' in row) || !('count' in row)) {
      throw new PullQueryError(`the query must return the columns "category" and "count"; row ${index + 1} has ${Object.keys(row).map((name) => `"${name}"`).join(', ')}`);
    }
    const category = row['category'] === null ? '' : String(row['category']);
    const count = Number(row['count']);
    if (!Number.isSafeInteger(count) || count < 0) throw new PullQueryError(`the count for "${category}" is not a whole number ≥ 0 (got ${String(row['count'])})`);
    if (Object.hasOwn(counts, category)) throw new PullQueryError(`the query returned "${category}" twice; group by category`);
    counts[category] = count;
  }
  return counts;
}
