/**
 * The drift view of one asset (issue 5 screens; read by the Trends page, the overview and the
 * reports): the same replay as recomputeDrift (lib/stats runDriftMonitor over the history from
 * the active baseline's training start, with that baseline's model choice) but WITHOUT side
 * effects (no condition update, no alert, no e-mail), shaped for charts. Everyone in the
 * organisation reads (`portfolio:read`); an asset of another organisation is not_found.
 *
 * Final shape (times are ms UTC; frequencies and residuals Hz; damping ratios fractions):
 *   DriftView = {
 *     assetId; generatedAtMs; range: { fromMs|null; toMs|null }  — the filter applied to the
 *       series (points, daily, t2, damping); statistics always come from the whole replay;
 *     baseline: Baseline | null  — the active version;
 *     skipped: string | null     — why no statistics (no active baseline, too little data);
 *     condition: AssetCondition  — what recomputeDrift would store now: the replay's final
 *       state, `alert` shown as `watch` when every alert is closed and the replay raises no new
 *       one (lib/services/alerts/condition.ts); the stored condition when skipped;
 *     statisticsCondition: AssetCondition | null — the replay's own final state;
 *     timeline: { fromMs; state }[] — condition changes of the replay (first fromMs = null);
 *     downsampled: boolean       — true when any points/damping series was thinned;
 *     modes: {
 *       trackedModeId; label; nominalHz  — the tracked mode's nominal frequency;
 *       model: BaselineModel | null      — the model the replay fitted (draw its curve);
 *       sigmaHz: number | null           — σ of a daily mean residual used by the EWMA;
 *       points: { atMs; frequencyHz; temperatureC|null; predictedHz|null; bandLowHz|null;
 *                 bandHighHz|null; residualHz|null; outOfEnvelope; dampingRatio|null }[]
 *         — one per record/import row with an identified frequency; band = predicted ± 3 s
 *           (s = the model's residual standard deviation); outOfEnvelope = "no decision";
 *       daily: { dayMs (bucket start); residualHz|null; residualLcl; residualUcl; ewma;
 *                ewmaLcl; ewmaUcl; beyond (EWMA beyond its limits); residualBeyond;
 *                outOfEnvelope (only out-of-envelope records that day: no decision) }[];
 *       latest: { atMs; frequencyHz; predictedHz|null; residualHz|null; residualPct|null (% of the
 *                 predicted frequency); ewma|null; ewmaLimit|null (half-width of the EWMA limits, Hz);
 *                 ewmaLcl|null; ewmaUcl|null } | null — the last point of the whole history;
 *       minimalShift: { shiftHz; shiftPct } | null — smallest sustained shift the EWMA
 *         detects (lib/stats ewmaMinimalShift), % of the training mean frequency;
 *       damping: { points: { atMs; dampingRatio }[]; median|null; lowerAdvisory|null;
 *                  upperAdvisory|null } — ADVISORY limits only (see dampingAdvisory);
 *     }[];
 *     t2: { dayMs; t2; ucl; beyond }[]; t2Ucl: number | null;
 *     alerts: { id; raisedAtMs; state }[] — stored alerts of the asset, newest first;
 *     raisedAtMs: number[] — alert_raised times of the replay (to mark on charts).
 *   }
 * Large series are thinned on the server (min and max of equal-count chunks, out-of-envelope
 * points kept) to at most `maxPointsPerMode` per mode (default 2000).
 */
import { db } from "@/lib/db/knex";
import { listAlertsOfOrganisation } from "@/lib/db/repos/alert.repo";
import { findActiveBaseline } from "@/lib/db/repos/baseline.repo";
import { listTrackedModesOfAsset } from "@/lib/db/repos/tracked-mode.repo";
import type { AlertState, Baseline, DriftViewDaily } from "@/lib/domain/drift";
import type { Actor, AssetCondition } from "@/lib/domain/types";
import { loadOwnAsset } from "@/lib/services/assets/asset.service";
import { conditionWithAlerts } from "@/lib/services/alerts/condition";
import { assertCan } from "@/lib/services/authz";
import type { BaselineModel } from "@/lib/stats/baseline-fit";
import { predictBaselineSeries } from "@/lib/stats/baseline-predict";
import { runDriftMonitor, type AssetHistory, type DriftMonitorResult } from "@/lib/stats/drift-monitor";
import { loadAssetHistory } from "./history";

export interface DriftViewPoint {
  atMs: number;
  frequencyHz: number;
  temperatureC: number | null;
  predictedHz: number | null;
  bandLowHz: number | null;
  bandHighHz: number | null;
  residualHz: number | null;
  outOfEnvelope: boolean;
  dampingRatio: number | null;
}

