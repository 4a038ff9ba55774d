"use client";

/**
 * The Trends charts of one asset (issue 5 screens): per tracked mode frequency against time
 * (coloured by temperature, with the baseline prediction band), frequency against temperature
 * with the fitted model, the EWMA control chart of the daily residual, and damping with wide
 * advisory limits; for the asset the Hotelling T² chart. Alert times are dashed red lines;
 * "out of envelope, no decision" points are grey crosses. Time axes are ms UTC shown in the
 * organisation's zone.
 */
import { useMemo } from "react";
import { Scatter } from "react-chartjs-2";
import type { ChartData, ChartDataset, ChartOptions, TooltipItem } from "chart.js";
import { dateTick, dateTimeLabel, markersPlugin, TEMPERATURE_GRADIENT, temperatureColour, TREND } from "./chart-setup";
import { ChartCard } from "./chart-card";
import type { LegendItem } from "./legend";
import type { TrendMode, TrendModel, TrendsView } from "./types";

type Pt = { x: number; y: number };
type Ds = ChartDataset<"scatter", Pt[]>;

const ENVELOPE_LABEL = "Out of envelope, no decision";
const DAY = 86_400_000;

function timeOptions(
  view: TrendsView, yTitle: string, label: (ctx: TooltipItem<"scatter">) => string, yType: "linear" | "logarithmic" = "linear",
): ChartOptions<"scatter"> {
  return {
    animation: false,
    maintainAspectRatio: false,
    parsing: false,
    normalized: true,
    interaction: { mode: "nearest", intersect: false, axis: "x" },
    scales: {
      x: {
        type: "linear", min: view.xMinMs, max: view.xMaxMs,
        ticks: { callback: dateTick(view.timeZone, view.xMaxMs - view.xMinMs), maxTicksLimit: 8, color: TREND.text },
        grid: { color: TREND.grid },
      },
      y: { type: yType, title: { display: true, text: yTitle, color: TREND.text }, ticks: { color: TREND.text }, grid: { color: TREND.grid } },
    },
    plugins: {
      legend: { display: false },
      tooltip: {
        callbacks: {
          title: (items) => (items[0] ? dateTimeLabel(items[0].parsed.x ?? 0, view.timeZone) : ""),
          label,
        },
      },
    },
  };
}

function line(label: string, data: Pt[], colour: string, extra: Partial<Ds> = {}): Ds {
  return { label, data, showLine: true, borderColor: colour, backgroundColor: colour, borderWidth: 1.2, pointRadius: 0, pointHoverRadius: 0, ...extra };
}

function crosses(label: string, data: Pt[]): Ds {
  return { label, data, showLine: false, pointStyle: "crossRot", pointRadius: 4, borderColor: TREND.envelope, backgroundColor: TREND.envelope, borderWidth: 1.2 };
}

const csv = (base: string, chart: string) => `${base}${base.includes("?") ? "&" : "?"}chart=${chart}`;

function useMarkers(view: TrendsView, id: string) {
  return useMemo(() => [markersPlugin(
    id,
    view.alertTimesMs.map((x) => ({ x, label: "Alert" })),
    view.training ? { lo: view.training.fromMs, hi: view.training.toMs, label: "Baseline training window" } : null,
  )], [view, id]);
}

