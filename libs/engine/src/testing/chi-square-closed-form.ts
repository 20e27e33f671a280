/**
 * Reference upper tails of χ²(ν) for whole ν from the closed forms in Abramowitz & Stegun (1964),
 * Handbook of Mathematical Functions, 26.4.4 (odd ν) and 26.4.5 (even ν), evaluated in 80-digit
 * decimal arithmetic (decimal.js), so they are exact to far more digits than a double holds —
 * including far into the tail where general-purpose libraries return 0.
 *   even ν: Q = e^{−x/2} Σ_{j=0}^{ν/2−1} (x/2)^j / j!
 *   odd ν:  Q = erfc(√(x/2)) + √(2/π) e^{−x/2} Σ_{j=1}^{(ν−1)/2} x^{j−½} / (1·3·…·(2j−1))
 * Test helper only.
 */
import Decimal from 'decimal.js';

const D = Decimal.clone({ precision: 80, toExpNeg: -100000, toExpPos: 100000, minE: -9e15, maxE: 9e15 });
const PI = D.acos(-1);

/** erfc(z) for z >= 0: Maclaurin series of erf below 5, the Laplace continued fraction above. */
function erfc(z: Decimal): Decimal {
  if (z.lt(5)) {
    let term = z;
    let sum = z;
    const z2 = z.times(z);
    for (let n = 1; n < 2000; n++) {
      term = term.times(z2).neg().dividedBy(n);
      const add = term.dividedBy(2 * n + 1);
      sum = sum.plus(add);
      if (add.abs().lt(new D(10).pow(-90))) break;
    }
    return new D(1).minus(sum.times(2).dividedBy(PI.sqrt()));
  }
  let t = z;
  for (let k = 4000; k >= 1; k--) t = z.plus(new D(k).dividedBy(2).dividedBy(t));
  return z.times(z).neg().exp().dividedBy(PI.sqrt()).dividedBy(t);
}

/** ln Q for χ²(df) at x, df a whole number. */
export function closedFormLogUpperTail(x: number, df: number): number {
  const xd = new D(x);
  const half = xd.dividedBy(2);
  if (df % 2 === 0) {
    let term = new D(1);
    let sum = new D(1);
    for (let j = 1; j < df / 2; j++) {
      term = term.times(half).dividedBy(j);
      sum = sum.plus(term);
    }
    return sum.ln().minus(half).toNumber();
  }
  let sum = new D(0);
  let term = xd.sqrt(); // x^{1/2} / 1
  for (let j = 1; j <= (df - 1) / 2; j++) {
    sum = sum.plus(term);
    term = term.times(xd).dividedBy(2 * j + 1);
  }
  const tail = erfc(half.sqrt()).plus(new D(2).dividedBy(PI).sqrt().times(half.neg().exp()).times(sum));
  return tail.ln().toNumber();
}
