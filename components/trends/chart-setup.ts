"use client";

/**
 * Chart.js registration and helpers of the Trends charts: linear axes only (time as ms UTC
 * with our own date ticks: no date adapter), scatter datasets with lines, a filled band, HTML
 * legends (the built-in canvas legend is off so legends are text in the page).
 */
import { Chart, Filler, LinearScale, LineElement, LogarithmicScale, PointElement, ScatterController, Tooltip, type Plugin } from "chart.js";

Chart.register(ScatterController, LineElement, PointElement, LinearScale, LogarithmicScale, Tooltip, Filler);

/** Trend palette (distinct from the condition colours). */
export const TREND = {
  measured: "#24466e",
  prediction: "#0b5f57",
  band: "rgba(19, 138, 126, 0.14)",
  bandEdge: "rgba(19, 138, 126, 0.45)",
  ewma: "#24466e",
  residual: "#9aaabb",
  limit: "#be1e3c",
  beyond: "#be1e3c",
  alert: "#8a1c2b",
  envelope: "#7a7f87",
  training: "rgba(36, 70, 110, 0.06)",
  advisory: "#b07a1c",
  grid: "#e4e7e2",
  text: "#5a6470",
};

/** Colour stops of the temperature scale, cold to warm (°C mapped linearly between min and max). */
const STOPS: [number, number, number][] = [[44, 93, 158], [120, 170, 210], [232, 217, 168], [224, 138, 79], [176, 48, 42]];

/** Colour of a temperature on the [min, max] scale. */
export function temperatureColour(t: number | null, min: number, max: number): string {
  if (t === null || !Number.isFinite(t)) return TREND.envelope;
  const u = max > min ? Math.min(1, Math.max(0, (t - min) / (max - min))) : 0.5;
  const x = u * (STOPS.length - 1);
  const i = Math.min(STOPS.length - 2, Math.floor(x));
  const f = x - i;
  const c = STOPS[i].map((v, k) => Math.round(v + f * (STOPS[i + 1][k] - v)));
  return `rgb(${c[0]}, ${c[1]}, ${c[2]})`;
}

/** CSS gradient of the temperature scale (for the colour bar). */
export const TEMPERATURE_GRADIENT = `linear-gradient(to right, ${STOPS.map((c) => `rgb(${c.join(", ")})`).join(", ")})`;

/** Date tick formatter for ms-UTC axes in the organisation's zone. */
export function dateTick(timeZone: string, spanMs: number): (value: number | string) => string {
  const fmt = new Intl.DateTimeFormat("en-GB", spanMs > 400 * 86_400_000
    ? { timeZone, month: "short", year: "numeric" }
    : { timeZone, day: "2-digit", month: "short" });
  return (value) => fmt.format(new Date(Number(value)));
}

export function dateTimeLabel(ms: number, timeZone: string): string {
  return new Intl.DateTimeFormat("en-GB", { timeZone, year: "numeric", month: "short", day: "2-digit", hour: "2-digit", minute: "2-digit" }).format(new Date(ms));
}

/**
 * Vertical markers (x in data units: alert times) and an optional shaded x-interval (the
 * training window), drawn under the datasets with small labels.
 */
export function markersPlugin(id: string, markers: { x: number; label: string }[], shade: { lo: number; hi: number; label: string } | null): Plugin<"scatter"> {
  return {
    id,
    beforeDatasetsDraw(chart) {
      const x = chart.scales.x;
      const { top, bottom, left, right } = chart.chartArea;
      const ctx = chart.ctx;
      ctx.save();
      ctx.font = "11px ui-sans-serif, system-ui, sans-serif";
      if (shade) {
        const x0 = Math.max(x.getPixelForValue(shade.lo), left);
        const x1 = Math.min(x.getPixelForValue(shade.hi), right);
        if (x1 > x0) {
          ctx.fillStyle = TREND.training;
          ctx.fillRect(x0, top, x1 - x0, bottom - top);
          ctx.fillStyle = TREND.text;
          ctx.fillText(shade.label, x0 + 4, top + 12, Math.max(40, x1 - x0 - 8));
        }
      }
      for (const m of markers) {
        const px = x.getPixelForValue(m.x);
        if (px < left || px > right) continue;
        ctx.strokeStyle = TREND.alert;
        ctx.lineWidth = 1.5;
        ctx.setLineDash([5, 3]);
        ctx.beginPath();
        ctx.moveTo(px, top);
        ctx.lineTo(px, bottom);
        ctx.stroke();
        ctx.setLineDash([]);
        ctx.fillStyle = TREND.alert;
        const w = ctx.measureText(m.label).width;
        ctx.fillText(m.label, px - w - 4 > left ? px - w - 4 : px + 4, top + 24);
      }
      ctx.restore();
    },
  };
}
