/**
 * Order statistics in O(n) expected time (Hoare's quickselect) — medians of long records
 * without the O(n log n) sort.
 */
import { assertNumberArray } from "./validate";

/**
 * Median of finite values (mean of the two middle values for an even count).
 * @param x - values, length ≥ 1, finite. Not mutated (a copy is partitioned).
 * @throws TypeError / RangeError for bad input.
 */
export function median(x: ArrayLike<number>): number {
  assertNumberArray(x, "x", 1);
  const a = Float64Array.from(x);
  const n = a.length;
  const hi = selectInPlace(a, n >> 1);
  if (n % 2 === 1) return hi;
  // After selection, everything left of n/2 is ≤ a[n/2]: the lower middle is their maximum.
  let lo = -Infinity;
  for (let i = 0; i < n >> 1; i++) if (a[i] > lo) lo = a[i];
  return (lo + hi) / 2;
}

/** k-th smallest (0-based) of `a`, partitioning `a` in place (internal; trusts arguments). */
export function selectInPlace(a: Float64Array, k: number): number {
  let left = 0;
  let right = a.length - 1;
  while (right > left) {
    // median of three as pivot guards against sorted input
    const mid = (left + right) >> 1;
    const p = med3(a[left], a[mid], a[right]);
    let i = left, j = right;
    while (i <= j) {
      while (a[i] < p) i++;
      while (a[j] > p) j--;
      if (i <= j) {
        const t = a[i]; a[i] = a[j]; a[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else return a[k];
  }
  return a[k];
}

function med3(a: number, b: number, c: number): number {
  return a < b ? (b < c ? b : a < c ? c : a) : a < c ? a : b < c ? c : b;
}
