/**
 * Enumerates one half of the categories: every count vector of the half that can still be part
 * of an outcome the search needs, bucketed by the half's total t, with its partial statistic and
 * partial log-probability.
 *
 * Depth-first over the half's categories. At each category the accepted counts form an interval:
 * with the counts so far fixed, "partial score + this category's term + least score the remaining
 * categories (rest of this half and all of the other half) can reach with what is left" is convex
 * in the count (see suffix-minimum.ts), so the interval is scanned outward from its minimiser and
 * the scan stops at the first rejected count on each side. At the half's last category the two
 * ends are found by bisection instead of a scan.
 *
 * Categories with equal shares are exchangeable: their counts are enumerated in non-increasing
 * order only, and each such vector carries the log of its number of distinct orderings
 * (m! / ∏ run lengths!) in its log-probability.
 */
import { CategoryTable } from './category-tables';
import { SuffixMinimum } from './suffix-minimum';

export interface HalfLayout {
  n: number;
  /** this half's categories first, then the other half's (the order the suffix minima were built in) */
  tables: readonly CategoryTable[];
  suffix: SuffixMinimum;
  /** number of categories in this half */
  size: number;
  /** groupPosition[j] = 1-based position of category j within its run of equal shares in this half */
  groupPosition: Int32Array;
  /** prune a partial outcome when its score plus the least completion reaches this */
  limit: number;
}

export interface HalfCounts {
  /** smallest total of the half that can occur */
  tMin: number;
  /** counts per total, index t − tMin */
  perTotal: Float64Array;
  elements: number;
  /** partial count vectors visited above the last category */
  prefixes: number;
}

export interface HalfLists {
  tMin: number;
  /** offsets[t − tMin] .. offsets[t − tMin + 1] is the bucket of half total t */
  offsets: Int32Array;
  /** partial statistic of each element */
  stat: Float64Array;
  /** partial log-probability (sum of ln Poisson densities, plus ln of the number of orderings) */
  logWeight: Float64Array;
}

const LOG_SMALL_INTEGERS = Array.from({ length: 64 }, (_, i) => (i === 0 ? 0 : Math.log(i)));

function logInteger(i: number): number {
  return i < LOG_SMALL_INTEGERS.length ? LOG_SMALL_INTEGERS[i] : Math.log(i);
}

interface Visitor {
  /** called for each accepted count interval of the last category; return false to stop */
  lastInterval(u: number, yLo: number, yHi: number, statPre: number, gPre: number, cap: number, run: number): boolean;
  /** called for each inner node; return false to stop */
  inner(): boolean;
}

/** Runs the depth-first search, handing each accepted interval of the half's last category to the visitor. */
function walk(layout: HalfLayout, visitor: Visitor): void {
  const { n, tables, size, limit, groupPosition } = layout;
  const { base, minima, firstShare } = layout.suffix;
  let stopped = false;

  // scorePre: the pruning score so far; statPre: the statistic so far; gPre: the log-probability so far.
  const descend = (j: number, u: number, scorePre: number, statPre: number, gPre: number, cap: number, run: number): void => {
    const table = tables[j];
    const score = table.score;
    const lo = table.lo;
    const next = minima[j + 1];
    const nextBase = base[j + 1];
    const x = n - u;
    let yMin = x - (nextBase + next.length - 1);
    if (yMin < lo) yMin = lo;
    let yMax = x - nextBase;
    if (yMax > table.hi) yMax = table.hi;
    const tied = groupPosition[j] > 1;
    if (tied && yMax > cap) yMax = cap;
    if (yMin > yMax) return;
    let y0 = lo + firstShare[j][x - base[j]];
    if (y0 < yMin) y0 = yMin;
    else if (y0 > yMax) y0 = yMax;
    const offset = x - nextBase;
    if (scorePre + score[y0 - lo] + next[offset - y0] >= limit) return;

    if (j === size - 1) {
      // Bisection for the two ends of the accepted interval (the bound is convex in y).
      let inside = y0;
      let outside = yMax + 1;
      while (outside - inside > 1) {
        const middle = (inside + outside) >>> 1;
        if (scorePre + score[middle - lo] + next[offset - middle] < limit) inside = middle;
        else outside = middle;
      }
      const yHi = inside;
      inside = y0;
      outside = yMin - 1;
      while (inside - outside > 1) {
        const middle = outside + ((inside - outside + 1) >>> 1);
        if (scorePre + score[middle - lo] + next[offset - middle] < limit) inside = middle;
        else outside = middle;
      }
      if (!visitor.lastInterval(u, inside, yHi, statPre, gPre, cap, run)) stopped = true;
      return;
    }

    if (!visitor.inner()) {
      stopped = true;
      return;
    }
    const stat = table.stat;
    const weight = table.weight;
    const position = groupPosition[j];
    const logPosition = logInteger(position);
    for (let direction = 1; direction >= -1; direction -= 2) {
      for (let y = direction === 1 ? y0 : y0 - 1; direction === 1 ? y <= yMax : y >= yMin; y += direction) {
        if (scorePre + score[y - lo] + next[offset - y] >= limit) break;
        const newRun = tied && y === cap ? run + 1 : 1;
        const logOrderings = logPosition - logInteger(newRun);
        descend(j + 1, u + y, scorePre + score[y - lo], statPre + stat[y - lo], gPre + weight[y - lo] + logOrderings, y, newRun);
        if (stopped) return;
      }
    }
  };

  descend(0, 0, 0, 0, 0, 0, 0);
}

