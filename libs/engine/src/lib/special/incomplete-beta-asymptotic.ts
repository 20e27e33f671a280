/**
 * ln I_x(a, b) for large a and b near the centre of the distribution, by the uniform asymptotic
 * expansion of DiDonato & Morris (1992, "Algorithm 708: Significant digit computation of the
 * incomplete beta function ratios", ACM TOMS 18:360, procedure BASYM, after Temme 1987):
 *   I_x(a, b) = (2/√π) e^{−f} e^{−Δ} [½(√π/2)·erfcx(√f) + Σ_n d_n w₀ⁿ J_n] ,
 * where λ = a − (a + b) x >= 0, f = a φ(−λ/a) + b φ(λ/b) with φ(t) = t − ln(1 + t),
 * Δ = δ(a) + δ(b) − δ(a + b) (Stirling errors), and the coefficients d_n come from the series
 * inversion the paper gives. At most 20 terms are added, so the work does not depend on a or b;
 * DiDonato & Morris use it for a, b >= 100 with λ <= 0.03 min(a, b), where it is accurate to
 * about 1e-13 relative.
 */
import { stirlingError } from './log-gamma';
import { devianceTerm } from './poisson-density';
import { scaledErfc } from './scaled-erfc';

const TERMS = 20;
const TWO_OVER_SQRT_PI = 1.1283791670955126;
const ROOT_HALF_CUBED = 0.3535533905932738; // 2^{−3/2}
const TOLERANCE = 1e-15;

/** ln I_x(a, b) with x = (a − λ) / (a + b), for a, b large and 0 <= λ small against both. */
export function logIncompleteBetaAsymptotic(a: number, b: number, lambda: number): number {
  // a φ(−λ/a) = D(a, a − λ) and b φ(λ/b) = D(b, b + λ) in Loader's deviance form, free of cancellation.
  const f = devianceTerm(a, a - lambda) + devianceTerm(b, b + lambda);
  const z0 = Math.sqrt(f);
  const z = z0 * Math.SQRT2;
  const z2 = 2 * f;
  const h = a < b ? a / b : b / a;
  const r0 = 1 / (h + 1);
  const r1 = a < b ? (b - a) / b : (b - a) / a;
  const w0 = 1 / Math.sqrt((a < b ? a : b) * (h + 1));

  const a0 = new Array<number>(TERMS + 1).fill(0);
  const b0 = new Array<number>(TERMS + 1).fill(0);
  const c = new Array<number>(TERMS + 1).fill(0);
  const d = new Array<number>(TERMS + 1).fill(0);
  a0[0] = (2 / 3) * r1;
  c[0] = -a0[0] / 2;
  d[0] = -c[0];
  let j0 = (0.5 / TWO_OVER_SQRT_PI) * scaledErfc(z0);
  let j1 = ROOT_HALF_CUBED;
  let sum = j0 + d[0] * w0 * j1;

  let s = 1;
  let hn = 1;
  let w = w0;
  let znm1 = z;
  let zn = z2;
  for (let n = 2; n <= TERMS; n += 2) {
    hn *= h * h;
    a0[n - 1] = (2 * r0 * (h * hn + 1)) / (n + 2);
    s += hn;
    a0[n] = (2 * r1 * s) / (n + 3);
    for (let i = n; i <= n + 1; i++) {
      const r = -(i + 1) / 2;
      b0[0] = r * a0[0];
      for (let m = 2; m <= i; m++) {
        let bsum = 0;
        for (let j = 1; j <= m - 1; j++) bsum += (j * r - (m - j)) * a0[j - 1] * b0[m - j - 1];
        b0[m - 1] = r * a0[m - 1] + bsum / m;
      }
      c[i - 1] = b0[i - 1] / (i + 1);
      let dsum = 0;
      for (let j = 1; j <= i - 1; j++) dsum += d[i - j - 1] * c[j - 1];
      d[i - 1] = -(dsum + c[i - 1]);
    }
    j0 = ROOT_HALF_CUBED * znm1 + (n - 1) * j0;
    j1 = ROOT_HALF_CUBED * zn + n * j1;
    znm1 *= z2;
    zn *= z2;
    w *= w0;
    const t0 = d[n - 1] * w * j0;
    w *= w0;
    const t1 = d[n] * w * j1;
    sum += t0 + t1;
    if (Math.abs(t0) + Math.abs(t1) <= TOLERANCE * sum) break;
  }
  const stirlingCorrection = stirlingError(a) + stirlingError(b) - stirlingError(a + b);
  return Math.log(TWO_OVER_SQRT_PI) - f - stirlingCorrection + Math.log(sum);
}
