/**
 * A p-value as people read it: three decimals, `< .001` below that, no leading zero
 * (APA Publication Manual, 7th ed., 2020, section 6.36; common practice).
 */
export function formatP(p: number): string {
  if (!Number.isFinite(p)) return '—';
  if (p < 0.001) return '< .001';
  const rounded = p.toFixed(3);
  // As in the engine's write-up, so the page and the report say the same: never "p = 1.000".
  if (rounded === '1.000') return '> .999';
  return '= ' + rounded.replace(/^0\./, '.');
}

/** A test statistic with two decimals. */
export function formatStatistic(value: number): string {
  return Number.isFinite(value) ? value.toFixed(2) : '—';
}
