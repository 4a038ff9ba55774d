"use client";

/**
 * Chart.js registration for the Records screens: only the pieces the scatter-with-lines
 * charts use (tree-shaken build; nothing auto-registered).
 */
import { Chart, Legend, LinearScale, LineElement, LogarithmicScale, PointElement, ScatterController, Tooltip, type Plugin } from "chart.js";

Chart.register(ScatterController, LineElement, PointElement, LinearScale, LogarithmicScale, Tooltip, Legend);

/** Series colours (our own palette, distinct from the condition colours). */
export const SERIES = {
  s1: "#24466e",
  s2: "#6f8fb3",
  s3: "#b3c3d6",
  peak: "#be1e3c",
  band: "rgba(19, 138, 126, 0.12)",
  bandEdge: "rgba(19, 138, 126, 0.55)",
  grid: "#e4e7e2",
  text: "#5a6470",
};

/**
 * Vertical shaded bands (x in data units) drawn under the datasets, each with a small label;
 * labels that would overlap a neighbour's drop to the next line.
 */
export function bandsPlugin(id: string, bands: { lo: number; hi: number; label: string }[]): Plugin<"scatter"> {
  return {
    id,
    beforeDatasetsDraw(chart) {
      const x = chart.scales.x;
      const { top, bottom } = chart.chartArea;
      const ctx = chart.ctx;
      ctx.save();
      ctx.font = "11px ui-sans-serif, system-ui, sans-serif";
      const labelRowEnds: number[] = []; // right end (px) of the last label on each line
      for (const b of [...bands].sort((p, q) => p.lo - q.lo)) {
        const x0 = Math.max(x.getPixelForValue(b.lo), chart.chartArea.left);
        const x1 = Math.min(x.getPixelForValue(b.hi), chart.chartArea.right);
        if (x1 <= x0) continue;
        ctx.fillStyle = SERIES.band;
        ctx.fillRect(x0, top, x1 - x0, bottom - top);
        ctx.strokeStyle = SERIES.bandEdge;
        ctx.setLineDash([3, 3]);
        ctx.beginPath();
        ctx.moveTo(x0, top);
        ctx.lineTo(x0, bottom);
        ctx.moveTo(x1, top);
        ctx.lineTo(x1, bottom);
        ctx.stroke();
        ctx.fillStyle = "#0b5f57";
        const maxWidth = Math.max(40, x1 - x0 + 60);
        const width = Math.min(ctx.measureText(b.label).width, maxWidth);
        let line = labelRowEnds.findIndex((end) => end + 6 <= x0 + 3);
        if (line < 0) line = labelRowEnds.push(0) - 1;
        labelRowEnds[line] = x0 + 3 + width;
        ctx.fillText(b.label, x0 + 3, top + 12 + 13 * line, maxWidth);
      }
      ctx.restore();
    },
  };
}

/** Log-axis tick labels: only the decades, as 1e-3 style (the minor ticks stay unlabelled). */
export function decadeTick(value: number | string): string {
  const v = Number(value);
  if (!(v > 0)) return "";
  const e = Math.log10(v);
  return Math.abs(e - Math.round(e)) < 1e-9 ? `1e${Math.round(e)}` : "";
}
