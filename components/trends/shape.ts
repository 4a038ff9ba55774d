/**
 * Shapes the drift view of an asset for the Trends charts (runs on the server, in the page):
 * the per-record prediction band is reduced to one band per UTC day (the prediction follows
 * the daily temperature cycle, so a per-record band draws a comb) and numbers are rounded to
 * what a chart can show (frequencies to 1 µHz, temperatures to 0.01 °C, damping to 6),
 * which keeps a year of 4 records a day × 4 modes small enough to hand to the browser.
 */
import type { TrendBandDay, TrendDaily, TrendMode, TrendModel } from "./types";

const DAY = 86_400_000;
/** v rounded to `decimals` places, as the shortest number (so JSON carries no float noise). */
const r = (v: number, decimals: number) => Number(v.toFixed(decimals));
const rn = (v: number | null, decimals: number) => (v === null ? null : r(v, decimals));

/** What the page gets per mode from the drift view (structural: the service's DriftViewMode fits). */
export interface DriftModeInput {
  trackedModeId: string;
  label: string;
  nominalHz: number;
  model: TrendModel | null;
  points: { atMs: number; frequencyHz: number; temperatureC: number | null; predictedHz: number | null; bandLowHz: number | null; bandHighHz: number | null; outOfEnvelope: boolean }[];
  daily: TrendDaily[];
  minimalShift: { shiftHz: number; shiftPct: number } | null;
  damping: { points: { atMs: number; dampingRatio: number }[]; median: number | null; lowerAdvisory: number | null; upperAdvisory: number | null };
}

/** The prediction band per UTC day of a mode's points (see header). */
export function dailyBand(points: DriftModeInput["points"]): TrendBandDay[] {
  const out: TrendBandDay[] = [];
  let day = Number.NaN;
  let n = 0;
  for (const p of points) {
    if (p.predictedHz === null || p.bandLowHz === null || p.bandHighHz === null) continue;
    const d = Math.floor(p.atMs / DAY);
    if (d !== day) {
      if (n > 0) out[out.length - 1].mean /= n;
      out.push({ x: d * DAY + DAY / 2, lo: p.bandLowHz, hi: p.bandHighHz, mean: 0 });
      day = d;
      n = 0;
    }
    const cur = out[out.length - 1];
    cur.lo = Math.min(cur.lo, p.bandLowHz);
    cur.hi = Math.max(cur.hi, p.bandHighHz);
    cur.mean += p.predictedHz;
    n++;
  }
  if (n > 0) out[out.length - 1].mean /= n;
  return out.map((b) => ({ x: b.x, lo: r(b.lo, 6), hi: r(b.hi, 6), mean: r(b.mean, 6) }));
}

export function toTrendMode(m: DriftModeInput): TrendMode {
  return {
    trackedModeId: m.trackedModeId,
    label: m.label,
    nominalHz: m.nominalHz,
    model: m.model ? {
      kind: m.model.kind, knotC: m.model.knotC, interceptHz: m.model.interceptHz, slopeHzPerC: m.model.slopeHzPerC,
      coldSlopeHzPerC: m.model.coldSlopeHzPerC, residualStdHz: m.model.residualStdHz, lagHours: m.model.lagHours,
      envelope: { temperatureC: m.model.envelope.temperatureC },
    } : null,
    points: m.points.map((p) => ({ atMs: p.atMs, frequencyHz: r(p.frequencyHz, 6), temperatureC: rn(p.temperatureC, 2), outOfEnvelope: p.outOfEnvelope })),
    band: dailyBand(m.points),
    daily: m.daily.map((d) => ({
      ...d, residualHz: rn(d.residualHz, 7), residualLcl: r(d.residualLcl, 7), residualUcl: r(d.residualUcl, 7),
      ewma: r(d.ewma, 7), ewmaLcl: r(d.ewmaLcl, 7), ewmaUcl: r(d.ewmaUcl, 7),
    })),
    minimalShift: m.minimalShift,
    damping: { ...m.damping, points: m.damping.points.map((p) => ({ atMs: p.atMs, dampingRatio: r(p.dampingRatio, 6) })) },
  };
}
