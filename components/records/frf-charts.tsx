"use client";

import { useMemo } from "react";
import { Scatter } from "react-chartjs-2";
import type { ChartOptions } from "chart.js";
import { decadeTick, SERIES } from "./chart-setup";
import type { FrfView } from "./types";

const PALETTE = ["#24466e", "#138a7e", "#d99a16", "#be1e3c", "#6f8fb3", "#5b4a8a", "#3f4a5a", "#9c6b3d"];

function lines(f: number[], rows: { code: string; values: number[] }[], positiveOnly: boolean) {
  return rows.map((r, k) => ({
    label: r.code,
    data: f.flatMap((x, i) => (i > 0 && Number.isFinite(r.values[i]) && (!positiveOnly || r.values[i] > 0) ? [{ x, y: r.values[i] }] : [])),
    showLine: true, pointRadius: 0, borderWidth: 1.3, borderColor: PALETTE[k % PALETTE.length], backgroundColor: PALETTE[k % PALETTE.length],
  }));
}

function opts(yTitle: string, log: boolean, range?: [number, number]): ChartOptions<"scatter"> {
  return {
    animation: false, maintainAspectRatio: false, parsing: false,
    scales: {
      x: { type: "linear", title: { display: true, text: "Frequency (Hz)", color: SERIES.text }, grid: { color: SERIES.grid } },
      y: { type: log ? "logarithmic" : "linear", min: range?.[0], max: range?.[1], ...(log ? { ticks: { callback: decadeTick, autoSkip: false } } : {}), title: { display: true, text: yTitle, color: SERIES.text }, grid: { color: SERIES.grid } },
    },
    plugins: { legend: { position: "top", align: "end", labels: { boxWidth: 14, boxHeight: 2, color: SERIES.text } } },
  };
}

/** FRF magnitude (log), phase and coherence of a forced-test record, one line per response channel. */
export function FrfCharts({ frf }: { frf: FrfView }) {
  const f = frf.frequencyHz;
  const mag = useMemo(() => ({ datasets: lines(f, frf.channels.map((c) => ({ code: c.code, values: c.magnitude })), true) }), [f, frf.channels]);
  const phase = useMemo(() => ({ datasets: lines(f, frf.channels.map((c) => ({ code: c.code, values: c.phaseDeg })), false) }), [f, frf.channels]);
  const withCoh = frf.channels.filter((c) => c.coherence !== null);
  const coh = useMemo(() => ({ datasets: lines(f, withCoh.map((c) => ({ code: c.code, values: c.coherence ?? [] })), false) }), [f, withCoh]);
  return (
    <div className="grid gap-4" data-testid="frf-charts">
      <div className="h-64"><Scatter data={mag} options={opts("|H| ((m/s²)/N)", true)} aria-label="FRF magnitude" role="img" /></div>
      <div className="h-48"><Scatter data={phase} options={opts("Phase (°)", false, [-180, 180])} aria-label="FRF phase" role="img" /></div>
      {withCoh.length ? <div className="h-40"><Scatter data={coh} options={opts("Coherence γ²", false, [0, 1])} aria-label="Coherence" role="img" /></div> : null}
    </div>
  );
}