/** The half's smallest and largest possible totals. */
function totalRange(layout: HalfLayout): { tMin: number; tMax: number } {
  let tMin = 0;
  let tMax = 0;
  for (let j = 0; j < layout.size; j++) {
    tMin += layout.tables[j].lo;
    tMax += layout.tables[j].hi;
  }
  return { tMin, tMax };
}

/**
 * Counts the elements per half total without materialising them. Costs one visit per partial
 * vector above the last category. Returns undefined once prefixes + elements exceed `budget`.
 */
export function countHalf(layout: HalfLayout, budget: number): HalfCounts | undefined {
  const { tMin, tMax } = totalRange(layout);
  const perTotal = new Float64Array(tMax - tMin + 2);
  let elements = 0;
  let prefixes = 0;
  let over = false;
  walk(layout, {
    lastInterval(u, yLo, yHi) {
      if (yHi < yLo) return true;
      perTotal[u + yLo - tMin] += 1;
      perTotal[u + yHi + 1 - tMin] -= 1;
      elements += yHi - yLo + 1;
      prefixes++;
      if (elements + prefixes > budget) {
        over = true;
        return false;
      }
      return true;
    },
    inner() {
      prefixes++;
      return true;
    },
  });
  if (over) return undefined;
  // Turn the difference array into counts.
  let running = 0;
  for (let i = 0; i < perTotal.length; i++) {
    running += perTotal[i];
    perTotal[i] = running;
  }
  return { tMin, perTotal: perTotal.subarray(0, tMax - tMin + 1), elements, prefixes };
}

/** Materialises the elements counted by `countHalf`, bucketed by half total. */
export function fillHalf(layout: HalfLayout, counts: HalfCounts, onElements?: (written: number) => void): HalfLists {
  const buckets = counts.perTotal.length;
  const offsets = new Int32Array(buckets + 1);
  for (let i = 0; i < buckets; i++) offsets[i + 1] = offsets[i] + counts.perTotal[i];
  const cursor = offsets.slice(0, buckets);
  const stat = new Float64Array(counts.elements);
  const logWeight = new Float64Array(counts.elements);
  const tMin = counts.tMin;
  const lastIndex = layout.size - 1;
  const last = layout.tables[lastIndex];
  const lastStat = last.stat;
  const lastWeight = last.weight;
  const lastLo = last.lo;
  const tiedLast = layout.groupPosition[lastIndex] > 1;
  const logLastPosition = Math.log(layout.groupPosition[lastIndex]);
  let written = 0;
  let nextReport = 1 << 20;
  walk(layout, {
    lastInterval(u, yLo, yHi, statPre, gPre, cap, run) {
      for (let y = yLo; y <= yHi; y++) {
        const newRun = tiedLast && y === cap ? run + 1 : 1;
        const logOrderings = logLastPosition - logInteger(newRun);
        const slot = cursor[u + y - tMin]++;
        stat[slot] = statPre + lastStat[y - lastLo];
        logWeight[slot] = gPre + lastWeight[y - lastLo] + logOrderings;
      }
      written += yHi - yLo + 1;
      if (onElements && written >= nextReport) {
        onElements(written);
        nextReport = written + (1 << 20);
      }
      return true;
    },
    inner() {
      return true;
    },
  });
  return { tMin, offsets, stat, logWeight };
}
