/**
 * Joins the two halves' lists into the exact mass of a set of outcomes.
 *
 * Every outcome is a pair (a, b) of half vectors with totals t + m = n, its statistic is
 * S(a) + S(b) and its probability exp(offset + G(a) + G(b)). So for each t the mass on one side of
 * the threshold is Σ_a P(a) × (mass of b's bucket beyond threshold − S(a)).
 */
import { BinnedBucket } from './binned-bucket';
import { CompensatedSum, LogSum } from './compensated-sum';
import { HalfLists } from './half-enumeration';
import { sortByKey } from './sort-by-key';

/** Sorts every bucket of a half's lists by partial statistic (needed by the tail join). */
export function sortBuckets(lists: HalfLists): void {
  const { offsets, stat, logWeight } = lists;
  for (let i = 0; i + 1 < offsets.length; i++) {
    if (offsets[i + 1] - offsets[i] > 1) sortByKey(stat, logWeight, offsets[i], offsets[i + 1]);
  }
}

function bucketRange(lists: HalfLists, total: number): [number, number] {
  const index = total - lists.tMin;
  if (index < 0 || index + 1 >= lists.offsets.length) return [0, 0];
  return [lists.offsets[index], lists.offsets[index + 1]];
}

/**
 * Turns each bucket's log-weights into weights exp(logWeight − bucket maximum), all in (0, 1],
 * overwriting the log-weights to save memory; returns the maxima.
 */
function scaleWeightsInPlace(lists: HalfLists): Float64Array {
  const buckets = lists.offsets.length - 1;
  const scale = new Float64Array(buckets);
  const values = lists.logWeight;
  for (let i = 0; i < buckets; i++) {
    const from = lists.offsets[i];
    const to = lists.offsets[i + 1];
    let max = -Infinity;
    for (let e = from; e < to; e++) if (values[e] > max) max = values[e];
    scale[i] = max;
    for (let e = from; e < to; e++) values[e] = Math.exp(values[e] - max);
  }
  return scale;
}

export interface JoinProgress {
  (fraction: number): void;
}

/**
 * Total probability of the outcomes with S(a) + S(b) < threshold ("less extreme than observed").
 * Both lists must hold every half vector that occurs in such an outcome; their log-weights are
 * overwritten (by scaled weights) to save memory. Needs no sorting: each
 * b bucket is binned by statistic (binned-bucket.ts) and each a asks it for the mass below
 * threshold − S(a).
 * `second` may be the same object as `first` when the halves mirror each other.
 */
export function massBelowThreshold(
  first: HalfLists,
  second: HalfLists,
  n: number,
  threshold: number,
  logOffset: number,
  onProgress?: JoinProgress,
): number {
  const aScale = scaleWeightsInPlace(first);
  const bScale = second === first ? aScale : scaleWeightsInPlace(second);
  const total = new CompensatedSum();
  const bucket = new BinnedBucket();
  const buckets = first.offsets.length - 1;
  const aStat = first.stat;
  const aWeight = first.logWeight;
  for (let i = 0; i < buckets; i++) {
    const t = first.tMin + i;
    const a0 = first.offsets[i];
    const a1 = first.offsets[i + 1];
    const [b0, b1] = bucketRange(second, n - t);
    if (a1 === a0 || b1 === b0) continue;
    bucket.load(second.stat, second.logWeight, b0, b1);
    let acc = 0;
    for (let e = a0; e < a1; e++) acc += aWeight[e] * bucket.massBelow(threshold - aStat[e]);
    if (acc > 0) total.add(Math.exp(logOffset + aScale[i] + bScale[n - t - second.tMin]) * acc);
    if (onProgress && (i & 63) === 0) onProgress(i / buckets);
  }
  return total.value;
}

/**
 * ln of the total probability of the listed outcomes with S(a) + S(b) ≥ threshold. Both lists'
 * buckets must be sorted: walking a's bucket upward, the part of b's bucket that completes a to
 * the threshold grows monotonically, so one pointer sweep joins two buckets. Works in
 * log space throughout (suffix sums of b's weights by running log-sum-exp) so that it stays
 * exact when that probability is far below the smallest double.
 */
export function logMassAtOrAboveThreshold(
  first: HalfLists,
  second: HalfLists,
  n: number,
  threshold: number,
  logOffset: number,
  onProgress?: JoinProgress,
): number {
  const total = new LogSum();
  let logSuffix = new Float64Array(16);
  const buckets = first.offsets.length - 1;
  for (let i = 0; i < buckets; i++) {
    const t = first.tMin + i;
    const [a0, a1] = [first.offsets[i], first.offsets[i + 1]];
    const [b0, b1] = bucketRange(second, n - t);
    if (a1 === a0 || b1 === b0) continue;
    const length = b1 - b0;
    if (logSuffix.length < length + 1) logSuffix = new Float64Array(2 * length + 1);
    const bStat = second.stat;
    const bWeight = second.logWeight;
    let running = -Infinity;
    logSuffix[length] = -Infinity;
    for (let e = length - 1; e >= 0; e--) {
      const w = bWeight[b0 + e];
      running = running >= w ? running + Math.log1p(Math.exp(w - running)) : w + Math.log1p(Math.exp(running - w));
      logSuffix[e] = running;
    }
    // j = first index of b's bucket whose statistic completes the current a to the threshold.
    let j = length;
    for (let e = a0; e < a1; e++) {
      const limit = threshold - first.stat[e];
      while (j > 0 && bStat[b0 + j - 1] >= limit) j--;
      if (j < length) total.add(logOffset + first.logWeight[e] + logSuffix[j]);
    }
    if (onProgress && (i & 63) === 0) onProgress(i / buckets);
  }
  return total.value;
}
