import type { Metadata } from "next";
import Link from "next/link";
import { connection } from "next/server";
import { ConditionBadge } from "@/components/condition/condition-badge";
import { zonedDayStart } from "@/components/records/zoned-day";
import { ModeTrends, T2Chart } from "@/components/trends/trend-charts";
import { toTrendMode } from "@/components/trends/shape";
import type { TrendsView } from "@/components/trends/types";
import { formatDate, formatDateTime } from "@/components/ui/format";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { getOrganisation } from "@/lib/services/accounts/profile.service";
import { getDriftView } from "@/lib/services/drift/drift-view.service";
import { orNotFound } from "../../../_lib/or-not-found";
import { pageActor } from "../../../_lib/page-actor";
import { RangePicker, RANGES, type RangeKey } from "./_components/range-picker";

export const metadata: Metadata = { title: "Trends" };

type Search = Record<string, string | string[] | undefined>;
const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v) || undefined;
const DAY = 86_400_000;

const STATE_LABELS: Record<string, string> = {
  open: "open", acknowledged: "acknowledged", inspection_scheduled: "inspection scheduled", closed: "closed",
};

/** The range asked in the URL: a preset counted back from now, or custom organisation days. */
function resolveRange(sp: Search, tz: string) {
  const nowMs = Date.now();
  const asked = one(sp.range);
  const current: RangeKey = asked === "custom" || RANGES.some((r) => r.key === asked) ? (asked as RangeKey) : "1y";
  let from: Date | undefined;
  let to: Date | undefined;
  let rangeError: string | undefined;
  const fromDay = one(sp.from);
  const toDay = one(sp.to);
  if (current === "custom") {
    from = fromDay ? zonedDayStart(fromDay, tz) ?? undefined : undefined;
    to = toDay ? zonedDayStart(toDay, tz, 1) ?? undefined : undefined;
    if ((fromDay && !from) || (toDay && !to)) rangeError = "Use days such as 2026-03-01.";
    else if (from && to && from >= to) rangeError = "The last day must not be before the first.";
    if (rangeError) { from = undefined; to = undefined; }
  } else {
    const days = RANGES.find((r) => r.key === current)?.days ?? null;
    if (days !== null) from = new Date(nowMs - days * DAY);
  }
  return { nowMs, current, from, to, fromDay, toDay, rangeError };
}

/**
 * Asset › Trends (issue 5 screens): per tracked mode the temperature-compensated frequency
 * trend, frequency against temperature, the EWMA control chart and the damping trend; the
 * Hotelling T² chart; the smallest detectable shift per mode. Data from getDriftView (a pure
 * replay of the drift statistics, thinned on the server for long ranges).
 */
