/**
 * Shares from a ratio such as 9:3:3:1. The division r_i / Σr is done in decimal arithmetic
 * (decimal.js, 40 significant digits) so that shares like 9/16 or 1/3 are the nearest doubles
 * to the exact fractions, whatever the size of the ratio terms.
 */
import Decimal from 'decimal.js';

const Exact = Decimal.clone({ precision: 40 });

export function sharesFromRatio(values: readonly number[]): number[] {
  const terms = values.map((value) => new Exact(value));
  const sum = terms.reduce((acc, term) => acc.plus(term), new Exact(0));
  return terms.map((term) => term.dividedBy(sum).toNumber());
}

/** The ratio written the usual way, e.g. "9:3:3:1". */
export function formatRatio(values: readonly number[]): string {
  return values.map((value) => String(value)).join(':');
}
