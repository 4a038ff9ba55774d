/**
 * Baseline model of a natural frequency against temperature (and optional covariates).
 *
 * Method [1]: least squares of
 *   linear:   f = a + b·T + Σ γ_j x_j
 *   bilinear: f = a + b·T + c·min(T − T_k, 0) + Σ γ_j x_j
 * where T is the measured temperature or, with `lagHours`, its trailing moving average
 * (structure temperature lags the air). The bilinear form is continuous at the knot T_k
 * by construction (slope b above, b + c below: stiffening when asphalt and moisture
 * freeze [1]). T_k is searched on a grid over `knotRangeC` (default −5…5 °C, 0.5 °C) and
 * refined by golden-section search on the residual sum of squares within ±1 grid step
 * [2]. With `model: 'auto'` the candidate with the lowest BIC = n·ln(RSS/n) + q·ln n wins
 * (q counts coefficients, and the knot for the bilinear model) [3].
 *
 * [1] Peeters & De Roeck, Earthquake Eng. Struct. Dyn. 30(2):149–171, 2001.
 * [2] Press et al., Numerical Recipes, 3rd ed., 2007, §10.2 (golden section).
 * [3] Schwarz, Annals of Statistics 6(2):461–464, 1978.
 */
import { assertFiniteNumber, assertNumberArray, assertPositive } from "@/lib/numeric/validate";
import { fitOls } from "./least-squares";
import { laggedTemperature } from "./lagged-temperature";

export type BaselineModelKind = "linear" | "bilinear";

/** Training data of one tracked mode, in time order. */
export interface BaselineTrainingSet {
  /** Estimate times, ms UTC, non-decreasing. */
  timesMs: ArrayLike<number>;
  /** Identified natural frequency, Hz. */
  frequencyHz: ArrayLike<number>;
  /** Measured temperature, °C. */
  temperatureC: ArrayLike<number>;
  /** Extra covariates by name (e.g. humidityPct), each the same length, finite. */
  covariates?: Readonly<Record<string, ArrayLike<number>>>;
}

/** Options of {@link fitBaseline}. */
export interface BaselineFitOptions {
  /** Model form, or 'auto' to choose by BIC (default 'auto'). */
  model?: BaselineModelKind | "auto";
  /** Knot search interval in °C (default [−5, 5]). */
  knotRangeC?: readonly [number, number];
  /** Knot grid step in °C, > 0 (default 0.5). */
  knotStepC?: number;
  /** Least points on each side of a knot for the bilinear model (default 10). */
  minPointsPerSegment?: number;
  /** Trailing moving-average window of temperature in hours, > 0; omit for none. */
  lagHours?: number;
  /** Training span (days) from which the status is 'complete' (default 365). */
  fullYearDays?: number;
}

/** A fitted baseline (plain data: storable as JSON). */
export interface BaselineModel {
  kind: BaselineModelKind;
  /** Knot in °C for the bilinear model, else null. */
  knotC: number | null;
  /** a, Hz. */
  interceptHz: number;
  /** Slope above the knot (or the only slope), Hz/°C. */
  slopeHzPerC: number;
  /** Slope below the knot, Hz/°C (bilinear), else null. */
  coldSlopeHzPerC: number | null;
  /** Covariate names and their coefficients (Hz per covariate unit), same order. */
  covariateNames: string[];
  covariateCoefficients: number[];
  /** Lag window in hours, or null for the measured temperature. */
  lagHours: number | null;
  /** Residual standard deviation √(RSS/(n − q)), Hz. */
  residualStdHz: number;
  /** Number of training points and of fitted parameters q. */
  n: number;
  parameters: number;
  /** Bayesian information criterion of the chosen model. */
  bic: number;
  /** Range of the (lagged) temperature and of each covariate in the training data. */
  envelope: { temperatureC: [number, number]; covariates: Record<string, [number, number]> };
  trainingStartMs: number;
  trainingEndMs: number;
  spanDays: number;
  /** 'provisional' until the training window spans `fullYearDays`, then 'complete'. */
  status: "provisional" | "complete";
  /** Every model tried, for comparison. */
  candidates: { kind: BaselineModelKind; knotC: number | null; bic: number; residualStdHz: number }[];
  warnings: string[];
}