export type { DriftViewDaily } from "@/lib/domain/drift";

export interface DriftViewLatest {
  atMs: number;
  frequencyHz: number;
  predictedHz: number | null;
  residualHz: number | null;
  residualPct: number | null;
  ewma: number | null;
  ewmaLimit: number | null;
  ewmaLcl: number | null;
  ewmaUcl: number | null;
}

export interface DampingView {
  points: { atMs: number; dampingRatio: number }[];
  median: number | null;
  lowerAdvisory: number | null;
  upperAdvisory: number | null;
}

export interface DriftViewMode {
  trackedModeId: string;
  label: string;
  nominalHz: number;
  model: BaselineModel | null;
  sigmaHz: number | null;
  points: DriftViewPoint[];
  daily: DriftViewDaily[];
  latest: DriftViewLatest | null;
  minimalShift: { shiftHz: number; shiftPct: number } | null;
  damping: DampingView;
}

export interface DriftView {
  assetId: string;
  generatedAtMs: number;
  range: { fromMs: number | null; toMs: number | null };
  baseline: Baseline | null;
  skipped: string | null;
  condition: AssetCondition;
  statisticsCondition: AssetCondition | null;
  timeline: { fromMs: number | null; state: AssetCondition }[];
  downsampled: boolean;
  modes: DriftViewMode[];
  t2: { dayMs: number; t2: number; ucl: number; beyond: boolean }[];
  t2Ucl: number | null;
  alerts: { id: string; raisedAtMs: number; state: AlertState }[];
  raisedAtMs: number[];
}

export interface DriftViewOptions {
  /** Most points (and damping points) per mode returned, ≥ 10 (default 2000). */
  maxPointsPerMode?: number;
  /** "Now" of the replay (silence after the last record), ms UTC (default Date.now()). */
  nowMs?: number;
}

/** Width of the prediction band in residual standard deviations (Shewhart 3σ, Montgomery ch. 5). */
export const BAND_SIGMAS = 3;

const finiteOrNull = (v: number): number | null => (Number.isFinite(v) ? v : null);

/**
 * The drift view of an asset (see header). Pure read: nothing is written.
 * @throws AppError forbidden (no portfolio:read), not_found (missing or foreign asset).
 */
