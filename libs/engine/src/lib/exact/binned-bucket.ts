/**
 * One bucket of half vectors regrouped by value of the partial statistic into equal-width bins
 * (a counting sort: two linear passes, no comparisons), with the probability mass of all lower
 * bins accumulated. The mass of the vectors whose statistic lies below any x is then
 * "mass of the bins wholly below x" plus an exact scan of the one bin containing x — O(1)
 * expected work per query, replacing a full sort followed by a merge.
 */
import { sortByKey } from './sort-by-key';

export class BinnedBucket {
  private stat: Float64Array;
  private weight: Float64Array;
  private binStart: Int32Array;
  private massBelowBin: Float64Array;
  private min = 0;
  private max = 0;
  private inverseWidth = 0;
  private bins = 0;
  /** total mass of the bucket */
  total = 0;

  constructor(capacity = 16) {
    this.stat = new Float64Array(capacity);
    this.weight = new Float64Array(capacity);
    this.binStart = new Int32Array(capacity + 2);
    this.massBelowBin = new Float64Array(capacity + 1);
  }

  /** Loads stat[from, to) with weights weight[from, to) (the weights already scaled to a safe range). */
  load(stat: Float64Array, weight: Float64Array, from: number, to: number): void {
    const length = to - from;
    if (this.stat.length < length) {
      this.stat = new Float64Array(2 * length);
      this.weight = new Float64Array(2 * length);
      this.binStart = new Int32Array(2 * length + 2);
      this.massBelowBin = new Float64Array(2 * length + 1);
    }
    let min = Infinity;
    let max = -Infinity;
    for (let e = from; e < to; e++) {
      const s = stat[e];
      if (s < min) min = s;
      if (s > max) max = s;
    }
    const bins = Math.max(1, length);
    const inverseWidth = max > min ? bins / (max - min) : 0;
    const binStart = this.binStart;
    binStart.fill(0, 0, bins + 2);
    for (let e = from; e < to; e++) {
      let bin = Math.floor((stat[e] - min) * inverseWidth);
      if (bin >= bins) bin = bins - 1;
      binStart[bin + 2]++;
    }
    for (let b = 2; b <= bins + 1; b++) binStart[b] += binStart[b - 1];
    // binStart[b + 1] is now the write cursor of bin b; after the pass it is the end of bin b.
    for (let e = from; e < to; e++) {
      let bin = Math.floor((stat[e] - min) * inverseWidth);
      if (bin >= bins) bin = bins - 1;
      const slot = binStart[bin + 1]++;
      this.stat[slot] = stat[e];
      this.weight[slot] = weight[e];
    }
    // Sort each bin and merge equal statistics (lattice-valued statistics such as Pearson's with
    // equal expected counts tie massively), so a query scans few, ordered entries.
    const keys = this.stat;
    const weights = this.weight;
    let write = 0;
    let mass = 0;
    for (let b = 0; b < bins; b++) {
      const from = binStart[b];
      const to = binStart[b + 1];
      if (to - from > 1) sortByKey(keys, weights, from, to);
      binStart[b] = write;
      this.massBelowBin[b] = mass;
      for (let e = from; e < to; e++) {
        mass += weights[e];
        if (write > binStart[b] && keys[write - 1] === keys[e]) weights[write - 1] += weights[e];
        else {
          keys[write] = keys[e];
          weights[write] = weights[e];
          write++;
        }
      }
    }
    binStart[bins] = write;
    this.massBelowBin[bins] = mass;
    this.total = mass;
    this.min = min;
    this.max = max;
    this.inverseWidth = inverseWidth;
    this.bins = bins;
  }

  /** Mass of the loaded vectors with statistic < x. */
  massBelow(x: number): number {
    if (x <= this.min) return 0;
    if (x > this.max) return this.total;
    let bin = Math.floor((x - this.min) * this.inverseWidth);
    if (bin >= this.bins) bin = this.bins - 1;
    let mass = this.massBelowBin[bin];
    const end = this.binStart[bin + 1];
    for (let e = this.binStart[bin]; e < end && this.stat[e] < x; e++) mass += this.weight[e];
    return mass;
  }
}