interface Candidate {
  kind: BaselineModelKind;
  knotC: number | null;
  intercept: number;
  beta: Float64Array;
  rss: number;
  q: number;
}

/**
 * Fits a baseline of frequency against temperature for one mode (see header).
 *
 * @param data - training set, n ≥ 8 points, see {@link BaselineTrainingSet}; not mutated.
 * @param options - see {@link BaselineFitOptions}.
 * @returns the {@link BaselineModel}; `warnings` says when the bilinear model could not be
 *   fitted (too few points on one side of every knot) or the window is short.
 * @throws TypeError for non-arrays or non-finite values; RangeError for unequal lengths,
 *   decreasing times, n < 8, an empty knot range, a non-positive step or lag, or a
 *   requested model that cannot be fitted (constant temperature, too few cold points).
 */
export function fitBaseline(data: BaselineTrainingSet, options: BaselineFitOptions = {}): BaselineModel {
  const { timesMs, frequencyHz, temperatureC } = data;
  assertNumberArray(timesMs, "timesMs", 8);
  assertNumberArray(frequencyHz, "frequencyHz", 8);
  assertNumberArray(temperatureC, "temperatureC", 8);
  const n = timesMs.length;
  if (frequencyHz.length !== n || temperatureC.length !== n) {
    throw new RangeError(`frequencyHz and temperatureC must have the length of timesMs (got ${frequencyHz.length}, ${temperatureC.length} ≠ ${n})`);
  }
  for (let i = 1; i < n; i++) {
    if (timesMs[i] < timesMs[i - 1]) throw new RangeError(`timesMs must be non-decreasing (got ${timesMs[i]} < ${timesMs[i - 1]} at index ${i})`);
  }
  const covNames = Object.keys(data.covariates ?? {});
  const covCols = covNames.map((k) => {
    const c = (data.covariates ?? {})[k];
    assertNumberArray(c, `covariates.${k}`);
    if (c.length !== n) throw new RangeError(`covariates.${k} must have length ${n} (got ${c.length})`);
    return c;
  });
  const mode = options.model ?? "auto";
  if (!["auto", "linear", "bilinear"].includes(mode)) throw new RangeError(`model must be 'auto', 'linear' or 'bilinear' (got ${String(mode)})`);
  const [kLo, kHi] = options.knotRangeC ?? [-5, 5];
  assertFiniteNumber(kLo, "knotRangeC[0]");
  assertFiniteNumber(kHi, "knotRangeC[1]");
  if (!(kHi > kLo)) throw new RangeError(`knotRangeC must be an interval lo < hi (got [${kLo}, ${kHi}])`);
  const step = options.knotStepC ?? 0.5;
  assertPositive(step, "knotStepC");
  const minSeg = options.minPointsPerSegment ?? 10;
  assertPositive(minSeg, "minPointsPerSegment");
  if (options.lagHours !== undefined) assertPositive(options.lagHours, "lagHours");
  const fullYearDays = options.fullYearDays ?? 365;
  assertPositive(fullYearDays, "fullYearDays");

  const temp = options.lagHours !== undefined ? laggedTemperature(timesMs, temperatureC, options.lagHours) : Float64Array.from(temperatureC);
  const warnings: string[] = [];
  const candidates: Candidate[] = [];
  if (mode !== "bilinear") {
    const lin = fitOls([temp, ...covCols], frequencyHz);
    if (lin) candidates.push({ kind: "linear", knotC: null, intercept: lin.intercept, beta: lin.beta, rss: lin.rss, q: 2 + covCols.length });
    else if (mode === "linear") throw new RangeError("the linear model cannot be fitted: temperature or a covariate is constant or collinear");
  }
  if (mode !== "linear") {
    const bil = fitBilinear(temp, frequencyHz, covCols, kLo, kHi, step, minSeg);
    if (bil) candidates.push(bil);
    else if (mode === "bilinear") throw new RangeError(`the bilinear model needs ≥ ${minSeg} points on each side of a knot in [${kLo}, ${kHi}] °C (got too few)`);
    else warnings.push(`bilinear model not fitted: fewer than ${minSeg} points on one side of every knot in [${kLo}, ${kHi}] °C`);
  }
  if (candidates.length === 0) throw new RangeError("no baseline model can be fitted: temperature or a covariate is constant or collinear");
  const bic = (c: Candidate) => n * Math.log(Math.max(c.rss, Number.MIN_VALUE) / n) + c.q * Math.log(n);
  const best = candidates.reduce((a, b) => (bic(b) < bic(a) ? b : a));
  const rstd = (c: Candidate) => Math.sqrt(c.rss / Math.max(1, n - c.q));
  const envelope = { temperatureC: range(temp), covariates: Object.fromEntries(covNames.map((k, j) => [k, range(covCols[j])])) };
  const spanDays = (timesMs[n - 1] - timesMs[0]) / 86_400_000;
  if (spanDays < fullYearDays) warnings.push(`training window spans ${spanDays.toFixed(1)} days < ${fullYearDays}: provisional`);
  const nTemp = best.kind === "bilinear" ? 2 : 1;
  return {
    kind: best.kind,
    knotC: best.knotC,
    interceptHz: best.intercept,
    slopeHzPerC: best.beta[0],
    coldSlopeHzPerC: best.kind === "bilinear" ? best.beta[0] + best.beta[1] : null,
    covariateNames: covNames,
    covariateCoefficients: Array.from(best.beta.subarray(nTemp)),
    lagHours: options.lagHours ?? null,
    residualStdHz: rstd(best),
    n,
    parameters: best.q,
    bic: bic(best),
    envelope,
    trainingStartMs: timesMs[0],
    trainingEndMs: timesMs[n - 1],
    spanDays,
    status: spanDays >= fullYearDays ? "complete" : "provisional",
    candidates: candidates.map((c) => ({ kind: c.kind, knotC: c.knotC, bic: bic(c), residualStdHz: rstd(c) })),
    warnings,
  };
}