export default async function TrendsPage({ params, searchParams }: { params: Promise<{ assetId: string }>; searchParams: Promise<Search> }) {
  await connection();
  const [{ assetId }, sp] = await Promise.all([params, searchParams]);
  const actor = await pageActor();
  const tz = (await getOrganisation(actor)).timeZone;
  const { nowMs, current, from, to, fromDay, toDay, rangeError } = resolveRange(sp, tz);

  const view = await orNotFound(getDriftView(actor, assetId, { from, to }, { nowMs }));
  const firstMs = Math.min(...view.modes.flatMap((m) => (m.points.length ? [m.points[0].atMs] : [])), view.baseline?.trainingFrom.getTime() ?? nowMs);
  const xMinMs = from ? from.getTime() : firstMs;
  const xMaxMs = to ? Math.min(to.getTime(), nowMs) : nowMs;
  const trends: TrendsView = {
    modes: view.modes.map(toTrendMode),
    t2: view.t2.map((d) => ({ ...d, t2: Number(d.t2.toFixed(4)) })),
    t2Ucl: view.t2Ucl,
    alertTimesMs: [...new Set([...view.alerts.map((a) => a.raisedAtMs), ...view.raisedAtMs])].sort((a, b) => a - b),
    training: view.baseline ? { fromMs: view.baseline.trainingFrom.getTime(), toMs: view.baseline.trainingTo.getTime() } : null,
    xMinMs,
    xMaxMs,
    timeZone: tz,
  };
  const temps = view.modes.flatMap((m) => m.points.flatMap((p) => (p.temperatureC === null ? [] : [p.temperatureC])));
  const tRange: [number, number] = temps.length ? [Math.min(...temps), Math.max(...temps)] : [0, 20];
  const q = new URLSearchParams();
  if (from) q.set("from", from.toISOString());
  if (to) q.set("to", to.toISOString());
  const csvBase = `/api/v1/assets/${assetId}/trends.csv${q.size ? `?${q.toString()}` : ""}`;
  const basePath = `/assets/${assetId}/trends`;
  const pointCount = view.modes.reduce((a, m) => a + m.points.length, 0);

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <RangePicker basePath={basePath} current={current} from={fromDay} to={toDay} error={rangeError} />
        <span className="text-xs text-muted">
          {formatDate(new Date(xMinMs), tz)} – {formatDate(new Date(xMaxMs), tz)} · times in {tz}
        </span>
      </div>

      <Panel title="Drift summary" actions={<ConditionBadge condition={view.condition} />}>
        {view.skipped ? (
          <Notice className="mb-3">
            No drift statistics: {view.skipped}.{" "}
            {view.baseline ? null : <Link className="underline" href={`/assets/${assetId}/baselines`}>Fit a baseline</Link>}
          </Notice>
        ) : null}
        <dl className="mb-3 grid grid-cols-1 gap-x-6 gap-y-1 text-sm sm:grid-cols-3">
          <div>
            <dt className="text-xs uppercase tracking-wide text-muted">Baseline</dt>
            <dd>
              {view.baseline ? (
                <Link className="text-accent hover:underline" href={`/assets/${assetId}/baselines`}>
                  Version {view.baseline.version} ({view.baseline.status}), trained {formatDate(view.baseline.trainingFrom, tz)} – {formatDate(view.baseline.trainingTo, tz)}
                </Link>
              ) : "None yet"}
            </dd>
          </div>
          <div>
            <dt className="text-xs uppercase tracking-wide text-muted">Alerts</dt>
            <dd>
              {view.alerts.length === 0 ? "None" : (
                <ul>
                  {view.alerts.slice(0, 5).map((a) => (
                    <li key={a.id}>
                      <Link className="text-accent hover:underline" href={`/alerts/${a.id}`}>Raised {formatDateTime(new Date(a.raisedAtMs), tz)}</Link>{" "}
                      <span className="text-muted">({STATE_LABELS[a.state] ?? a.state})</span>
                    </li>
                  ))}
                </ul>
              )}
            </dd>
          </div>
          <div>
            <dt className="text-xs uppercase tracking-wide text-muted">Shown</dt>
            <dd>{pointCount} points{view.downsampled ? " (thinned for display; the CSV has every point)" : ""}</dd>
          </div>
        </dl>
        <Table>
          <thead>
            <tr>
              <Th>Mode</Th>
              <Th className="text-right">Nominal</Th>
              <Th className="text-right">Smallest detectable shift</Th>
              <Th className="text-right">Latest</Th>
              <Th className="text-right">Latest residual</Th>
            </tr>
          </thead>
          <tbody data-testid="minimal-shift">
            {view.modes.map((m) => (
              <tr key={m.trackedModeId}>
                <Td><a href={`#mode-${m.trackedModeId}`} className="text-accent hover:underline">{m.label}</a></Td>
                <Td className="text-right tabular-nums">{Number.isFinite(m.nominalHz) ? `${m.nominalHz.toFixed(3)} Hz` : "—"}</Td>
                <Td className="text-right tabular-nums">
                  {m.minimalShift ? `${(m.minimalShift.shiftHz * 1000).toFixed(2)} mHz (${m.minimalShift.shiftPct.toFixed(2)} %)` : "—"}
                </Td>
                <Td className="text-right tabular-nums">{m.latest ? `${m.latest.frequencyHz.toFixed(3)} Hz` : "—"}</Td>
                <Td className="text-right tabular-nums">
                  {m.latest?.residualHz != null ? `${(m.latest.residualHz * 1000).toFixed(2)} mHz${m.latest.residualPct !== null ? ` (${m.latest.residualPct.toFixed(2)} %)` : ""}` : "—"}
                </Td>
              </tr>
            ))}
          </tbody>
        </Table>
        <p className="mt-2 text-xs text-muted">
          Smallest detectable shift: the sustained frequency change the EWMA chart signals about half the time once settled
          (L·σ·√(λ/(2−λ)), λ = 0.1, L = 2.814); larger changes are caught sooner. These figures are trend data, not an
          engineering assessment: a change should be judged by a licensed structural engineer.
        </p>
      </Panel>

      {view.t2Ucl !== null ? (
        <div className="grid grid-cols-1 gap-3 lg:grid-cols-2">
          <T2Chart view={trends} csvBase={csvBase} />
        </div>
      ) : null}

      {view.modes.length === 0 ? (
        <Notice>No tracked modes yet: track a mode from a record, or import a modal history.</Notice>
      ) : view.modes.map((m, j) => (
        <Panel key={m.trackedModeId} title={<span id={`mode-${m.trackedModeId}`}>{m.label} · {Number.isFinite(m.nominalHz) ? `${m.nominalHz.toFixed(3)} Hz` : ""}</span>}>
          <ModeTrends mode={trends.modes[j]} view={trends} csvBase={csvBase} tRange={tRange} />
        </Panel>
      ))}
    </div>
  );
}
