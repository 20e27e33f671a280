/**
 * Standard normal tails through the incomplete gamma function: for z >= 0,
 * P(Z > z) = ½ erfc(z/√2) = ½ Q(½, z²/2) (Abramowitz & Stegun 1964, 7.1.2 and 6.5.17), so both
 * tails are computed directly, never as 1 − Φ.
 */
import { regularizedGammaTails } from '../special/incomplete-gamma';

/** P(Z > z) */
export function normalUpperTail(z: number): number {
  if (z === Infinity) return 0;
  if (z === -Infinity) return 1;
  const half = 0.5 * regularizedGammaTails(0.5, (z * z) / 2).upper;
  return z >= 0 ? half : 1 - half;
}

/** P(Z <= z) */
export function normalLowerTail(z: number): number {
  return normalUpperTail(-z);
}

/** P(a < Z <= b) for a <= b, formed from the tail on the side where both are small. */
export function normalIntervalProbability(a: number, b: number): number {
  if (a >= 0) return Math.max(0, normalUpperTail(a) - normalUpperTail(b));
  if (b <= 0) return Math.max(0, normalLowerTail(b) - normalLowerTail(a));
  return Math.max(0, 1 - normalLowerTail(a) - normalUpperTail(b));
}
