/**
 * A p-value as people read it: three decimals, `< .001` below that, no leading zero
 * (APA Publication Manual, 7th ed., 2020, section 6.36; common practice).
 */
export function formatP(p: number): string {
  if (!Number.isFinite(p)) return '—';
  if (p < 0.001) return '< .001';
  return '= ' + p.toFixed(3).replace(/^0\./, '.');
}

/** A test statistic with two decimals. */
export function formatStatistic(value: number): string {
  return Number.isFinite(value) ? value.toFixed(2) : '—';
}
