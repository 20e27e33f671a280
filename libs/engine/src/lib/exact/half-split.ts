/**
 * Chooses how to split the categories into the two halves of the meet-in-the-middle search.
 *
 * The number of partial vectors a half must list grows like the volume of an ellipsoid in its
 * own count space: the fraction V_h(1) / 2^h of the enclosing box, whose side for a category is
 * w = 2 r sd (standard deviation sd = √(nπ(1 − π)), radius r set by how extreme the observed
 * outcome is), capped at the category's window of possible counts. A run of m equal-share
 * categories is listed once per ordering class, so it contributes the number of multisets,
 * C(w + m − 1, m), instead of w^m. When both halves hold the same shares their lists are
 * identical and built once. The split with the least estimated total is
 * taken; every split respecting the runs is tried while there are few, a greedy balance otherwise.
 */
import { logGamma } from '../special/log-gamma';

export interface HalfSplit {
  /** indices (into the share array) of the first half, in enumeration order */
  first: number[];
  /** indices of the second half, in enumeration order */
  second: number[];
  /** both halves hold the same shares, so one list serves both */
  mirrored: boolean;
  /** the volume estimate of how many vectors the halves list together (order of magnitude only) */
  estimatedWork: number;
}

const EXHAUSTIVE_LIMIT = 20000;

/** ln of the volume of the h-dimensional ball of radius r. */
function logBallVolume(h: number, logRadius: number): number {
  // V_h(r) = π^{h/2} r^h / Γ(h/2 + 1); Γ at half-integers by the recurrence from Γ(1) or Γ(1/2).
  let logGammaHalf = h % 2 === 0 ? 0 : 0.5 * Math.log(Math.PI);
  for (let x = h % 2 === 0 ? 1 : 0.5; x < h / 2 + 1 - 1e-9; x += 1) logGammaHalf += Math.log(x);
  return (h / 2) * Math.log(Math.PI) + h * logRadius - logGammaHalf;
}

/** Runs of equal shares: shares must be sorted ascending. Returns the start index of each run. */
function runStarts(shares: readonly number[]): number[] {
  const starts: number[] = [];
  for (let i = 0; i < shares.length; i++) if (i === 0 || shares[i] !== shares[i - 1]) starts.push(i);
  return starts;
}

/**
 * @param shares category shares sorted ascending (equal shares adjacent)
 * @param n total count
 * @param radius how far from expectation the search reaches, on the chi-square scale (√X²)
 * @param widths number of counts each category can take in the search (its window)
 */
export function chooseHalfSplit(shares: readonly number[], n: number, radius: number, widths?: readonly number[]): HalfSplit {
  const k = shares.length;
  const starts = runStarts(shares);
  const runs = starts.map((start, r) => ({ start, size: (r + 1 < starts.length ? starts[r + 1] : k) - start }));
  const logSd = shares.map((share) => 0.5 * Math.log(Math.max(n * share * (1 - share), 0.25)));
  const logRadius = Math.log(Math.max(radius, 1));
  const side = logSd.map((logSdOne, i) =>
    Math.max(1, Math.min(2 * Math.exp(logRadius + logSdOne), widths ? widths[i] : n + 1)),
  );

  const logWork = (taken: number[]): number => {
    let h = 0;
    let sum = 0;
    runs.forEach((run, r) => {
      const m = taken[r];
      if (m === 0) return;
      h += m;
      const w = side[run.start];
      sum += logGamma(w + m) - logGamma(w) - logGamma(m + 1); // ln C(w + m − 1, m)
    });
    return h === 0 ? -Infinity : sum + logBallVolume(h, 0) - h * Math.LN2;
  };

  let options = 1;
  for (const run of runs) options *= run.size + 1;

  let best: number[] | undefined;
  let bestCost = Infinity;
  let bestImbalance = Infinity;
  const consider = (taken: number[]): void => {
    const rest = runs.map((run, r) => run.size - taken[r]);
    const sizeFirst = taken.reduce((a, b) => a + b, 0);
    if (sizeFirst === 0 || sizeFirst === k) return;
    const mirrored = taken.every((m, r) => m === rest[r]);
    const a = logWork(taken);
    const b = logWork(rest);
    const cost = mirrored ? Math.exp(a) : Math.exp(a) + Math.exp(b);
    const imbalance = Math.abs(a - b);
    if (cost < bestCost * (1 - 1e-9) || (cost <= bestCost * (1 + 1e-9) && imbalance < bestImbalance)) {
      best = taken.slice();
      bestCost = cost;
      bestImbalance = imbalance;
    }
  };

  if (options <= EXHAUSTIVE_LIMIT) {
    const taken = runs.map(() => 0);
    const visit = (r: number): void => {
      if (r === runs.length) {
        consider(taken);
        return;
      }
      for (let m = 0; m <= runs[r].size; m++) {
        taken[r] = m;
        visit(r + 1);
      }
    };
    visit(0);
  } else {
    // Greedy: hand each category, widest first, to the half with the smaller estimated work.
    const taken = runs.map(() => 0);
    const order = shares.map((_, i) => i).sort((a, b) => logSd[b] - logSd[a]);
    let sumFirst = 0;
    let sumSecond = 0;
    const runOf = (i: number): number => {
      let r = 0;
      while (r + 1 < runs.length && runs[r + 1].start <= i) r++;
      return r;
    };
    for (const i of order) {
      if (sumFirst <= sumSecond) {
        taken[runOf(i)]++;
        sumFirst += logSd[i];
      } else sumSecond += logSd[i];
    }
    consider(taken);
  }
  if (!best) throw new Error('no split of the categories into two halves was found');

  const first: number[] = [];
  const second: number[] = [];
  runs.forEach((run, r) => {
    for (let i = 0; i < run.size; i++) (i < best![r] ? first : second).push(run.start + i);
  });
  const chosen = best;
  const mirrored = runs.every((run, r) => chosen[r] === run.size - chosen[r]);
  return { first: widestLast(first, logSd), second: widestLast(second, logSd), mirrored, estimatedWork: bestCost };
}

/**
 * Enumeration order inside a half: runs stay together, and the run with the widest spread goes
 * last, because the last category's range is found by bisection rather than visited one by one.
 */
function widestLast(indices: number[], logSd: readonly number[]): number[] {
  return indices.slice().sort((a, b) => logSd[a] - logSd[b] || a - b);
}
