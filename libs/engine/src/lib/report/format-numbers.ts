/**
 * Number formatting for the write-up, following APA style (Publication Manual of the American
 * Psychological Association, 7th ed., 2020, section 6.36): statistics to two decimals; p to three
 * decimals without a leading zero, `p < .001` below that; thousands separated by commas.
 */

/** Insert commas every three digits into a string of digits with an optional sign and decimals. */
function groupText(text: string): string {
  if (text.includes('e')) return text; // exponent notation (|value| >= 1e21) stays as it is
  const point = text.indexOf('.');
  const end = point < 0 ? text.length : point;
  const start = text.startsWith('-') ? 1 : 0;
  if (end - start <= 3) return text;
  let grouped = text.slice(start, start + ((end - start) % 3 || 3));
  for (let i = start + ((end - start) % 3 || 3); i < end; i += 3) grouped += `,${text.slice(i, i + 3)}`;
  return `${text.slice(0, start)}${grouped}${text.slice(end)}`;
}

/** 1234567 → "1,234,567"; keeps any decimals. */
export function groupDigits(value: number): string {
  return groupText(String(value));
}

/** Two decimals, e.g. 5.6071 → "5.61"; large values grouped: 12345.678 → "12,345.68". */
export function formatStatistic(value: number): string {
  return groupText(value.toFixed(2));
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
