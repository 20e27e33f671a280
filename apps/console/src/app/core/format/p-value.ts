/**
 * A p-value as people read it, in the engine's own words (so the page and the report say the
 * same): three decimals, `< .001` below that, no leading zero (APA Publication Manual, 7th ed.,
 * 2020, section 6.36); given the alpha a decision was made at, as many more digits as it takes for
 * the printed value to fall on the same side of alpha as p.
 */
import { formatPValue, formatPValueAt } from '@tallyfit/engine';

export function formatP(p: number, alpha?: number): string {
  if (!Number.isFinite(p)) return '—';
  const value = alpha === undefined ? formatPValue(p) : formatPValueAt(p, alpha);
  return value.startsWith('<') || value.startsWith('>') ? value : `= ${value}`;
}

/** A test statistic with two decimals. */
export function formatStatistic(value: number): string {
  return Number.isFinite(value) ? value.toFixed(2) : '—';
}
