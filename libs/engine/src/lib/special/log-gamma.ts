/**
 * Natural logarithm of the gamma function for x > 0, and Stirling's error term.
 *
 * Method: Stirling's asymptotic series (Abramowitz & Stegun 1964, 6.1.41) for x >= 10,
 * shifted upward by the recurrence Γ(x + 1) = x Γ(x) below that. Absolute error about 2e-15.
 */

const HALF_LOG_TWO_PI = 0.9189385332046727;

/** Stirling series coefficients B(2j) / (2j (2j − 1)), j = 1..8 (A&S 6.1.41). */
const STIRLING_COEFFICIENTS = [
  1 / 12,
  -1 / 360,
  1 / 1260,
  -1 / 1680,
  1 / 1188,
  -691 / 360360,
  1 / 156,
  -3617 / 122400,
];

const SERIES_START = 10;

/** Sum of the Stirling correction series at x >= SERIES_START. */
function stirlingSeries(x: number): number {
  const inverseSquare = 1 / (x * x);
  let power = 1 / x;
  let sum = 0;
  for (const coefficient of STIRLING_COEFFICIENTS) {
    sum += coefficient * power;
    power *= inverseSquare;
  }
  return sum;
}

/** ln Γ(x) for x > 0. Returns Infinity at 0 (the pole) and NaN never for x >= 0. */
export function logGamma(x: number): number {
  if (!(x >= 0)) throw new RangeError(`logGamma needs x >= 0, got ${x}`);
  if (x === 0) return Infinity;
  if (x === Infinity) return Infinity;
  if (x >= SERIES_START) {
    return (x - 0.5) * Math.log(x) - x + HALF_LOG_TWO_PI + stirlingSeries(x);
  }
  // Shift up: ln Γ(x) = ln Γ(x + m) − ln(x (x + 1) … (x + m − 1)).
  let product = 1;
  let shifted = x;
  while (shifted < SERIES_START) {
    product *= shifted;
    shifted += 1;
  }
  return logGamma(shifted) - Math.log(product);
}

/**
 * Stirling's error δ(x) = ln Γ(x + 1) − (x + ½) ln x + x − ½ ln(2π), the quantity Loader (2000,
 * "Fast and accurate computation of binomial probabilities") uses to evaluate densities without
 * cancellation. Needs x > 0.
 */
export function stirlingError(x: number): number {
  if (x >= SERIES_START) return stirlingSeries(x);
  return logGamma(x + 1) - (x + 0.5) * Math.log(x) + x - HALF_LOG_TWO_PI;
}

/** ln n! for a non-negative integer (or real) n. */
export function logFactorial(n: number): number {
  return logGamma(n + 1);
}