/** Frequency against time, coloured by temperature, with the prediction and its ±3 s band. */
export function FrequencyTimeChart({ mode, view, csvBase, tRange }: { mode: TrendMode; view: TrendsView; csvBase: string; tRange: [number, number] }) {
  const plugins = useMarkers(view, `ft-${mode.trackedModeId}`);
  const data = useMemo<ChartData<"scatter", Pt[]>>(() => {
    const inEnv = mode.points.filter((p) => !p.outOfEnvelope);
    const days = mode.band;
    const ds: Ds[] = [];
    if (days.length > 0) {
      ds.push(line("Band low", days.map((d) => ({ x: d.x, y: d.lo })), TREND.bandEdge, { borderWidth: 0.6, order: 4 }));
      ds.push(line("Band high", days.map((d) => ({ x: d.x, y: d.hi })), TREND.bandEdge, { borderWidth: 0.6, fill: "-1", backgroundColor: TREND.band, order: 4 }));
      ds.push(line("Prediction", days.map((d) => ({ x: d.x, y: d.mean })), TREND.prediction, { borderWidth: 1.2, order: 3 }));
    }
    ds.push({
      label: "Measured", data: inEnv.map((p) => ({ x: p.atMs, y: p.frequencyHz })), showLine: false, order: 1,
      pointRadius: 2, pointHoverRadius: 4, borderWidth: 0,
      pointBackgroundColor: inEnv.map((p) => temperatureColour(p.temperatureC, tRange[0], tRange[1])),
    });
    ds.push({ ...crosses(ENVELOPE_LABEL, mode.points.filter((p) => p.outOfEnvelope).map((p) => ({ x: p.atMs, y: p.frequencyHz }))), order: 0 });
    return { datasets: ds };
  }, [mode, tRange]);
  const options = useMemo(() => timeOptions(view, "Frequency (Hz)", (ctx) => `${ctx.dataset.label}: ${ctx.parsed.y?.toFixed(4)} Hz`), [view]);
  const legend: LegendItem[] = [
    { label: `Measured, colour = temperature ${tRange[0].toFixed(0)}…${tRange[1].toFixed(0)} °C`, colour: TEMPERATURE_GRADIENT, kind: "gradient" },
    ...(mode.model ? [
      { label: "Baseline prediction (daily mean)", colour: TREND.prediction, kind: "line" as const },
      { label: "Prediction band (±3 s, daily range)", colour: TREND.band, kind: "area" as const },
    ] : []),
    { label: ENVELOPE_LABEL, colour: TREND.envelope, kind: "cross" },
    ...(view.alertTimesMs.length > 0 ? [{ label: "Alert raised", colour: TREND.alert, kind: "dash" as const }] : []),
  ];
  return (
    <ChartCard title="Frequency over time" legend={legend} csvHref={csv(csvBase, "frequency")} testId="chart-frequency" className="lg:col-span-2">
      <Scatter data={data} options={options} plugins={plugins} role="img" aria-label={`${mode.label}: frequency over time`} />
    </ChartCard>
  );
}

function modelAt(m: TrendModel, t: number): number {
  let f = m.interceptHz + m.slopeHzPerC * t;
  if (m.kind === "bilinear" && m.knotC !== null && m.coldSlopeHzPerC !== null) f += (m.coldSlopeHzPerC - m.slopeHzPerC) * Math.min(t - m.knotC, 0);
  return f;
}

