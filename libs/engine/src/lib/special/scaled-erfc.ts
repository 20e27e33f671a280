/**
 * The scaled complementary error function erfcx(z) = e^{z²} erfc(z) for z >= 0, which stays near
 * 1 / (z √π) where erfc itself underflows.
 *
 * Method: below z = 2, erfc(z) = Q(½, z²) (Abramowitz & Stegun 1964, 7.1.2 and 6.5.17) times e^{z²},
 * which loses nothing because z² < 4. From z = 2 on, Laplace's continued fraction
 *   √π erfcx(z) = 1/(z + (1/2)/(z + 1/(z + (3/2)/(z + 2/(z + …)))))   (A&S 7.1.14)
 * evaluated by the modified Lentz algorithm (Lentz 1976; Thompson & Barnett 1986); it converges
 * faster as z grows, so the work is bounded by its value at z = 2 (under 200 steps to 1e-16).
 */
import { regularizedGammaTails } from './incomplete-gamma';

const INVERSE_SQRT_PI = 0.5641895835477563;
const TINY = 1e-300;
const MAX_STEPS = 400;

export function scaledErfc(z: number): number {
  if (!(z >= 0)) throw new RangeError(`scaledErfc needs z >= 0, got ${z}`);
  if (z < 2) return Math.exp(z * z) * regularizedGammaTails(0.5, z * z).upper;
  if (z === Infinity) return 0;
  // f = z + a1/(z + a2/(z + …)) with a_k = k / 2.
  let f = z;
  let c = z;
  let d = 0;
  for (let k = 1; k <= MAX_STEPS; k++) {
    const a = k / 2;
    d = z + a * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = z + a / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const delta = c * d;
    f *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return INVERSE_SQRT_PI / f;
}
