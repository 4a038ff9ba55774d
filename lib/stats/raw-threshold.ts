/**
 * The naive alternative to compensation, kept for comparison: a fixed band on the raw
 * daily mean frequency around its training mean, with the same run rule as the product
 * (m of the last n days outside the band). Natural frequencies move by several % over a
 * year with temperature [1], so such a band either raises seasonal false alarms (band
 * narrower than the seasonal swing) or hides a real change (band wider than it).
 *
 * [1] Peeters & De Roeck, Earthquake Eng. Struct. Dyn. 30(2):149–171, 2001.
 */
import { assertFiniteNumber, assertInteger, assertInRange } from "@/lib/numeric/validate";
import { aggregateResiduals } from "./aggregate";
import type { AssetHistory } from "./drift-monitor";

/**
 * Alert times of the raw fixed-band rule (see header).
 *
 * @param history - asset history (records in time order); not mutated.
 * @param options - trainingEndMs (ms UTC, exclusive end of the reference window);
 *   bandRel: half-width of the band as a fraction of the training mean (default 0.01, the
 *   frequency change of a 2 % stiffness loss); m of n days (default 3 of 5); a new alert
 *   needs the rule to clear first.
 * @returns alert times (end of the triggering day), ms UTC, increasing.
 * @throws TypeError / RangeError for invalid options.
 */
export function rawThresholdAlerts(
  history: AssetHistory, options: { trainingEndMs: number; bandRel?: number; m?: number; n?: number },
): number[] {
  assertFiniteNumber(options.trainingEndMs, "trainingEndMs");
  const band = options.bandRel ?? 0.01;
  assertInRange(band, "bandRel", 1e-6, 1);
  const n = options.n ?? 5;
  assertInteger(n, "n", 1);
  const m = options.m ?? 3;
  assertInteger(m, "m", 1, n);
  const q = history.qualityPassed;
  const cols = history.modes.map((md) => Float64Array.from(md.frequencyHz, (f, i) => (q && !q[i] ? Number.NaN : f)));
  const agg = aggregateResiduals(history.timesMs, cols);
  const day = 86_400_000;
  const refs = agg.mean.map((col) => {
    const tr = Array.from(col).filter((v, r) => agg.bucketStartMs[r] + day <= options.trainingEndMs && !Number.isNaN(v));
    return tr.reduce((a, v) => a + v, 0) / Math.max(1, tr.length);
  });
  const alerts: number[] = [];
  const recent: boolean[] = [];
  let active = false;
  agg.bucketStartMs.forEach((t, r) => {
    const out = agg.mean.some((col, j) => !Number.isNaN(col[r]) && Math.abs(col[r] / refs[j] - 1) > band);
    recent.push(out);
    if (recent.length > n) recent.shift();
    const hits = recent.filter(Boolean).length;
    if (!active && hits >= m) {
      active = true;
      alerts.push(t + day);
    } else if (active && hits === 0) active = false;
  });
  return alerts;
}