/** Frequency against temperature with the fitted model (dashed beyond the training envelope). */
export function FrequencyTemperatureChart({ mode, view, csvBase }: { mode: TrendMode; view: TrendsView; csvBase: string }) {
  const data = useMemo<ChartData<"scatter", Pt[]>>(() => {
    const tr = view.training;
    const inTraining = (t: number) => tr !== null && t >= tr.fromMs && t < tr.toMs;
    const withT = mode.points.filter((p) => p.temperatureC !== null);
    const pts = (f: (p: (typeof withT)[number]) => boolean) => withT.filter(f).map((p) => ({ x: p.temperatureC ?? 0, y: p.frequencyHz }));
    const ds: Ds[] = [
      { label: "Training window", data: pts((p) => !p.outOfEnvelope && inTraining(p.atMs)), showLine: false, pointRadius: 1.6, borderWidth: 0, backgroundColor: "#9fb4cc", order: 3 },
      { label: "After training", data: pts((p) => !p.outOfEnvelope && !inTraining(p.atMs)), showLine: false, pointRadius: 1.8, borderWidth: 0, backgroundColor: TREND.measured, order: 2 },
      { ...crosses(ENVELOPE_LABEL, pts((p) => p.outOfEnvelope)), order: 1 },
    ];
    const m = mode.model;
    if (m) {
      const ts = withT.map((p) => p.temperatureC ?? 0);
      const lo = Math.min(m.envelope.temperatureC[0], ...ts);
      const hi = Math.max(m.envelope.temperatureC[1], ...ts);
      const [a, b] = m.envelope.temperatureC;
      const curve = (t0: number, t1: number) => {
        const out: Pt[] = [];
        const n = 60;
        for (let i = 0; i <= n; i++) {
          const t = t0 + ((t1 - t0) * i) / n;
          out.push({ x: t, y: modelAt(m, t) });
        }
        return out;
      };
      ds.push(line(`Fitted ${m.kind} model`, curve(a, b), TREND.prediction, { borderWidth: 2, order: 0 }));
      if (lo < a) ds.push(line("Extrapolation (cold)", curve(lo, a), TREND.prediction, { borderWidth: 1.5, borderDash: [5, 4], order: 0 }));
      if (hi > b) ds.push(line("Extrapolation (warm)", curve(b, hi), TREND.prediction, { borderWidth: 1.5, borderDash: [5, 4], order: 0 }));
    }
    return { datasets: ds };
  }, [mode, view.training]);
  const options = useMemo<ChartOptions<"scatter">>(() => ({
    animation: false, maintainAspectRatio: false, parsing: false, normalized: true,
    scales: {
      x: { type: "linear", title: { display: true, text: "Temperature (°C)", color: TREND.text }, ticks: { color: TREND.text }, grid: { color: TREND.grid } },
      y: { type: "linear", title: { display: true, text: "Frequency (Hz)", color: TREND.text }, ticks: { color: TREND.text }, grid: { color: TREND.grid } },
    },
    plugins: {
      legend: { display: false },
      tooltip: { callbacks: { label: (ctx) => `${ctx.dataset.label}: ${ctx.parsed.y?.toFixed(4)} Hz at ${ctx.parsed.x?.toFixed(1)} °C` } },
    },
  }), []);
  const m = mode.model;
  const legend: LegendItem[] = [
    { label: "Training window", colour: "#9fb4cc", kind: "dot" },
    { label: "After training", colour: TREND.measured, kind: "dot" },
    ...(m ? [
      { label: `Fitted ${m.kind} model${m.kind === "bilinear" && m.knotC !== null ? ` (knot ${m.knotC.toFixed(1)} °C)` : ""}`, colour: TREND.prediction, kind: "line" as const },
      { label: "Beyond the training envelope", colour: TREND.prediction, kind: "dash" as const },
    ] : []),
    { label: ENVELOPE_LABEL, colour: TREND.envelope, kind: "cross" },
  ];
  return (
    <ChartCard title="Frequency against temperature" legend={legend} csvHref={csv(csvBase, "temperature")} testId="chart-temperature">
      <Scatter data={data} options={options} role="img" aria-label={`${mode.label}: frequency against temperature`} />
    </ChartCard>
  );
}

