/**
 * In-control mean and standard deviation of a chart from training values, corrected for
 * lag-1 autocorrelation.
 *
 * Daily residuals after compensation still carry slow unmodelled effects (moisture,
 * temperature gradients), so consecutive days are positively correlated and an EWMA built
 * on the white-noise σ alarms far more often than its nominal ARL (REFERENCES.md
 * [practice]; [1]). For an AR(1) input with lag-1 correlation ρ, the stationary EWMA
 * variance is exactly
 *   σ_z² = σ² · λ/(2 − λ) · (1 + ρ(1 − λ)) / (1 − ρ(1 − λ))        [1, 2]
 * so the chart is run with the inflated σ_eff = σ·√((1 + φ)/(1 − φ)), φ = ρ(1 − λ), which
 * gives the limits of the ARL table the variance they assume. ρ is clipped to [0, 0.95]:
 * negative estimates on short series are noise, and ρ → 1 would mean no stable baseline.
 *
 * [1] Montgomery, Introduction to Statistical Quality Control, 7th ed., ch. 10
 *     (monitoring autocorrelated data).
 * [2] Box, Jenkins & Reinsel, Time Series Analysis, 4th ed., ch. 3 (AR(1) autocorrelation ρ^k).
 */
import { assertFiniteNumber, assertNumberArray } from "@/lib/numeric/validate";

/** Chart parameters estimated from training values. */
export interface ChartSigma {
  /** In-control mean μ₀ (units of the values). */
  mu0: number;
  /** Sample standard deviation σ (units of the values). */
  sigma: number;
  /** Lag-1 autocorrelation used, in [0, 0.95]. */
  lag1Autocorrelation: number;
  /** σ_eff for the EWMA limits (units of the values). */
  sigmaEffective: number;
}

/**
 * Estimates μ₀, σ, ρ₁ and the EWMA-effective σ (see header).
 *
 * @param values - training values in time order (e.g. daily mean residuals, Hz); NaN
 *   entries are skipped (a gap breaks no pair: pairs are consecutive present values);
 *   at least 3 present values; not mutated.
 * @param lambda - EWMA weight in (0, 1].
 * @returns {@link ChartSigma}.
 * @throws TypeError for a non-array or ±Infinity; RangeError for fewer than 3 values, a
 *   zero spread, or λ outside (0, 1].
 */
export function estimateChartSigma(values: ArrayLike<number>, lambda: number): ChartSigma {
  assertNumberArray(values, "values", 0, false);
  assertFiniteNumber(lambda, "lambda");
  if (!(lambda > 0 && lambda <= 1)) throw new RangeError(`lambda must be within (0, 1] (got ${lambda})`);
  const v: number[] = [];
  for (let i = 0; i < values.length; i++) {
    const x = values[i];
    if (x === Infinity || x === -Infinity) throw new TypeError(`values must be finite or NaN (got ${x} at ${i})`);
    if (!Number.isNaN(x)) v.push(x);
  }
  if (v.length < 3) throw new RangeError(`values must hold at least 3 present values (got ${v.length})`);
  const mu0 = v.reduce((a, x) => a + x, 0) / v.length;
  let ss = 0;
  let cross = 0;
  for (let i = 0; i < v.length; i++) {
    ss += (v[i] - mu0) ** 2;
    if (i > 0) cross += (v[i] - mu0) * (v[i - 1] - mu0);
  }
  if (!(ss > 0)) throw new RangeError("values must not all be equal (got zero spread)");
  const sigma = Math.sqrt(ss / (v.length - 1));
  const rho = Math.min(0.95, Math.max(0, cross / ss));
  const phi = rho * (1 - lambda);
  return { mu0, sigma, lag1Autocorrelation: rho, sigmaEffective: sigma * Math.sqrt((1 + phi) / (1 - phi)) };
}
