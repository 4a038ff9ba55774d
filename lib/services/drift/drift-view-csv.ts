/**
 * CSV of one Trends chart (issue 5 screens: "a CSV export per chart"): a header row, then one
 * row per plotted value, times as ISO 8601 UTC, numbers in SI units as stored (Hz, °C,
 * damping ratio as a fraction), empty cells for missing values. Pure.
 */
import type { DriftView } from "./drift-view.service";
import type { TrendChart } from "./schemas";

const iso = (ms: number) => new Date(ms).toISOString();
const num = (v: number | null | undefined) => (v === null || v === undefined || !Number.isFinite(v) ? "" : String(v));

/** RFC 4180 quoting for text cells (mode labels are user input). */
export function csvCell(s: string): string {
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function driftViewCsv(view: DriftView, chart: TrendChart): string {
  const rows: string[][] = [];
  switch (chart) {
    case "frequency":
      rows.push(["time", "mode", "frequencyHz", "temperatureC", "predictedHz", "bandLowHz", "bandHighHz", "residualHz", "outOfEnvelope"]);
      for (const m of view.modes) {
        for (const p of m.points) {
          rows.push([iso(p.atMs), csvCell(m.label), num(p.frequencyHz), num(p.temperatureC), num(p.predictedHz), num(p.bandLowHz), num(p.bandHighHz), num(p.residualHz), String(p.outOfEnvelope)]);
        }
      }
      break;
    case "temperature":
      rows.push(["time", "mode", "temperatureC", "frequencyHz", "predictedHz", "outOfEnvelope"]);
      for (const m of view.modes) {
        for (const p of m.points) {
          if (p.temperatureC === null) continue;
          rows.push([iso(p.atMs), csvCell(m.label), num(p.temperatureC), num(p.frequencyHz), num(p.predictedHz), String(p.outOfEnvelope)]);
        }
      }
      break;
    case "ewma":
      rows.push(["day", "mode", "residualHz", "residualLclHz", "residualUclHz", "ewmaHz", "ewmaLclHz", "ewmaUclHz", "beyond", "outOfEnvelope"]);
      for (const m of view.modes) {
        for (const d of m.daily) {
          rows.push([iso(d.dayMs), csvCell(m.label), num(d.residualHz), num(d.residualLcl), num(d.residualUcl), num(d.ewma), num(d.ewmaLcl), num(d.ewmaUcl), String(d.beyond), String(d.outOfEnvelope)]);
        }
      }
      break;
    case "t2":
      rows.push(["day", "t2", "ucl", "beyond"]);
      for (const d of view.t2) rows.push([iso(d.dayMs), num(d.t2), num(d.ucl), String(d.beyond)]);
      break;
    case "damping":
      rows.push(["time", "mode", "dampingRatio", "medianRatio", "lowerAdvisoryRatio", "upperAdvisoryRatio"]);
      for (const m of view.modes) {
        for (const p of m.damping.points) {
          rows.push([iso(p.atMs), csvCell(m.label), num(p.dampingRatio), num(m.damping.median), num(m.damping.lowerAdvisory), num(m.damping.upperAdvisory)]);
        }
      }
      break;
  }
  return rows.map((r) => r.join(",")).join("\r\n") + "\r\n";
}
