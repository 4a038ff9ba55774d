/**
 * Aggregation of residuals into daily (default) or hourly bucket means.
 *
 * Hourly residuals are autocorrelated (temperature lag, traffic, daily cycles), so charts
 * with nominal false-alarm rates work on daily means (REFERENCES.md [practice]). Buckets
 * are UTC days or hours shifted by `offsetMs` (e.g. +2 h so that a day runs from 22:00 UTC,
 * a local midnight); a bucket is labelled by its start time.
 */
import { assertFiniteNumber, assertNumberArray } from "@/lib/numeric/validate";

/** Options of {@link aggregateResiduals}. */
export interface AggregateOptions {
  /** Bucket length: 'day' (default) or 'hour'. */
  bucket?: "day" | "hour";
  /** Bucket boundary offset in ms from UTC midnight / full hour, |offset| < bucket length (default 0). */
  offsetMs?: number;
}

/** Bucket means of several columns (e.g. one residual column per tracked mode). */
export interface AggregatedSeries {
  /** Bucket start times, ms UTC, increasing; only buckets holding at least one value. */
  bucketStartMs: number[];
  /** Per column: mean of its values in each bucket, NaN where it has none. */
  mean: Float64Array[];
  /** Per column: number of values averaged in each bucket. */
  count: Uint32Array[];
}

/**
 * Bucket means of one or more columns sampled at the same times.
 *
 * @param timesMs - sample times in ms UTC (any order), finite; not mutated.
 * @param columns - one array per column, each timesMs.length long; NaN = no value.
 * @param options - see {@link AggregateOptions}.
 * @returns {@link AggregatedSeries}. Cost O(n log n) (bucket sort).
 * @throws TypeError for non-arrays, non-finite times or ±Infinity values; RangeError for
 *   unequal lengths, no column, or |offsetMs| ≥ the bucket length.
 */
export function aggregateResiduals(
  timesMs: ArrayLike<number>, columns: ReadonlyArray<ArrayLike<number>>, options: AggregateOptions = {},
): AggregatedSeries {
  assertNumberArray(timesMs, "timesMs", 0);
  if (!Array.isArray(columns)) throw new TypeError(`columns must be an array of arrays (got ${typeof columns})`);
  if (columns.length < 1) throw new RangeError("columns must hold at least 1 column (got 0)");
  const n = timesMs.length;
  columns.forEach((c, j) => {
    assertNumberArray(c, `columns[${j}]`, 0, false);
    if (c.length !== n) throw new RangeError(`columns[${j}] must have length ${n} (got ${c.length})`);
    for (let i = 0; i < n; i++) {
      if (c[i] === Infinity || c[i] === -Infinity) throw new TypeError(`columns[${j}] must hold finite numbers or NaN (got ${c[i]} at ${i})`);
    }
  });
  const len = (options.bucket ?? "day") === "day" ? 86_400_000 : 3_600_000;
  if (options.bucket !== undefined && options.bucket !== "day" && options.bucket !== "hour") {
    throw new RangeError(`bucket must be 'day' or 'hour' (got ${String(options.bucket)})`);
  }
  const offset = options.offsetMs ?? 0;
  assertFiniteNumber(offset, "offsetMs");
  if (Math.abs(offset) >= len) throw new RangeError(`|offsetMs| must be < ${len} (got ${offset})`);
  const k = columns.length;
  const sums = new Map<number, { s: Float64Array; c: Uint32Array }>();
  for (let i = 0; i < n; i++) {
    const b = Math.floor((timesMs[i] - offset) / len);
    let acc = sums.get(b);
    for (let j = 0; j < k; j++) {
      const v = columns[j][i];
      if (Number.isNaN(v)) continue;
      if (!acc) sums.set(b, (acc = { s: new Float64Array(k), c: new Uint32Array(k) }));
      acc.s[j] += v;
      acc.c[j]++;
    }
  }
  const keys = [...sums.keys()].sort((a, b) => a - b);
  const mean = columns.map(() => new Float64Array(keys.length));
  const count = columns.map(() => new Uint32Array(keys.length));
  keys.forEach((key, r) => {
    const acc = sums.get(key)!;
    for (let j = 0; j < k; j++) {
      count[j][r] = acc.c[j];
      mean[j][r] = acc.c[j] > 0 ? acc.s[j] / acc.c[j] : Number.NaN;
    }
  });
  return { bucketStartMs: keys.map((key) => key * len + offset), mean, count };
}
