"use client";

import { useMemo } from "react";
import { Scatter } from "react-chartjs-2";
import type { ChartData, ChartOptions } from "chart.js";
import { bandsPlugin, SERIES } from "./chart-setup";
import type { StabilisationPointView, TrackedModeView } from "./types";

/** Stability labels of SSI-COV poles, least to most stable, with their legend text and colour. */
const LABELS: { key: StabilisationPointView["stable"]; text: string; color: string; radius: number }[] = [
  { key: "new", text: "New pole", color: "#c4cad0", radius: 2 },
  { key: "f", text: "Stable frequency", color: "#d99a16", radius: 2.5 },
  { key: "fd", text: "Stable frequency + damping", color: "#6f8fb3", radius: 3 },
  { key: "fv", text: "Stable frequency + shape", color: "#24466e", radius: 3 },
  { key: "fdv", text: "Stable in all", color: "#138a7e", radius: 3.5 },
];

/** The stabilisation diagram: poles by model order against frequency, coloured by stability. */
export function StabilisationChart({ points, tracked, maxFrequencyHz }: { points: StabilisationPointView[]; tracked: TrackedModeView[]; maxFrequencyHz?: number }) {
  const data = useMemo<ChartData<"scatter">>(() => ({
    datasets: LABELS.map((l) => ({
      label: l.text,
      data: points.filter((p) => p.stable === l.key).map((p) => ({ x: p.frequencyHz, y: p.order })),
      backgroundColor: l.color, borderColor: l.color, pointRadius: l.radius, pointHoverRadius: l.radius + 2,
    })),
  }), [points]);
  const plugins = useMemo(() => [bandsPlugin("stab-bands", tracked.map((t) => ({ lo: t.bandLowHz, hi: t.bandHighHz, label: t.label })))], [tracked]);
  const options = useMemo<ChartOptions<"scatter">>(() => ({
    animation: false,
    maintainAspectRatio: false,
    parsing: false,
    scales: {
      x: { type: "linear", min: 0, max: maxFrequencyHz, title: { display: true, text: "Frequency (Hz)", color: SERIES.text }, grid: { color: SERIES.grid } },
      y: { type: "linear", beginAtZero: true, title: { display: true, text: "Model order", color: SERIES.text }, grid: { color: SERIES.grid } },
    },
    plugins: {
      legend: { position: "top", align: "end", labels: { boxWidth: 8, boxHeight: 8, color: SERIES.text, usePointStyle: true } },
      tooltip: { callbacks: { label: (c) => `${c.dataset.label}: ${c.parsed.x?.toFixed(3)} Hz, order ${c.parsed.y}` } },
    },
  }), [maxFrequencyHz]);
  return (
    <div className="h-72 w-full" data-testid="stabilisation-chart" data-poles={points.length}>
      <Scatter data={data} options={options} plugins={plugins} aria-label="Stabilisation diagram" role="img" />
    </div>
  );
}
