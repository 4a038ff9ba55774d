/**
 * Time-series charts for the reports, drawn into a {@link Raster}: a plot frame, grid lines
 * at "nice" ticks (1, 2, 5 × 10^k on y; month or day starts on x, UTC), tick labels in the
 * 5×7 font, then each series as dots or a polyline that breaks at NaN. Axis titles and the
 * legend are set as text by the caller (PDF or HTML), which has real fonts.
 */
import { drawText, GLYPH_H, textWidth } from "./bitmap-font";
import { createRaster, drawLine, fillDisc, fillRect, hexColour, type Raster } from "./raster";

export interface ChartSeries {
  kind: "dots" | "line";
  /** Times, ms UTC. */
  x: ArrayLike<number>;
  /** Values in the y unit; NaN = no value (a gap in a line). */
  y: ArrayLike<number>;
  /** "#rrggbb". */
  colour: string;
  /** Pen width (line) or dot radius, pixels; default 2. */
  size?: number;
  /** Draw the line dashed (limits, predictions). */
  dashed?: boolean;
}

export interface LineChartSpec {
  width: number;
  height: number;
  series: ChartSeries[];
  /** Time range, ms UTC; default the data's. */
  xRange?: [number, number];
  /** Value range; default the data's, padded 5 %. */
  yRange?: [number, number];
  /** Scale of the tick-label font (default 2: 10×14-pixel glyphs). */
  fontScale?: number;
}

export interface RenderedChart {
  raster: Raster;
  /** The plot area in pixels. */
  plot: { left: number; top: number; right: number; bottom: number };
  xToPx: (ms: number) => number;
  yToPx: (v: number) => number;
  yTicks: number[];
  xTicks: number[];
}

const GRID = hexColour("#e4e7eb");
const FRAME = hexColour("#7b8794");
const LABEL = hexColour("#3e4c59");
const DAY_MS = 86_400_000;

/**
 * Ticks at multiples of 1, 2 or 5 × 10^k covering [lo, hi] with about `target` intervals
 * (the usual "nice numbers" rule). Returns at least the two ends when lo = hi.
 */
export function niceTicks(lo: number, hi: number, target = 5): number[] {
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) throw new TypeError(`tick range must be finite (got ${lo}, ${hi})`);
  if (hi < lo) [lo, hi] = [hi, lo];
  if (hi === lo) return [lo];
  const raw = (hi - lo) / Math.max(1, target);
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * mag).find((s) => s >= raw) ?? 10 * mag;
  const out: number[] = [];
  for (let v = Math.ceil(lo / step - 1e-9) * step; v <= hi + step * 1e-9; v += step) out.push(Math.abs(v) < step * 1e-9 ? 0 : v);
  return out;
}

/** Decimals needed to tell ticks `step` apart. */
function decimalsFor(ticks: number[]): number {
  if (ticks.length < 2) return 2;
  const step = Math.abs(ticks[1] - ticks[0]);
  return Math.max(0, Math.min(6, -Math.floor(Math.log10(step) + 1e-9)));
}

/** UTC month starts (span > 62 days) or day starts inside [lo, hi], thinned to ≤ `max` ticks. */
export function timeTicks(lo: number, hi: number, max = 7): { at: number; label: string }[] {
  const out: { at: number; label: string }[] = [];
  const iso = (t: number) => new Date(t).toISOString();
  if (hi - lo > 62 * DAY_MS) {
    const d = new Date(lo);
    let y = d.getUTCFullYear();
    let m = d.getUTCMonth() + (d.getUTCDate() === 1 && d.getUTCHours() === 0 ? 0 : 1);
    for (let t = Date.UTC(y, m, 1); t <= hi; t = Date.UTC(y, m, 1)) {
      out.push({ at: t, label: iso(t).slice(0, 7) });
      m += 1;
      if (m > 11) { m = 0; y += 1; }
    }
  } else {
    for (let t = Math.ceil(lo / DAY_MS) * DAY_MS; t <= hi; t += DAY_MS) out.push({ at: t, label: iso(t).slice(5, 10) });
  }
  const every = Math.ceil(out.length / max);
  return out.filter((_, i) => i % every === 0);
}

function finiteRange(series: ChartSeries[], pick: (s: ChartSeries) => ArrayLike<number>): [number, number] | null {
  let lo = Infinity;
  let hi = -Infinity;
  for (const s of series) for (const v of Array.from(pick(s))) if (Number.isFinite(v)) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
  return lo <= hi ? [lo, hi] : null;
}

