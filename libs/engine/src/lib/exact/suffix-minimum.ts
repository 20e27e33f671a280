/**
 * For a sequence of categories with convex per-category scores, the least total score the
 * categories j, j+1, … can reach when they share a given total — for every j and every total —
 * and the count of category j in one optimal split.
 *
 * For separable convex functions the minimum over splits of a total (the min-plus convolution)
 * is again convex, and its increments are the merged, sorted increments of the parts (the greedy
 * "give the next unit to the cheapest category" rule is optimal for separable convex resource
 * allocation; Ibaraki & Katoh 1988, "Resource Allocation Problems", ch. 4). So each suffix is a
 * linear-time merge of the next one with one more category. The search uses these minima as
 * lower bounds to prune whole subtrees, and the optimal split as the point to start scanning a
 * category's accepted range from.
 */
import { CategoryTable } from './category-tables';

export interface SuffixMinimum {
  /** smallest total the suffix starting at j can hold (sum of window starts) */
  base: Int32Array;
  /** minima[j][x − base[j]]: least score of categories j.. holding total x */
  minima: Float64Array[];
  /** firstShare[j][x − base[j]]: count of category j (minus its window start) in an optimal split */
  firstShare: Int32Array[];
}

/** Builds the suffix minima for categories in the given order (all windows must be non-empty). */
export function buildSuffixMinimum(tables: readonly CategoryTable[]): SuffixMinimum {
  const k = tables.length;
  const base = new Int32Array(k + 1);
  const minima: Float64Array[] = new Array(k + 1);
  const firstShare: Int32Array[] = new Array(k + 1);
  // The empty suffix holds exactly total 0 at score 0.
  minima[k] = new Float64Array([0]);
  firstShare[k] = new Int32Array([0]);
  base[k] = 0;
  for (let j = k - 1; j >= 0; j--) {
    const table = tables[j];
    const own = table.score;
    const next = minima[j + 1];
    const ownLength = own.length;
    const nextLength = next.length;
    const length = ownLength + nextLength - 1;
    const values = new Float64Array(length);
    const shares = new Int32Array(length);
    let a = 0;
    let b = 0;
    values[0] = own[0] + next[0];
    for (let x = 1; x < length; x++) {
      const canTakeOwn = a < ownLength - 1;
      const canTakeNext = b < nextLength - 1;
      if (canTakeOwn && (!canTakeNext || own[a + 1] - own[a] <= next[b + 1] - next[b])) a++;
      else b++;
      values[x] = own[a] + next[b];
      shares[x] = a;
    }
    minima[j] = values;
    firstShare[j] = shares;
    base[j] = base[j + 1] + table.lo;
  }
  return { base, minima, firstShare };
}
