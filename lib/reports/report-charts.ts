/**
 * The trend images of a report, one pair per tracked mode: identified frequency with the
 * baseline's temperature-compensated prediction, and the daily residual with its EWMA and
 * control limits. PNG bytes, shared by the PDF and the print page.
 */
import { renderLineChart } from "./line-chart";
import { encodePng } from "./png";
import type { AssetReport } from "./report-data";

export interface ReportChart {
  trackedModeId: string;
  kind: "frequency" | "residual";
  title: string;
  /** Legend and unit, set as text below the image. */
  caption: string;
  png: Buffer;
  width: number;
  height: number;
}

export const CHART_COLOURS = {
  measured: "#0f766e",
  predicted: "#9aa5b1",
  residual: "#7b8794",
  ewma: "#1d4ed8",
  limit: "#b91c1c",
} as const;

const W = 1000;
const H = 330;

/** Both charts of every mode that has data in the period (see the file header). */
export function renderReportCharts(r: AssetReport): ReportChart[] {
  const xRange: [number, number] = [r.period.fromMs, r.period.toMs];
  const out: ReportChart[] = [];
  for (const m of r.modes) {
    const pts = m.series.points;
    if (pts.length > 0) {
      const chart = renderLineChart({
        width: W, height: H, xRange,
        series: [
          { kind: "dots", x: pts.map((p) => p.atMs), y: pts.map((p) => p.frequencyHz), colour: CHART_COLOURS.measured, size: 2.5 },
          { kind: "line", x: pts.map((p) => p.atMs), y: pts.map((p) => p.predictedHz ?? Number.NaN), colour: CHART_COLOURS.predicted, size: 1 },
        ],
      });
      out.push({
        trackedModeId: m.trackedModeId, kind: "frequency", title: `${m.label}: identified frequency (Hz)`,
        caption: "Dots: frequency identified in each accepted record (Hz). Grey line: value expected by the baseline for the measured temperature.",
        png: encodePng(chart.raster), width: W, height: H,
      });
    }
    const d = m.series.daily;
    if (d.length > 0) {
      const x = d.map((p) => p.dayMs);
      const chart = renderLineChart({
        width: W, height: H, xRange,
        series: [
          { kind: "dots", x, y: d.map((p) => p.residualHz), colour: CHART_COLOURS.residual, size: 2 },
          { kind: "line", x, y: d.map((p) => p.ewmaLcl), colour: CHART_COLOURS.limit, size: 2, dashed: true },
          { kind: "line", x, y: d.map((p) => p.ewmaUcl), colour: CHART_COLOURS.limit, size: 2, dashed: true },
          { kind: "line", x, y: d.map((p) => p.ewma), colour: CHART_COLOURS.ewma, size: 3 },
        ],
      });
      out.push({
        trackedModeId: m.trackedModeId, kind: "residual", title: `${m.label}: daily residual after temperature compensation (Hz)`,
        caption: "Grey dots: daily mean residual (Hz). Blue: EWMA of the residuals. Dashed red: EWMA control limits.",
        png: encodePng(chart.raster), width: W, height: H,
      });
    }
  }
  return out;
}