export async function getDriftView(
  actor: Actor, assetId: string, range: { from?: Date; to?: Date } = {}, opts: DriftViewOptions = {},
): Promise<DriftView> {
  assertCan(actor, "portfolio:read");
  const asset = await loadOwnAsset(actor, assetId);
  const nowMs = opts.nowMs ?? Date.now();
  const maxPoints = Math.max(10, Math.floor(opts.maxPointsPerMode ?? 2000));
  const fromMs = range.from ? range.from.getTime() : null;
  const toMs = range.to ? range.to.getTime() : null;
  const inRange = (t: number) => (fromMs === null || t >= fromMs) && (toMs === null || t < toMs);

  const [baseline, tracked, alerts] = await Promise.all([
    findActiveBaseline(db(), asset.id),
    listTrackedModesOfAsset(db(), asset.id, { includeInactive: true }),
    listAlertsOfOrganisation(db(), asset.organisationId, { assetId: asset.id, limit: 200 }),
  ]);
  const trackedById = new Map(tracked.map((m) => [m.id, m]));
  // Modes shown: the baseline's (in its order), else the active tracked modes.
  const modeRefs = baseline
    ? baseline.models.map((m) => ({ id: m.trackedModeId, label: trackedById.get(m.trackedModeId)?.label ?? m.label }))
    : tracked.filter((m) => m.active).map((m) => ({ id: m.id, label: m.label }));
  const modeIds = modeRefs.map((m) => m.id);
  const loaded = await loadAssetHistory(db(), asset.id, modeIds);
  const h = loaded.history;
  const n = h.timesMs.length;

  // The replay, exactly as recomputeDrift runs it (history from the training start).
  let result: DriftMonitorResult | null = null;
  let skipped: string | null = null;
  let start = 0;
  if (!baseline) {
    skipped = "no active baseline";
  } else if (modeIds.length > 0) {
    const t0 = baseline.trainingFrom.getTime();
    while (start < n && h.timesMs[start] < t0) start++;
    const slice: AssetHistory = {
      timesMs: h.timesMs.subarray(start),
      temperatureC: h.temperatureC.subarray(start),
      qualityPassed: h.qualityPassed.subarray(start),
      modes: h.modes.map((m) => ({ modeId: m.modeId, frequencyHz: m.frequencyHz.subarray(start) })),
    };
    const recordTimesMs = loaded.recordTimesMs.filter((t) => t >= t0);
    try {
      result = runDriftMonitor(slice, {
        trainingEndMs: baseline.trainingTo.getTime(),
        baseline: { model: baseline.requestedModel },
        condition: {
          recordTimesMs, endMs: nowMs,
          ...(recordTimesMs.length > 0 ? { expectedIntervalMs: asset.expectedIntervalMin * 60_000 } : {}),
        },
      });
    } catch (e) {
      if (!(e instanceof RangeError || e instanceof TypeError)) throw e;
      skipped = e.message;
    }
  } else {
    skipped = "the active baseline has no mode";
  }

  let downsampled = false;
  const modes: DriftViewMode[] = modeRefs.map((ref, j) => {
    const f = h.modes[j].frequencyHz;
    const q = h.qualityPassed;
    const model = result?.baselines[j] ?? null;
    // Predictions over the replayed slice (as the replay made them) and, for rows before the
    // training start, over the full series.
    const pred = new Float64Array(n).fill(Number.NaN);
    const outside = new Uint8Array(n);
    if (model) {
      const full = predictBaselineSeries(model, { timesMs: h.timesMs, temperatureC: h.temperatureC });
      const sub = predictBaselineSeries(model, { timesMs: h.timesMs.subarray(start), temperatureC: h.temperatureC.subarray(start) });
      pred.set(full.frequencyHz.subarray(0, start), 0);
      outside.set(full.outOfEnvelope.subarray(0, start), 0);
      pred.set(sub.frequencyHz, start);
      outside.set(sub.outOfEnvelope, start);
    }
    const half = model ? BAND_SIGMAS * model.residualStdHz : Number.NaN;
    const all: DriftViewPoint[] = [];
    for (let i = 0; i < n; i++) {
      if (Number.isNaN(f[i]) || !q[i]) continue;
      const p = finiteOrNull(pred[i]);
      all.push({
        atMs: h.timesMs[i], frequencyHz: f[i], temperatureC: finiteOrNull(h.temperatureC[i]),
        predictedHz: p, bandLowHz: p === null ? null : p - half, bandHighHz: p === null ? null : p + half,
        residualHz: p === null ? null : f[i] - p, outOfEnvelope: model ? outside[i] === 1 : false,
        dampingRatio: finiteOrNull(loaded.dampingRatio[j][i]),
      });
    }
    const last = all.length > 0 ? all[all.length - 1] : null;
    const daily: DriftViewDaily[] = [];
    if (result) {
      const r = result;
      const ew = r.ewma[j];
      r.bucketStartMs.forEach((t, b) => {
        const res = r.residualHz[j][b];
        const oe = r.points[b].outOfEnvelope;
        if (Number.isNaN(res) && !oe) return;
        if (!inRange(t)) return;
        const lcl = r.points[b].modes[j].residualLcl;
        const ucl = r.points[b].modes[j].residualUcl;
        daily.push({
          dayMs: t, residualHz: finiteOrNull(res), residualLcl: lcl, residualUcl: ucl,
          ewma: ew.z[b], ewmaLcl: ew.lcl[b], ewmaUcl: ew.ucl[b], beyond: ew.beyond[b] === 1,
          residualBeyond: !Number.isNaN(res) && (res < lcl || res > ucl), outOfEnvelope: oe,
        });
      });
    }
    let latest: DriftViewLatest | null = null;
    if (last) {
      let ewma: number | null = null, lcl: number | null = null, ucl: number | null = null, mu0: number | null = null;
      if (result && result.bucketStartMs.length > 0) {
        const b = result.bucketStartMs.length - 1;
        ewma = result.ewma[j].z[b];
        lcl = result.ewma[j].lcl[b];
        ucl = result.ewma[j].ucl[b];
        mu0 = result.chartSigma[j].mu0;
      }
      latest = {
        atMs: last.atMs, frequencyHz: last.frequencyHz, predictedHz: last.predictedHz, residualHz: last.residualHz,
        residualPct: last.residualHz !== null && last.predictedHz ? (100 * last.residualHz) / last.predictedHz : null,
        ewma, ewmaLimit: ucl !== null && mu0 !== null ? ucl - mu0 : null, ewmaLcl: lcl, ewmaUcl: ucl,
      };
    }
    const shown = all.filter((p) => inRange(p.atMs));
    const thinned = downsamplePoints(shown, maxPoints, (p) => p.frequencyHz, (p) => p.outOfEnvelope);
    // Damping: advisory limits from the training window (all data without a baseline).
    const dAll = all.filter((p) => p.dampingRatio !== null) as (DriftViewPoint & { dampingRatio: number })[];
    const training = baseline
      ? dAll.filter((p) => p.atMs >= baseline.trainingFrom.getTime() && p.atMs < baseline.trainingTo.getTime())
      : dAll;
    const adv = dampingAdvisory(training.map((p) => p.dampingRatio));
    const dShown = dAll.filter((p) => inRange(p.atMs)).map((p) => ({ atMs: p.atMs, dampingRatio: p.dampingRatio }));
    const dThin = downsamplePoints(dShown, maxPoints, (p) => p.dampingRatio, () => false);
    if (thinned.length < shown.length || dThin.length < dShown.length) downsampled = true;
    const nominalHz = trackedById.get(ref.id)?.nominalFrequencyHz
      ?? (model ? model.interceptHz + model.slopeHzPerC * 20 : Number.NaN);
    return {
      trackedModeId: ref.id, label: ref.label, nominalHz,
      model, sigmaHz: result ? result.sigmaHz[j] : null,
      points: thinned, daily, latest,
      minimalShift: result ? result.minimalShift[j] : null,
      damping: { points: dThin, ...adv },
    };
  });

  const t2: DriftView["t2"] = [];
  if (result && result.t2 && result.t2Ucl !== null) {
    const ucl = result.t2Ucl;
    result.bucketStartMs.forEach((t, b) => {
      const v = result.t2?.[b] ?? Number.NaN;
      if (Number.isNaN(v) || !inRange(t)) return;
      t2.push({ dayMs: t, t2: v, ucl, beyond: v > ucl });
    });
  }
  const timeline = result
    ? result.condition.timeline.map((c) => ({ fromMs: Number.isFinite(c.fromMs) ? c.fromMs : null, state: c.state }))
    : [{ fromMs: null, state: asset.condition }];
  const raisedAtMs = result ? result.condition.events.flatMap((e) => (e.type === "alert_raised" ? [e.timeMs] : [])) : [];
  const stored = new Set(alerts.map((a) => a.raisedAt.getTime()));
  const live = alerts.some((a) => a.state !== "closed") || raisedAtMs.some((t) => !stored.has(t));
  return {
    assetId: asset.id,
    generatedAtMs: nowMs,
    range: { fromMs, toMs },
    baseline,
    skipped,
    condition: result ? conditionWithAlerts(result.condition.finalState, live) : asset.condition,
    statisticsCondition: result ? result.condition.finalState : null,
    timeline,
    downsampled,
    modes,
    t2,
    t2Ucl: result?.t2Ucl ?? null,
    alerts: alerts.map((a) => ({ id: a.id, raisedAtMs: a.raisedAt.getTime(), state: a.state })),
    raisedAtMs,
  };
}