/** Grid search of the knot, then golden-section refinement of RSS(knot) within ±step. */
function fitBilinear(
  temp: Float64Array, y: ArrayLike<number>, covCols: ArrayLike<number>[], lo: number, hi: number, step: number, minSeg: number,
): Candidate | null {
  const hinge = new Float64Array(temp.length);
  const evalKnot = (k: number) => {
    let below = 0;
    for (let i = 0; i < temp.length; i++) {
      hinge[i] = Math.min(temp[i] - k, 0);
      if (temp[i] < k) below++;
    }
    if (below < minSeg || temp.length - below < minSeg) return null;
    return fitOls([temp, hinge, ...covCols], y);
  };
  let bestK = Number.NaN;
  let bestRss = Infinity;
  for (let k = lo; k <= hi + 1e-9 * step; k += step) {
    const r = evalKnot(k);
    if (r && r.rss < bestRss) [bestK, bestRss] = [k, r.rss];
  }
  if (!Number.isFinite(bestRss)) return null;
  const rssAt = (k: number) => evalKnot(k)?.rss ?? Infinity;
  let a = Math.max(lo, bestK - step);
  let b = Math.min(hi, bestK + step);
  const g = (Math.sqrt(5) - 1) / 2;
  let c = b - g * (b - a), d = a + g * (b - a);
  let fc = rssAt(c), fd = rssAt(d);
  for (let it = 0; it < 40 && b - a > 1e-4; it++) {
    if (fc < fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - g * (b - a);
      fc = rssAt(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + g * (b - a);
      fd = rssAt(d);
    }
  }
  const kRef = fc < fd ? c : d;
  const knot = Math.min(fc, fd) < bestRss ? kRef : bestK;
  const fit = evalKnot(knot);
  if (!fit) return null;
  return { kind: "bilinear", knotC: knot, intercept: fit.intercept, beta: fit.beta, rss: fit.rss, q: 4 + covCols.length };
}

function range(a: ArrayLike<number>): [number, number] {
  let lo = Infinity, hi = -Infinity;
  for (let i = 0; i < a.length; i++) {
    if (a[i] < lo) lo = a[i];
    if (a[i] > hi) hi = a[i];
  }
  return [lo, hi];
}
