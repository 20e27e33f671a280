import type { CategoryCounts, DatasetColumn } from '@tallyfit/contracts';
import { parseCount } from './category-tally';

/** A column with at most this many different values is offered as categories at upload. */
export const FEW_DISTINCT_VALUES = 50;
/** At most this many columns are offered, so the stored summary stays small for wide files. */
export const MAX_OFFERED_COLUMNS = 20;

/**
 * What one column holds, learnt in one pass and in bounded memory: its different values are
 * counted until there are more than FEW_DISTINCT_VALUES, after which only that fact is kept.
 */
export class ColumnProfile {
  private values: Map<string, number> | undefined = new Map();
  private wholeNumbers = true;
  private filled = 0;
  private empty = 0;

  constructor(readonly name: string) {}

  add(cell: string): void {
    const value = cell.trim();
    if (value === '') {
      this.empty++;
      return;
    }
    this.filled++;
    if (this.wholeNumbers && parseCount(value) === undefined) this.wholeNumbers = false;
    const values = this.values;
    if (!values) return;
    const seen = values.get(value);
    if (seen !== undefined) values.set(value, seen + 1);
    else if (values.size < FEW_DISTINCT_VALUES) values.set(value, 1);
    else this.values = undefined;
  }

  summary(): DatasetColumn {
    return {
      name: this.name,
      distinctValues: this.values ? this.values.size : null,
      wholeNumbers: this.filled > 0 && this.wholeNumbers,
      emptyCells: this.empty,
    };
  }

  /** The column's counts as raw categories, when it has few enough different values to be one. */
  offeredCounts(): CategoryCounts | undefined {
    if (!this.values || this.values.size === 0) return undefined;
    const collator = new Intl.Collator('en', { numeric: true, sensitivity: 'variant' });
    const labels = [...this.values.keys()].sort(collator.compare);
    const counts = labels.map((label) => this.values!.get(label)!);
    return {
      selection: { shape: 'raw', column: this.name },
      labels,
      counts,
      total: this.filled,
      skippedEmpty: this.empty,
    };
  }
}
