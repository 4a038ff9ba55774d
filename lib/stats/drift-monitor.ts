/**
 * The drift pipeline of one asset, end to end and pure: baseline per mode on a training
 * window → residuals → daily means → per-mode EWMA and Hotelling T² → condition replay.
 *
 * Method: baselines as fitBaseline [1]; chart σ and μ₀ from the daily means of the
 * training residuals (so the within-day correlation is inside σ, REFERENCES.md
 * [practice]), inflated for day-to-day correlation as estimateChartSigma; EWMA (λ, L) from the ARL ≈ 500 table [2]; T² Phase I on the training daily
 * residual vectors, Phase II UCL from the F distribution [3]; condition rules as
 * replayCondition. Without compensation (`compensate: false`) the "baseline" is the
 * training mean frequency, which shows why compensation is needed.
 *
 * [1] Peeters & De Roeck, Earthquake Eng. Struct. Dyn. 30(2):149–171, 2001.
 * [2] Lucas & Saccucci, Technometrics 32(1), 1990; Montgomery, SQC 7th ed., ch. 9.
 * [3] Montgomery, SQC 7th ed., ch. 11.
 */
import { assertFiniteNumber, assertNumberArray } from "@/lib/numeric/validate";
import { aggregateResiduals, type AggregateOptions } from "./aggregate";
import { fitBaseline, type BaselineFitOptions, type BaselineModel } from "./baseline-fit";
import { predictBaselineSeries } from "./baseline-predict";
import { replayCondition, type ConditionOptions, type ConditionPoint, type ConditionReplay } from "./condition-machine";
import { estimateChartSigma, type ChartSigma } from "./chart-sigma";
import { ewmaLimitWidthForArl500, ewmaMinimalShift, runEwmaChart, type EwmaChart } from "./ewma";
import { fitHotellingPhaseI, hotellingT2, hotellingUcl } from "./hotelling";

/** History of one asset: one row per record, in time order. */
export interface AssetHistory {
  timesMs: ArrayLike<number>;
  temperatureC: ArrayLike<number>;
  /** 1 = data quality passed (default all passed). */
  qualityPassed?: ArrayLike<number>;
  /** Per tracked mode its frequency estimate per record, Hz (NaN = not identified). */
  modes: { modeId: string; frequencyHz: ArrayLike<number> }[];
}

/** Options of {@link runDriftMonitor}. */
export interface DriftMonitorOptions {
  /** Training window end (exclusive), ms UTC; training starts at the first record. */
  trainingEndMs: number;
  /** Temperature compensation (default true). */
  compensate?: boolean;
  baseline?: BaselineFitOptions;
  /** EWMA λ from the ARL ≈ 500 table: 0.05, 0.1 or 0.2 (default 0.1). */
  lambda?: number;
  /** T² false-alarm probability per point (default 0.0027); T² needs ≥ 2 modes. */
  alpha?: number;
  aggregate?: AggregateOptions;
  /** Individual limits of an aggregated residual, μ₀ ± k·σ (default k = 3, Shewhart). */
  residualLimitSigmas?: number;
  condition?: ConditionOptions;
}

/** Everything a caller stores or draws. */
export interface DriftMonitorResult {
  baselines: (BaselineModel | null)[];
  bucketStartMs: number[];
  residualHz: Float64Array[];
  ewma: EwmaChart[];
  /** σ_eff per mode used by the EWMA (autocorrelation-corrected), Hz. */
  sigmaHz: number[];
  chartSigma: ChartSigma[];
  t2: Float64Array | null;
  t2Ucl: number | null;
  minimalShift: { shiftHz: number; shiftPct: number }[];
  points: ConditionPoint[];
  condition: ConditionReplay;
}

/**
 * Runs the drift pipeline over an asset's whole history (replay from scratch).
 *
 * @param history - see {@link AssetHistory}; not mutated.
 * @param options - see {@link DriftMonitorOptions}.
 * @returns {@link DriftMonitorResult}; points are stamped at the end of their bucket.
 * @throws TypeError / RangeError for invalid arrays, fewer than 8 training records or
 *   2 training days, or options outside their ranges (see the called functions).
 */