/**
 * Advisory damping limits: median ± max(4 · 1.4826 · MAD, 0.4 · median), the lower one ≥ 0.
 * Wide on purpose: damping from 10-minute records scatters ±15–40 % (REFERENCES.md
 * [practice]), so these limits flag gross changes only and never drive the condition.
 * 1.4826 · MAD is the normal-consistent robust σ (Rousseeuw & Croux, JASA 88(424), 1993).
 * @returns nulls with fewer than 8 values.
 */
export function dampingAdvisory(values: number[]): { median: number | null; lowerAdvisory: number | null; upperAdvisory: number | null } {
  const xs = values.filter((v) => Number.isFinite(v));
  if (xs.length < 8) return { median: null, lowerAdvisory: null, upperAdvisory: null };
  const med = medianOf(xs);
  const mad = medianOf(xs.map((v) => Math.abs(v - med)));
  const half = Math.max(4 * 1.4826 * mad, 0.4 * med);
  return { median: med, lowerAdvisory: Math.max(0, med - half), upperAdvisory: med + half };
}

function medianOf(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/**
 * Thins a time-ordered series to about `max` points: equal-count chunks keep their lowest and
 * highest value (so spikes and steps stay visible) and every flagged point (`keep`), in time
 * order. Returns the input unchanged when it is short enough.
 */
export function downsamplePoints<T extends { atMs: number }>(pts: T[], max: number, value: (p: T) => number, keep: (p: T) => boolean): T[] {
  if (pts.length <= max) return pts;
  const chunks = Math.max(1, Math.floor(max / 2));
  const size = Math.ceil(pts.length / chunks);
  const out: T[] = [];
  for (let c = 0; c < pts.length; c += size) {
    const end = Math.min(pts.length, c + size);
    let lo = c;
    let hi = c;
    for (let i = c; i < end; i++) {
      if (value(pts[i]) < value(pts[lo])) lo = i;
      if (value(pts[i]) > value(pts[hi])) hi = i;
    }
    for (let i = c; i < end; i++) if (i === lo || i === hi || keep(pts[i])) out.push(pts[i]);
  }
  return out;
}