/** EWMA of the daily mean residual with its limits; excursions red, alerts dashed. */
export function EwmaChart({ mode, view, csvBase }: { mode: TrendMode; view: TrendsView; csvBase: string }) {
  const plugins = useMarkers(view, `ewma-${mode.trackedModeId}`);
  const data = useMemo<ChartData<"scatter", Pt[]>>(() => {
    const mHz = (v: number) => v * 1000;
    const d = mode.daily;
    const present = d.filter((x) => x.residualHz !== null);
    return {
      datasets: [
        { label: "Daily mean residual", data: present.map((x) => ({ x: x.dayMs + DAY / 2, y: mHz(x.residualHz ?? 0) })), showLine: false, pointRadius: 1.6, borderWidth: 0, backgroundColor: TREND.residual, order: 4 },
        line("EWMA", present.map((x) => ({ x: x.dayMs + DAY / 2, y: mHz(x.ewma) })), TREND.ewma, { borderWidth: 1.8, order: 2 }),
        line("Upper limit", present.map((x) => ({ x: x.dayMs + DAY / 2, y: mHz(x.ewmaUcl) })), TREND.limit, { borderWidth: 1, borderDash: [6, 3], order: 3 }),
        line("Lower limit", present.map((x) => ({ x: x.dayMs + DAY / 2, y: mHz(x.ewmaLcl) })), TREND.limit, { borderWidth: 1, borderDash: [6, 3], order: 3 }),
        { label: "Beyond the limits", data: present.filter((x) => x.beyond).map((x) => ({ x: x.dayMs + DAY / 2, y: mHz(x.ewma) })), showLine: false, pointRadius: 3, pointStyle: "rectRot", borderWidth: 0, backgroundColor: TREND.beyond, order: 1 },
        { ...crosses(ENVELOPE_LABEL, d.filter((x) => x.residualHz === null && x.outOfEnvelope).map((x) => ({ x: x.dayMs + DAY / 2, y: 0 }))), order: 0 },
      ],
    };
  }, [mode]);
  const options = useMemo(() => timeOptions(view, "Residual (mHz)", (ctx) => `${ctx.dataset.label}: ${ctx.parsed.y?.toFixed(2)} mHz`), [view]);
  const excursions = mode.daily.filter((x) => x.beyond).length;
  const legend: LegendItem[] = [
    { label: "Daily mean residual", colour: TREND.residual, kind: "dot" },
    { label: "EWMA (λ = 0.1)", colour: TREND.ewma, kind: "line" },
    { label: "Control limits (L = 2.814)", colour: TREND.limit, kind: "dash" },
    { label: "Beyond the limits", colour: TREND.beyond, kind: "dot" },
    { label: ENVELOPE_LABEL, colour: TREND.envelope, kind: "cross" },
    ...(view.alertTimesMs.length > 0 ? [{ label: "Alert raised", colour: TREND.alert, kind: "dash" as const }] : []),
  ];
  return (
    <ChartCard
      title="EWMA control chart" legend={legend} csvHref={csv(csvBase, "ewma")} testId="chart-ewma"
      note={`${excursions} day(s) beyond the limits in this range. Residual = measured − baseline prediction, daily means.`}
    >
      <Scatter data={data} options={options} plugins={plugins} role="img" aria-label={`${mode.label}: EWMA control chart`} />
    </ChartCard>
  );
}

/** Damping ratio over time with the median and wide advisory limits (advisory only). */
export function DampingChart({ mode, view, csvBase }: { mode: TrendMode; view: TrendsView; csvBase: string }) {
  const data = useMemo<ChartData<"scatter", Pt[]>>(() => {
    const dm = mode.damping;
    const pct = (v: number) => v * 100;
    const flat = (v: number | null) => (v === null ? [] : [{ x: view.xMinMs, y: pct(v) }, { x: view.xMaxMs, y: pct(v) }]);
    return {
      datasets: [
        { label: "Damping ratio", data: dm.points.map((p) => ({ x: p.atMs, y: pct(p.dampingRatio) })), showLine: false, pointRadius: 1.5, borderWidth: 0, backgroundColor: TREND.measured, order: 2 },
        line("Median (training)", flat(dm.median), TREND.prediction, { borderWidth: 1.5, order: 1 }),
        line("Upper advisory limit", flat(dm.upperAdvisory), TREND.advisory, { borderWidth: 1.2, borderDash: [6, 3], order: 1 }),
        line("Lower advisory limit", flat(dm.lowerAdvisory), TREND.advisory, { borderWidth: 1.2, borderDash: [6, 3], order: 1 }),
      ],
    };
  }, [mode, view.xMinMs, view.xMaxMs]);
  const options = useMemo(() => timeOptions(view, "Damping ratio (%)", (ctx) => `${ctx.dataset.label}: ${ctx.parsed.y?.toFixed(2)} %`), [view]);
  const legend: LegendItem[] = [
    { label: "Damping ratio", colour: TREND.measured, kind: "dot" },
    { label: "Median (training)", colour: TREND.prediction, kind: "line" },
    { label: "Advisory limits", colour: TREND.advisory, kind: "dash" },
  ];
  return (
    <ChartCard
      title="Damping trend (advisory)" legend={legend} csvHref={csv(csvBase, "damping")} testId="chart-damping" className="lg:col-span-2"
      note="Advisory only: damping from short ambient records scatters by ±15–40 %, so these wide limits flag gross changes for a look and never change the asset's condition."
    >
      {mode.damping.points.length > 0
        ? <Scatter data={data} options={options} role="img" aria-label={`${mode.label}: damping trend`} />
        : <p className="text-sm text-muted">No damping estimates in this range.</p>}
    </ChartCard>
  );
}