export function runDriftMonitor(history: AssetHistory, options: DriftMonitorOptions): DriftMonitorResult {
  const { timesMs, temperatureC } = history;
  assertNumberArray(timesMs, "timesMs", 8);
  assertNumberArray(temperatureC, "temperatureC", 8);
  assertFiniteNumber(options.trainingEndMs, "trainingEndMs");
  const n = timesMs.length;
  const q = history.qualityPassed ?? new Uint8Array(n).fill(1);
  if (q.length !== n || temperatureC.length !== n) throw new RangeError(`temperatureC and qualityPassed must have length ${n}`);
  if (!Array.isArray(history.modes) || history.modes.length < 1) throw new RangeError("history.modes must hold at least 1 mode (got 0)");
  const compensate = options.compensate ?? true;
  const lambda = options.lambda ?? 0.1;
  const L = ewmaLimitWidthForArl500(lambda);
  const bucketMs = (options.aggregate?.bucket ?? "day") === "day" ? 86_400_000 : 3_600_000;

  const baselines: (BaselineModel | null)[] = [];
  const nominalHz: number[] = [];
  const residualCols = history.modes.map(({ modeId, frequencyHz }) => {
    assertNumberArray(frequencyHz, `modes.${modeId}.frequencyHz`, n, false);
    const tr: number[] = [];
    for (let i = 0; i < n; i++) if (timesMs[i] < options.trainingEndMs && q[i] && !Number.isNaN(frequencyHz[i])) tr.push(i);
    const pick = (a: ArrayLike<number>) => Float64Array.from(tr, (i) => a[i]);
    nominalHz.push(tr.reduce((a, i) => a + frequencyHz[i], 0) / Math.max(1, tr.length));
    const res = new Float64Array(n);
    const outside = new Uint8Array(n);
    if (compensate) {
      const model = fitBaseline({ timesMs: pick(timesMs), frequencyHz: pick(frequencyHz), temperatureC: pick(temperatureC) }, options.baseline);
      baselines.push(model);
      const pred = predictBaselineSeries(model, { timesMs, temperatureC });
      for (let i = 0; i < n; i++) res[i] = frequencyHz[i] - pred.frequencyHz[i];
      outside.set(pred.outOfEnvelope);
    } else {
      const f = pick(frequencyHz);
      const mean = f.reduce((a, v) => a + v, 0) / Math.max(1, f.length);
      baselines.push(null);
      for (let i = 0; i < n; i++) res[i] = frequencyHz[i] - mean;
    }
    for (let i = 0; i < n; i++) if (!q[i] || outside[i]) res[i] = Number.NaN;
    return { res, outside };
  });
  // Out-of-envelope records are dropped from the means; a bucket holding only such records
  // is flagged "out of envelope, no decision".
  const envCol = Float64Array.from({ length: n }, (_, i) => (q[i] ? (residualCols.some((c) => c.outside[i]) ? 1 : 0) : Number.NaN));
  const agg = aggregateResiduals(timesMs, [...residualCols.map((c) => c.res), envCol], options.aggregate);
  const nb = agg.bucketStartMs.length;
  const residualHz = agg.mean.slice(0, -1);
  const envFrac = agg.mean[agg.mean.length - 1];
  const isTrain = agg.bucketStartMs.map((t) => t + bucketMs <= options.trainingEndMs);

  const sigmaHz: number[] = [];
  const chartSigma: ChartSigma[] = [];
  const ewma = residualHz.map((col) => {
    const cs = estimateChartSigma(col.filter((_, r) => isTrain[r]), lambda);
    chartSigma.push(cs);
    sigmaHz.push(cs.sigmaEffective);
    return runEwmaChart(col, { lambda, L, mu0: cs.mu0, sigma: cs.sigmaEffective });
  });
  const p = residualHz.length;
  let t2: Float64Array | null = null;
  let t2Ucl: number | null = null;
  if (p >= 2) {
    const rows: number[][] = [];
    for (let r = 0; r < nb; r++) if (isTrain[r] && residualHz.every((c) => !Number.isNaN(c[r]))) rows.push(residualHz.map((c) => c[r]));
    if (rows.length > p + 1) {
      const model = fitHotellingPhaseI(rows);
      t2Ucl = hotellingUcl(p, rows.length, options.alpha ?? 0.0027);
      t2 = Float64Array.from({ length: nb }, (_, r) => (residualHz.every((c) => !Number.isNaN(c[r])) ? hotellingT2(model, residualHz.map((c) => c[r])) : Number.NaN));
    }
  }
  const k = options.residualLimitSigmas ?? 3;
  const points: ConditionPoint[] = agg.bucketStartMs.map((t, r) => {
    const present = residualHz.some((c) => !Number.isNaN(c[r]));
    return {
      timeMs: t + bucketMs,
      qualityPassed: present || !Number.isNaN(envFrac[r]),
      outOfEnvelope: !present && !Number.isNaN(envFrac[r]),
      modes: history.modes.map((md, j) => ({
        modeId: md.modeId,
        residualHz: residualHz[j][r],
        residualLcl: chartSigma[j].mu0 - k * chartSigma[j].sigma,
        residualUcl: chartSigma[j].mu0 + k * chartSigma[j].sigma,
        ewma: ewma[j].z[r],
        lcl: ewma[j].lcl[r],
        ucl: ewma[j].ucl[r],
      })),
      t2: t2 && t2Ucl !== null && !Number.isNaN(t2[r]) ? { value: t2[r], ucl: t2Ucl } : null,
    };
  });
  // Relative figures use the mean training frequency as the nominal one.
  const minimalShift = sigmaHz.map((sigma, j) => ewmaMinimalShift({ lambda, L, sigma }, nominalHz[j] > 0 ? nominalHz[j] : 1));
  const condition = replayCondition(points, options.condition);
  return { baselines, bucketStartMs: agg.bucketStartMs, residualHz, ewma, sigmaHz, chartSigma, t2, t2Ucl, minimalShift, points, condition };
}