/** Draw the chart (see the file header). An empty series list draws the frame only. */
export function renderLineChart(spec: LineChartSpec): RenderedChart {
  const scale = spec.fontScale ?? 2;
  const img = createRaster(spec.width, spec.height);
  const xr = spec.xRange ?? finiteRange(spec.series, (s) => s.x) ?? [0, DAY_MS];
  let yr = spec.yRange ?? finiteRange(spec.series, (s) => s.y) ?? [0, 1];
  if (!spec.yRange) {
    const pad = (yr[1] - yr[0]) * 0.05 || Math.abs(yr[0]) * 0.01 || 1;
    yr = [yr[0] - pad, yr[1] + pad];
  }
  const yTicks = niceTicks(yr[0], yr[1], 5).filter((v) => v >= yr[0] && v <= yr[1]);
  const dec = decimalsFor(yTicks);
  const yLabels = yTicks.map((v) => v.toFixed(dec));
  const left = Math.max(...yLabels.map((l) => textWidth(l, scale)), 0) + 8 * scale;
  const plot = { left, top: 4 * scale, right: spec.width - 6 * scale, bottom: spec.height - (GLYPH_H + 6) * scale };
  const xSpan = xr[1] - xr[0] || 1;
  const ySpan = yr[1] - yr[0] || 1;
  const xToPx = (ms: number) => plot.left + ((ms - xr[0]) / xSpan) * (plot.right - plot.left);
  const yToPx = (v: number) => plot.bottom - ((v - yr[0]) / ySpan) * (plot.bottom - plot.top);

  const xt = timeTicks(xr[0], xr[1]);
  yTicks.forEach((v, i) => {
    const py = yToPx(v);
    drawLine(img, plot.left, py, plot.right, py, GRID);
    drawText(img, yLabels[i], plot.left - 4 * scale - textWidth(yLabels[i], scale), py - (GLYPH_H * scale) / 2, LABEL, scale);
  });
  for (const t of xt) {
    const px = xToPx(t.at);
    drawLine(img, px, plot.top, px, plot.bottom, GRID);
    drawText(img, t.label, px - textWidth(t.label, scale) / 2, plot.bottom + 3 * scale, LABEL, scale);
  }
  for (const s of spec.series) drawSeries(img, s, xToPx, yToPx, plot);
  // Frame last, over the series' ends.
  drawLine(img, plot.left, plot.top, plot.left, plot.bottom, FRAME);
  drawLine(img, plot.left, plot.bottom, plot.right, plot.bottom, FRAME);
  return { raster: img, plot, xToPx, yToPx, yTicks, xTicks: xt.map((t) => t.at) };
}

function drawSeries(
  img: Raster, s: ChartSeries, xToPx: (v: number) => number, yToPx: (v: number) => number,
  plot: RenderedChart["plot"],
): void {
  const c = hexColour(s.colour);
  const size = s.size ?? 2;
  const n = Math.min(s.x.length, s.y.length);
  const inside = (px: number, py: number) => px >= plot.left && px <= plot.right && py >= plot.top && py <= plot.bottom;
  if (s.kind === "dots") {
    for (let i = 0; i < n; i++) {
      const px = xToPx(s.x[i]);
      const py = yToPx(s.y[i]);
      if (!Number.isFinite(py) || !inside(px, py)) continue;
      if (size <= 1) fillRect(img, px, py, 1, 1, c);
      else fillDisc(img, px, py, size, c);
    }
    return;
  }
  let prev: [number, number] | null = null;
  let run = 0;
  for (let i = 0; i < n; i++) {
    const px = xToPx(s.x[i]);
    const py = Math.min(plot.bottom, Math.max(plot.top, yToPx(s.y[i])));
    if (!Number.isFinite(s.y[i]) || !Number.isFinite(px)) { prev = null; continue; }
    if (prev && !s.dashed) drawLine(img, prev[0], prev[1], px, py, c, size);
    else if (prev) {
      // Dashes of 8 pixels with 5-pixel gaps, continued across segments by the run length.
      const len = Math.hypot(px - prev[0], py - prev[1]);
      for (let d = 0; d < len; d += 1) {
        if ((run + d) % 13 < 8) {
          const f0 = d / len;
          const f1 = Math.min(1, (d + 1) / len);
          drawLine(img, prev[0] + f0 * (px - prev[0]), prev[1] + f0 * (py - prev[1]), prev[0] + f1 * (px - prev[0]), prev[1] + f1 * (py - prev[1]), c, size);
        }
      }
      run += len;
    }
    prev = [px, py];
  }
}
