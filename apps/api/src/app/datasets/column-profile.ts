import type { CategoryCounts, DatasetColumn } from '@tallyfit/contracts';
import type { ColumnPart } from './row-counter';

/** A column with at most this many different values is offered as categories at upload. */
export const FEW_DISTINCT_VALUES = 50;
/** At most this many columns are offered, so the stored summary stays small for wide files. */
export const MAX_OFFERED_COLUMNS = 20;

/** Sorts labels so digits and numbered categories read naturally (2 before 10). */
export const naturalOrder = new Intl.Collator('en', { numeric: true, sensitivity: 'variant' }).compare;

/** What one column holds, from its profile (see `ColumnWatch` in row-counter.ts). */
export function columnSummary(name: string, part: ColumnPart): DatasetColumn {
  return {
    name,
    distinctValues: part.values ? part.values.length : null,
    wholeNumbers: part.filled > 0 && part.wholeNumbers,
    emptyCells: part.empty,
  };
}

/** The column's counts as raw categories, when it has few enough different values to be one. */
export function offeredCounts(name: string, part: ColumnPart): CategoryCounts | undefined {
  if (!part.values || part.values.length === 0) return undefined;
  const order = part.values.map((_, i) => i).sort((a, b) => naturalOrder(part.values![a], part.values![b]));
  return {
    selection: { shape: 'raw', column: name },
    labels: order.map((i) => part.values![i]),
    counts: order.map((i) => part.counts[i]),
    total: part.filled,
    skippedEmpty: part.empty,
  };
}
