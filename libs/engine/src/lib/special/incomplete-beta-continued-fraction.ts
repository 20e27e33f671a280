/**
 * The continued fraction of the regularised incomplete beta function (Abramowitz & Stegun 1964,
 * 26.5.8; Numerical Recipes, Press et al. 2007, §6.4):
 *   I_x(a, b) = x^a (1 − x)^b / (a B(a, b)) · 1/(1 + d₁/(1 + d₂/(1 + …))),
 *   d_{2m+1} = −(a + m)(a + b + m) x / ((a + 2m)(a + 2m + 1)),  d_{2m} = m (b − m) x / ((a + 2m − 1)(a + 2m)),
 * evaluated by the modified Lentz algorithm (Lentz 1976; Thompson & Barnett 1986). It converges
 * for x < (a + 1)/(a + b + 2); the callers use it only away from the centre (or with a or b small),
 * where DiDonato & Morris (1992, ACM TOMS 18:360) show it needs few steps. Returns the fraction
 * 1/(1 + d₁/(1 + …)); the caller supplies the prefactor in whatever form suits it.
 */
const TINY = 1e-300;
const TOLERANCE = 1e-16;
/** A hard cap on the steps, so no input can make the work grow without bound. */
export const CONTINUED_FRACTION_STEP_LIMIT = 5000;

export function incompleteBetaContinuedFraction(a: number, b: number, x: number): number {
  const qab = a + b;
  let c = 1;
  let d = 1 - (qab * x) / (a + 1);
  if (Math.abs(d) < TINY) d = TINY;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= CONTINUED_FRACTION_STEP_LIMIT; m++) {
    const m2 = 2 * m;
    const even = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + even * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + even / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    h *= d * c;
    const odd = (-(a + m) * (qab + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + odd * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + odd / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < TOLERANCE) return h;
  }
  return h;
}