/** Hotelling T² of the daily residual vector with its UCL. */
export function T2Chart({ view, csvBase }: { view: TrendsView; csvBase: string }) {
  const plugins = useMarkers(view, "t2");
  const data = useMemo<ChartData<"scatter", Pt[]>>(() => ({
    datasets: [
      line("T²", view.t2.map((d) => ({ x: d.dayMs + DAY / 2, y: d.t2 })), TREND.ewma, { borderWidth: 1, pointRadius: 1.5, order: 2 }),
      line("UCL", view.t2Ucl === null ? [] : [{ x: view.xMinMs, y: view.t2Ucl }, { x: view.xMaxMs, y: view.t2Ucl }], TREND.limit, { borderWidth: 1.2, borderDash: [6, 3], order: 3 }),
      { label: "Above the UCL", data: view.t2.filter((d) => d.beyond).map((d) => ({ x: d.dayMs + DAY / 2, y: d.t2 })), showLine: false, pointRadius: 3, pointStyle: "rectRot", borderWidth: 0, backgroundColor: TREND.beyond, order: 1 },
    ],
  }), [view]);
  const options = useMemo<ChartOptions<"scatter">>(() => {
    const top = Math.max(...view.t2.map((d) => d.t2), view.t2Ucl ?? 0);
    // Far beyond the UCL a linear axis flattens the in-control part: use a log axis then.
    const log = view.t2Ucl !== null && top > 8 * view.t2Ucl;
    return timeOptions(view, log ? "T² (log scale)" : "T²", (ctx) => `${ctx.dataset.label}: ${ctx.parsed.y?.toFixed(2)}`, log ? "logarithmic" : "linear");
  }, [view]);
  const legend: LegendItem[] = [
    { label: "Hotelling T² (daily residual vector of all modes)", colour: TREND.ewma, kind: "line" },
    { label: `UCL${view.t2Ucl !== null ? ` = ${view.t2Ucl.toFixed(2)}` : ""}`, colour: TREND.limit, kind: "dash" },
    { label: "Above the UCL", colour: TREND.beyond, kind: "dot" },
    ...(view.alertTimesMs.length > 0 ? [{ label: "Alert raised", colour: TREND.alert, kind: "dash" as const }] : []),
  ];
  return (
    <ChartCard title="Hotelling T² chart" legend={legend} csvHref={csv(csvBase, "t2")} testId="chart-t2" className="lg:col-span-2"
      note="T² combines the daily residuals of every tracked mode; its UCL is the Phase II limit of the training days (α = 0.0027).">
      <Scatter data={data} options={options} plugins={plugins} role="img" aria-label="Hotelling T² chart" />
    </ChartCard>
  );
}

/** The four charts of one tracked mode. */
export function ModeTrends({ mode, view, csvBase, tRange }: { mode: TrendMode; view: TrendsView; csvBase: string; tRange: [number, number] }) {
  return (
    <div className="grid grid-cols-1 gap-3 lg:grid-cols-2">
      <FrequencyTimeChart mode={mode} view={view} csvBase={csvBase} tRange={tRange} />
      <FrequencyTemperatureChart mode={mode} view={view} csvBase={csvBase} />
      <EwmaChart mode={mode} view={view} csvBase={csvBase} />
      <DampingChart mode={mode} view={view} csvBase={csvBase} />
    </div>
  );
}
