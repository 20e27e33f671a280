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

const MAX_DECIMALS = 12;

/**
 * A p-value for a decision at `alpha`: three decimals as APA asks, more where three would put the
 * printed value on the other side of alpha from p itself (p = 0.0499977 → ".049998", never ".050"
 * beside "significant"). Never "0": below the display floor it is "< .001" (or, for alpha below
 * .001, "< " a tenth of alpha's leading decimal place, e.g. "< .00001" for alpha = .0005).
 */
export function formatPValueAt(p: number, alpha: number): string {
  // The display floor: .001, or a tenth of alpha's leading decimal place when alpha is smaller.
  const floorDecimals = alpha > 0.001 ? 3 : 1 - Math.floor(Math.log10(alpha));
  const floor = 10 ** -floorDecimals;
  if (p < floor) return `< ${floor.toFixed(floorDecimals).replace(/^0/, '')}`;
  const significant = p < alpha;
  let decimals = p < 0.001 ? Math.ceil(-Math.log10(p)) + 1 : 3;
  let text = p.toFixed(decimals);
  while (decimals < MAX_DECIMALS && (Number(text) < alpha !== significant || Number(text) === 0)) {
    decimals++;
    text = p.toFixed(decimals);
  }
  if (Number(text) >= 1) return '> .999';
  return text.replace(/^0/, '');
}

/** "p = .018", "p < .001", "p = .049998": `formatPValueAt` with its relation sign. */
export function formatPAt(p: number, alpha: number): string {
  const value = formatPValueAt(p, alpha);
  return value.startsWith('<') || value.startsWith('>') ? `p ${value}` : `p = ${value}`;
}

/**
 * Cohen's w and its interval with one number of decimals: two, or more where two would round w
 * across one of Cohen's boundaries (0.1, 0.3, 0.5) so that the number and its size word disagree
 * (0.2952 → "0.295", small), and at least two significant digits for very small w. Rounding all
 * three to the same decimals keeps the printed interval around the printed w.
 */
export function formatEffectSize(
  w: number,
  word: (value: number) => string,
  interval?: { low: number; high: number },
): { w: string; low?: string; high?: string } {
  let decimals = w > 0 && w < 0.005 ? Math.ceil(-Math.log10(w)) + 1 : 2;
  while (decimals < MAX_DECIMALS && word(Number(w.toFixed(decimals))) !== word(w)) decimals++;
  if (!interval) return { w: w.toFixed(decimals) };
  return { w: w.toFixed(decimals), low: interval.low.toFixed(decimals), high: interval.high.toFixed(decimals) };
}
