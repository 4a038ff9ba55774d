/**
 * EWMA control chart with time-varying limits.
 *
 * Method [1, 2]: z_i = λ x_i + (1 − λ) z_{i−1}, z_0 = μ₀, with limits
 *   μ₀ ± L σ √( λ/(2 − λ) · (1 − (1 − λ)^{2i}) )
 * which widen to the asymptotic μ₀ ± L σ √(λ/(2 − λ)). (λ, L) pairs with an in-control
 * ARL ≈ 500 for a step-shift design [2]: (0.05, 2.615), (0.10, 2.814), (0.20, 2.962).
 * Missing points (NaN) leave z and i unchanged: the chart waits rather than imputing.
 * With autocorrelated inputs the nominal ARL is optimistic (REFERENCES.md [practice]):
 * chart daily aggregates and estimate σ from them.
 *
 * [1] Montgomery, Introduction to Statistical Quality Control, 7th ed., ch. 9.
 * [2] Lucas & Saccucci, Technometrics 32(1):1–12, 1990.
 */
import { assertFiniteNumber, assertNumberArray, assertPositive } from "@/lib/numeric/validate";

/** (λ, L) pairs of REFERENCES.md with an in-control ARL ≈ 500 [2]. */
export const EWMA_ARL500_DESIGNS: ReadonlyArray<{ lambda: number; L: number }> = [
  { lambda: 0.05, L: 2.615 },
  { lambda: 0.1, L: 2.814 },
  { lambda: 0.2, L: 2.962 },
];

/**
 * L for a λ of the ARL ≈ 500 table.
 *
 * @param lambda - one of 0.05, 0.10, 0.20.
 * @returns L (dimensionless).
 * @throws TypeError for a non-number; RangeError for a λ not in the table.
 */
export function ewmaLimitWidthForArl500(lambda: number): number {
  assertFiniteNumber(lambda, "lambda");
  const row = EWMA_ARL500_DESIGNS.find((d) => Math.abs(d.lambda - lambda) < 1e-12);
  if (!row) throw new RangeError(`lambda must be one of 0.05, 0.1, 0.2 for the ARL≈500 table (got ${lambda})`);
  return row.L;
}

/** Settings of an EWMA chart. */
export interface EwmaSettings {
  /** Smoothing weight λ in (0, 1]. */
  lambda: number;
  /** Limit width L in σ units, > 0. */
  L: number;
  /** In-control mean μ₀ (units of x). */
  mu0: number;
  /** In-control standard deviation σ of one x, > 0 (units of x). */
  sigma: number;
}

/** EWMA statistic and limits per point. */
export interface EwmaChart {
  /** z_i (units of x); for a missing point the previous z. */
  z: Float64Array;
  /** Lower and upper limits at each point (units of x). */
  lcl: Float64Array;
  ucl: Float64Array;
  /** true where z is outside [lcl, ucl] at a present point. */
  beyond: Uint8Array;
  /** Index of the first point beyond the limits, or −1. */
  firstSignal: number;
}

/**
 * Runs an EWMA chart over a series (see header).
 *
 * @param x - observations in time order (units of x); NaN marks a missing point; not mutated.
 * @param settings - λ, L, μ₀, σ, see {@link EwmaSettings}.
 * @returns {@link EwmaChart}, arrays of length x.length. Cost O(n).
 * @throws TypeError for a non-array or ±Infinity entries; RangeError for λ outside (0, 1],
 *   L ≤ 0 or σ ≤ 0.
 */
export function runEwmaChart(x: ArrayLike<number>, settings: EwmaSettings): EwmaChart {
  assertNumberArray(x, "x", 0, false);
  for (let i = 0; i < x.length; i++) {
    if (x[i] === Infinity || x[i] === -Infinity) throw new TypeError(`x must hold finite numbers or NaN (got ${x[i]} at index ${i})`);
  }
  const { lambda, L, mu0, sigma } = settings;
  assertFiniteNumber(lambda, "lambda");
  if (!(lambda > 0 && lambda <= 1)) throw new RangeError(`lambda must be within (0, 1] (got ${lambda})`);
  assertPositive(L, "L");
  assertFiniteNumber(mu0, "mu0");
  assertPositive(sigma, "sigma");
  const n = x.length;
  const z = new Float64Array(n);
  const lcl = new Float64Array(n);
  const ucl = new Float64Array(n);
  const beyond = new Uint8Array(n);
  const base = lambda / (2 - lambda);
  let zi = mu0;
  let decay = 1; // (1 − λ)^{2i}
  let first = -1;
  let width = 0;
  for (let k = 0; k < n; k++) {
    const v = x[k];
    if (!Number.isNaN(v)) {
      zi = lambda * v + (1 - lambda) * zi;
      decay *= (1 - lambda) * (1 - lambda);
      width = L * sigma * Math.sqrt(base * (1 - decay));
      if (Math.abs(zi - mu0) > width) {
        beyond[k] = 1;
        if (first < 0) first = k;
      }
    }
    z[k] = zi;
    lcl[k] = mu0 - width;
    ucl[k] = mu0 + width;
  }
  return { z, lcl, ucl, beyond, firstSignal: first };
}

/**
 * Asymptotic EWMA standard deviation σ_z,∞ = σ √(λ/(2 − λ)) [1].
 *
 * @param lambda - in (0, 1].
 * @param sigma - σ of one observation, > 0 (units of x).
 * @returns σ_z,∞ (units of x).
 * @throws TypeError / RangeError for values outside those ranges.
 */
export function ewmaAsymptoticSigma(lambda: number, sigma: number): number {
  assertFiniteNumber(lambda, "lambda");
  if (!(lambda > 0 && lambda <= 1)) throw new RangeError(`lambda must be within (0, 1] (got ${lambda})`);
  assertPositive(sigma, "sigma");
  return sigma * Math.sqrt(lambda / (2 - lambda));
}

/**
 * Minimal detectable shift of an EWMA chart, defined here as the sustained mean shift
 * whose steady-state EWMA mean sits on the asymptotic limit: δ = L σ √(λ/(2 − λ)) [1].
 * A shift of this size is signalled with probability ≈ ½ at each point once the EWMA has
 * settled (≈ 2/λ points); larger shifts are caught sooner.
 *
 * @param settings - λ, L, σ (μ₀ is not used) of the chart, σ in Hz.
 * @param nominalHz - the mode's nominal frequency, > 0 Hz, for the relative figure.
 * @returns { shiftHz, shiftPct } (Hz, and % of `nominalHz`).
 * @throws TypeError / RangeError as {@link runEwmaChart}, and for nominalHz ≤ 0.
 */
export function ewmaMinimalShift(settings: Omit<EwmaSettings, "mu0">, nominalHz: number): { shiftHz: number; shiftPct: number } {
  assertPositive(settings.L, "L");
  assertPositive(nominalHz, "nominalHz");
  const shiftHz = settings.L * ewmaAsymptoticSigma(settings.lambda, settings.sigma);
  return { shiftHz, shiftPct: (100 * shiftHz) / nominalHz };
}
