/**
 * Predictions of a fitted baseline, with the out-of-envelope flag.
 *
 * Outside the temperature (or covariate) range of the training data the model is an
 * extrapolation, and a residual there says nothing reliable about the structure: such a
 * point is flagged "out of envelope, no decision" [1].
 *
 * [1] Peeters & De Roeck, Earthquake Eng. Struct. Dyn. 30(2):149–171, 2001.
 */
import { assertFiniteNumber, assertNumberArray } from "@/lib/numeric/validate";
import type { BaselineModel } from "./baseline-fit";
import { laggedTemperature } from "./lagged-temperature";

/** One prediction. */
export interface BaselinePrediction {
  /** Predicted frequency, Hz. */
  frequencyHz: number;
  /** true when the temperature or a covariate lies outside the training envelope. */
  outOfEnvelope: boolean;
}

/**
 * Predicted frequency at one (effective) temperature.
 *
 * @param model - from fitBaseline.
 * @param temperatureC - effective temperature in °C: the lagged one when `model.lagHours`
 *   is set (use {@link predictBaselineSeries} to have it computed).
 * @param covariates - value of each of `model.covariateNames` (units of training data).
 * @param envelopeMarginC - tolerance beyond the training temperature range, ≥ 0 °C (default 0).
 * @returns {@link BaselinePrediction}.
 * @throws TypeError for non-finite values or a missing covariate; RangeError for a
 *   negative margin.
 */
export function predictBaseline(
  model: BaselineModel, temperatureC: number, covariates: Readonly<Record<string, number>> = {}, envelopeMarginC = 0,
): BaselinePrediction {
  assertFiniteNumber(temperatureC, "temperatureC");
  assertFiniteNumber(envelopeMarginC, "envelopeMarginC");
  if (envelopeMarginC < 0) throw new RangeError(`envelopeMarginC must be ≥ 0 (got ${envelopeMarginC})`);
  model.covariateNames.forEach((k) => assertFiniteNumber(covariates[k], `covariates.${k}`));
  return predictOne(model, temperatureC, (j) => covariates[model.covariateNames[j]], envelopeMarginC);
}

/** Series input for {@link predictBaselineSeries}. */
export interface BaselineSeries {
  timesMs: ArrayLike<number>;
  temperatureC: ArrayLike<number>;
  covariates?: Readonly<Record<string, ArrayLike<number>>>;
}

/**
 * Predictions for a time series (computes the lagged temperature when the model has one;
 * the first hours of a series then average over a shorter window).
 *
 * @param model - from fitBaseline.
 * @param series - times (ms UTC, non-decreasing), temperatures (°C) and covariates; not mutated.
 * @param envelopeMarginC - as {@link predictBaseline}.
 * @returns { frequencyHz, outOfEnvelope (1 = out), effectiveTemperatureC }, each n long.
 * @throws TypeError / RangeError for invalid arrays, unequal lengths or a missing covariate.
 */
export function predictBaselineSeries(
  model: BaselineModel, series: BaselineSeries, envelopeMarginC = 0,
): { frequencyHz: Float64Array; outOfEnvelope: Uint8Array; effectiveTemperatureC: Float64Array } {
  assertNumberArray(series.timesMs, "timesMs", 0);
  assertNumberArray(series.temperatureC, "temperatureC", 0);
  const n = series.timesMs.length;
  if (series.temperatureC.length !== n) throw new RangeError(`temperatureC must have length ${n} (got ${series.temperatureC.length})`);
  assertFiniteNumber(envelopeMarginC, "envelopeMarginC");
  if (envelopeMarginC < 0) throw new RangeError(`envelopeMarginC must be ≥ 0 (got ${envelopeMarginC})`);
  const cols = model.covariateNames.map((k) => {
    const c = series.covariates?.[k];
    if (c === undefined) throw new TypeError(`covariates.${k} is required by the model (got undefined)`);
    assertNumberArray(c, `covariates.${k}`, 0);
    if (c.length !== n) throw new RangeError(`covariates.${k} must have length ${n} (got ${c.length})`);
    return c;
  });
  const temp = model.lagHours !== null && n > 0 ? laggedTemperature(series.timesMs, series.temperatureC, model.lagHours) : Float64Array.from(series.temperatureC);
  const frequencyHz = new Float64Array(n);
  const outOfEnvelope = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const p = predictOne(model, temp[i], (j) => cols[j][i], envelopeMarginC);
    frequencyHz[i] = p.frequencyHz;
    outOfEnvelope[i] = p.outOfEnvelope ? 1 : 0;
  }
  return { frequencyHz, outOfEnvelope, effectiveTemperatureC: temp };
}

function predictOne(model: BaselineModel, t: number, cov: (j: number) => number, margin: number): BaselinePrediction {
  let f = model.interceptHz + model.slopeHzPerC * t;
  if (model.kind === "bilinear" && model.knotC !== null && model.coldSlopeHzPerC !== null) {
    f += (model.coldSlopeHzPerC - model.slopeHzPerC) * Math.min(t - model.knotC, 0);
  }
  const [lo, hi] = model.envelope.temperatureC;
  let out = t < lo - margin || t > hi + margin;
  model.covariateNames.forEach((k, j) => {
    const v = cov(j);
    f += model.covariateCoefficients[j] * v;
    const [a, b] = model.envelope.covariates[k];
    if (v < a || v > b) out = true;
  });
  return { frequencyHz: f, outOfEnvelope: out };
}
