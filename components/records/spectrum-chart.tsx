"use client";

import { useMemo } from "react";
import { Scatter } from "react-chartjs-2";
import type { ChartData, ChartOptions } from "chart.js";
import { bandsPlugin, decadeTick, SERIES } from "./chart-setup";
import type { ModeView, SpectraView, TrackedModeView } from "./types";

type Pt = { x: number; y: number };

function series(f: number[], s: number[] | null): Pt[] {
  if (!s) return [];
  const out: Pt[] = [];
  // Line 0 (DC) is left out: it carries the record's offset, not a mode, and log axes hide zeros.
  for (let i = 1; i < f.length; i++) if (s[i] > 0 && Number.isFinite(s[i])) out.push({ x: f[i], y: s[i] });
  return out;
}

/** s₁ at the line nearest `f` (the grid may be thinned, so search rather than divide). */
function valueAt(sp: SpectraView, f: number): number {
  const xs = sp.frequencyHz;
  let lo = 0;
  let hi = xs.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (xs[mid] <= f) lo = mid;
    else hi = mid;
  }
  return Math.abs(xs[hi] - f) < Math.abs(xs[lo] - f) ? sp.s1[hi] : sp.s1[lo];
}

/**
 * Singular value spectra s₁–s₃ of the CSD matrix on a log scale, the picked peaks (one per
 * identified mode, clickable) and the tracked modes' search bands shaded.
 */
export function SpectrumChart({
  spectra, modes, tracked, selected, onSelect,
}: {
  spectra: SpectraView;
  modes: ModeView[];
  tracked: TrackedModeView[];
  selected: number | null;
  onSelect?: (modeIndex: number) => void;
}) {
  const data = useMemo<ChartData<"scatter", Pt[]>>(() => {
    const f = spectra.frequencyHz;
    const line = (label: string, s: number[] | null, color: string, width: number) => ({
      label, data: series(f, s), showLine: true, borderColor: color, backgroundColor: color,
      borderWidth: width, pointRadius: 0, pointHoverRadius: 0, order: 2,
    });
    const peaks = modes.map((m) => {
      const fx = m.fddPeakHz ?? m.frequencyHz;
      return { x: fx, y: valueAt(spectra, fx) };
    });
    return {
      datasets: [
        line("s₁", spectra.s1, SERIES.s1, 1.6),
        ...(spectra.s2 ? [line("s₂", spectra.s2, SERIES.s2, 1.1)] : []),
        ...(spectra.s3 ? [line("s₃", spectra.s3, SERIES.s3, 1)] : []),
        {
          label: "Picked peaks", data: peaks, showLine: false, order: 1,
          borderColor: SERIES.peak, backgroundColor: modes.map((m) => (m.modeIndex === selected ? SERIES.peak : "#ffffff")),
          pointRadius: modes.map((m) => (m.modeIndex === selected ? 7 : 5)), pointHoverRadius: 8, borderWidth: 2, pointStyle: "triangle",
        },
      ],
    };
  }, [spectra, modes, selected]);

  const plugins = useMemo(
    () => [bandsPlugin("tracked-bands", tracked.map((t) => ({ lo: t.bandLowHz, hi: t.bandHighHz, label: t.label })))],
    [tracked],
  );

  const peakSet = spectra.s2 ? (spectra.s3 ? 3 : 2) : 1;
  const fMax = spectra.frequencyHz[spectra.frequencyHz.length - 1] ?? 1;
  const options = useMemo<ChartOptions<"scatter">>(() => ({
    animation: false,
    maintainAspectRatio: false,
    parsing: false,
    normalized: true,
    interaction: { mode: "nearest", intersect: true },
    onClick: (_e, elements) => {
      const hit = elements.find((el) => el.datasetIndex === peakSet);
      if (hit && onSelect) onSelect(modes[hit.index].modeIndex);
    },
    scales: {
      x: { type: "linear", min: 0, max: fMax, title: { display: true, text: "Frequency (Hz)", color: SERIES.text }, grid: { color: SERIES.grid } },
      y: { type: "logarithmic", ticks: { callback: decadeTick, autoSkip: false }, title: { display: true, text: "Singular value ((m/s²)²/Hz)", color: SERIES.text }, grid: { color: SERIES.grid } },
    },
    plugins: {
      legend: { position: "top", align: "end", labels: { boxWidth: 14, boxHeight: 2, color: SERIES.text } },
      tooltip: {
        callbacks: {
          label: (ctx) => {
            if (ctx.datasetIndex === peakSet) {
              const m = modes[ctx.dataIndex];
              return `Mode ${m.modeIndex + 1}: ${m.frequencyHz.toFixed(3)} Hz${m.tracked ? ` (${m.tracked.label})` : ""}`;
            }
            return `${ctx.dataset.label}: ${ctx.parsed.y?.toExponential(2)} at ${ctx.parsed.x?.toFixed(3)} Hz`;
          },
        },
      },
    },
  }), [fMax, modes, onSelect, peakSet]);

  return (
    <div className="h-80 w-full" data-testid="spectrum-chart" data-peaks={modes.length} data-bands={tracked.length}>
      <Scatter data={data} options={options} plugins={plugins} aria-label="Singular value spectra" role="img" />
    </div>
  );
}
