/**
 * In-place sort of keys[from, to) ascending, moving companion[i] along with keys[i].
 * Quicksort with median-of-three pivots and insertion sort for short ranges; the larger side is
 * handled by the loop and the smaller by recursion, so the stack stays O(log n) deep.
 * (Typed arrays' built-in sort cannot carry a companion array, and an index sort with a
 * comparator callback is several times slower.)
 */
const INSERTION_LIMIT = 24;

export function sortByKey(keys: Float64Array, companion: Float64Array, from: number, to: number): void {
  let lo = from;
  let hi = to - 1;
  while (hi - lo >= INSERTION_LIMIT) {
    const mid = (lo + hi) >>> 1;
    // Median of three into keys[mid].
    if (keys[mid] < keys[lo]) swap(keys, companion, mid, lo);
    if (keys[hi] < keys[lo]) swap(keys, companion, hi, lo);
    if (keys[hi] < keys[mid]) swap(keys, companion, hi, mid);
    const pivot = keys[mid];
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (keys[i] < pivot) i++;
      while (keys[j] > pivot) j--;
      if (i <= j) {
        swap(keys, companion, i, j);
        i++;
        j--;
      }
    }
    if (j - lo < hi - i) {
      sortByKey(keys, companion, lo, j + 1);
      lo = i;
    } else {
      sortByKey(keys, companion, i, hi + 1);
      hi = j;
    }
  }
  for (let i = lo + 1; i <= hi; i++) {
    const key = keys[i];
    const value = companion[i];
    let j = i - 1;
    while (j >= lo && keys[j] > key) {
      keys[j + 1] = keys[j];
      companion[j + 1] = companion[j];
      j--;
    }
    keys[j + 1] = key;
    companion[j + 1] = value;
  }
}

function swap(keys: Float64Array, companion: Float64Array, a: number, b: number): void {
  const key = keys[a];
  keys[a] = keys[b];
  keys[b] = key;
  const value = companion[a];
  companion[a] = companion[b];
  companion[b] = value;
}
