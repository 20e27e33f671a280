/**
 * Root of a continuous function on a bracket [low, high] with f(low) and f(high) of opposite
 * signs, by the Illinois variant of regula falsi (Dowell & Jarratt 1971, BIT 11:168), which
 * converges superlinearly and never leaves the bracket. Stops when the bracket is narrower than
 * `relativeTolerance` × |x| (+ `absoluteTolerance`).
 */
export function findRoot(
  f: (x: number) => number,
  low: number,
  high: number,
  relativeTolerance = 1e-13,
  absoluteTolerance = 1e-300,
  maxIterations = 500,
): number {
  let a = low;
  let b = high;
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (Math.sign(fa) === Math.sign(fb)) {
    throw new RangeError(`findRoot: f(${low}) and f(${high}) have the same sign`);
  }
  let side = 0;
  for (let i = 0; i < maxIterations; i++) {
    let c = (a * fb - b * fa) / (fb - fa);
    if (!(c > Math.min(a, b) && c < Math.max(a, b))) c = (a + b) / 2;
    // Every few steps bisect, which bounds the worst case when the function is badly curved.
    if (i % 8 === 7) c = (a + b) / 2;
    const fc = f(c);
    if (fc === 0) return c;
    if (Math.sign(fc) === Math.sign(fb)) {
      b = c;
      fb = fc;
      if (side === -1) fa /= 2;
      side = -1;
    } else {
      a = c;
      fa = fc;
      if (side === 1) fb /= 2;
      side = 1;
    }
    if (Math.abs(b - a) <= relativeTolerance * Math.abs(c) + absoluteTolerance) return (a + b) / 2;
  }
  return (a + b) / 2;
}
