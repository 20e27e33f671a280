/**
 * Number formatting for the write-up, following APA style (Publication Manual of the American
 * Psychological Association, 7th ed., 2020, section 6.36): statistics to two decimals; p to three
 * decimals without a leading zero, `p < .001` below that; thousands separated by commas.
 */

/** 1234567 → "1,234,567"; keeps any decimals. */
export function groupDigits(value: number): string {
  const [whole, fraction] = String(value).split('.');
  const sign = whole.startsWith('-') ? '-' : '';
  const digits = sign ? whole.slice(1) : whole;
  const grouped = digits.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return fraction === undefined ? `${sign}${grouped}` : `${sign}${grouped}.${fraction}`;
}

/** Two decimals, e.g. 5.6071 → "5.61"; large values grouped: 12345.678 → "12,345.68". */
export function formatStatistic(value: number): string {
  const fixed = value.toFixed(2);
  const [whole, fraction] = fixed.split('.');
  return `${groupDigits(Number(whole))}.${fraction}`;
}

/** A p-value on its own: ".018", "< .001", "> .999". */
export function formatPValue(p: number): string {
  if (p < 0.001) return '< .001';
  const rounded = p.toFixed(3);
  if (rounded === '1.000') return '> .999';
  return rounded.replace(/^0/, '');
}

/** "p = .018", "p < .001", "p > .999". */
export function formatP(p: number): string {
  const value = formatPValue(p);
  return value.startsWith('<') || value.startsWith('>') ? `p ${value}` : `p = ${value}`;
}

/** A number to a few significant digits for prose, e.g. 28.125 → "28.1", 0.000123 → "0.000123". */
export function formatCount(value: number): string {
  if (Number.isInteger(value)) return groupDigits(value);
  if (Math.abs(value) >= 100) return groupDigits(Number(value.toFixed(1)));
  return String(Number(value.toPrecision(3)));
}

/** A share or w to two decimals without losing very small values entirely. */
export function formatShare(value: number): string {
  if (value !== 0 && Math.abs(value) < 0.005) return value.toPrecision(2);
  return value.toFixed(2);
}

/** A percentage for intervals and levels, e.g. 0.95 → "95%". */
export function formatPercent(level: number): string {
  return `${Number((level * 100).toPrecision(6))}%`;
}
