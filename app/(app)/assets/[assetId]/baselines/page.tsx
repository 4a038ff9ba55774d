import type { Metadata } from "next";
import { connection } from "next/server";
import { formatDate, formatDateTime } from "@/components/ui/format";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { can } from "@/lib/auth/permissions";
import type { Baseline, BaselineModeModel } from "@/lib/domain/drift";
import { getOrganisation } from "@/lib/services/accounts/profile.service";
import { listBaselineVersions } from "@/lib/services/drift/baseline.service";
import { orNotFound } from "../../../_lib/or-not-found";
import { pageActor } from "../../../_lib/page-actor";
import { FitBaselineForm } from "./_components/fit-form";

export const metadata: Metadata = { title: "Baselines" };

const DAY = 86_400_000;
/** Reference temperature of the comparison (the f(20 °C) the alert evidence also uses). */
const REF_C = 20;

const dayInput = (d: Date, tz: string) => new Intl.DateTimeFormat("en-CA", { timeZone: tz, year: "numeric", month: "2-digit", day: "2-digit" }).format(d);
const hz = (v: number, digits = 4) => `${v.toFixed(digits)} Hz`;
const mhz = (v: number) => `${(v * 1000).toFixed(2)} mHz`;
const at = (m: BaselineModeModel["model"], t: number) =>
  m.interceptHz + m.slopeHzPerC * t + (m.kind === "bilinear" && m.knotC !== null && m.coldSlopeHzPerC !== null ? (m.coldSlopeHzPerC - m.slopeHzPerC) * Math.min(t - m.knotC, 0) : 0);

function statusLabel(b: Baseline): string {
  return b.active ? `active · ${b.status}` : b.status;
}

/** Default training window of the form: the active one, else the last 365 days. */
function defaultWindow(active: Baseline | undefined, tz: string): { from: string; to: string } {
  if (active) return { from: dayInput(active.trainingFrom, tz), to: dayInput(new Date(active.trainingTo.getTime() - 1), tz) };
  const now = Date.now();
  return { from: dayInput(new Date(now - 365 * DAY), tz), to: dayInput(new Date(now), tz) };
}

function ModelTable({ b }: { b: Baseline }) {
  return (
    <Table>
      <thead>
        <tr>
          <Th>Mode</Th><Th>Model</Th><Th>Coefficients</Th><Th className="text-right">Residual s</Th>
          <Th className="text-right">Temperature envelope</Th><Th className="text-right">Points</Th>
        </tr>
      </thead>
      <tbody>
        {b.models.map(({ trackedModeId, label, model: m }) => (
          <tr key={trackedModeId}>
            <Td>{label}</Td>
            <Td>{m.kind}{m.kind === "bilinear" && m.knotC !== null ? `, knot ${m.knotC.toFixed(1)} °C` : ""}{m.lagHours !== null ? `, ${m.lagHours} h lag` : ""}</Td>
            <Td className="font-mono text-xs">
              a = {m.interceptHz.toFixed(4)} Hz, b = {(m.slopeHzPerC * 1000).toFixed(3)} mHz/°C
              {m.coldSlopeHzPerC !== null ? `, b(cold) = ${(m.coldSlopeHzPerC * 1000).toFixed(3)} mHz/°C` : ""}
            </Td>
            <Td className="text-right tabular-nums">{mhz(m.residualStdHz)}</Td>
            <Td className="text-right tabular-nums">{m.envelope.temperatureC[0].toFixed(1)} … {m.envelope.temperatureC[1].toFixed(1)} °C</Td>
            <Td className="text-right tabular-nums">{m.n}</Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

/** Active against the previous version, per mode: f(20 °C), slope, spread, envelope. */
function Comparison({ active, previous }: { active: Baseline; previous: Baseline }) {
  const labels = [...new Set([...active.models.map((m) => m.label), ...previous.models.map((m) => m.label)])];
  return (
    <Table>
      <thead>
        <tr>
          <Th>Mode</Th>
          <Th className="text-right">f({REF_C} °C) v{previous.version}</Th>
          <Th className="text-right">f({REF_C} °C) v{active.version}</Th>
          <Th className="text-right">Change</Th>
          <Th className="text-right">Residual s v{previous.version} → v{active.version}</Th>
          <Th className="text-right">Envelope v{previous.version} → v{active.version}</Th>
        </tr>
      </thead>
      <tbody data-testid="baseline-comparison">
        {labels.map((label) => {
          const a = active.models.find((m) => m.label === label)?.model;
          const p = previous.models.find((m) => m.label === label)?.model;
          const fa = a ? at(a, REF_C) : null;
          const fp = p ? at(p, REF_C) : null;
          return (
            <tr key={label}>
              <Td>{label}</Td>
              <Td className="text-right tabular-nums">{fp !== null ? hz(fp) : "—"}</Td>
              <Td className="text-right tabular-nums">{fa !== null ? hz(fa) : "—"}</Td>
              <Td className="text-right tabular-nums">{fa !== null && fp !== null ? `${((100 * (fa - fp)) / fp).toFixed(2)} %` : "—"}</Td>
              <Td className="text-right tabular-nums">{p ? mhz(p.residualStdHz) : "—"} → {a ? mhz(a.residualStdHz) : "—"}</Td>
              <Td className="text-right tabular-nums">
                {p ? `${p.envelope.temperatureC[0].toFixed(0)}…${p.envelope.temperatureC[1].toFixed(0)}` : "—"} →{" "}
                {a ? `${a.envelope.temperatureC[0].toFixed(0)}…${a.envelope.temperatureC[1].toFixed(0)} °C` : "—"}
              </Td>
            </tr>
          );
        })}
      </tbody>
    </Table>
  );
}

/**
 * Asset › Baselines (issue 5 §2): the versions of the frequency–temperature baseline (active,
 * provisional, superseded) with their training windows and per-mode models, the active one
 * compared with the previous, and for engineers a form to fit and activate a new one.
 */
export default async function BaselinesPage({ params }: { params: Promise<{ assetId: string }> }) {
  await connection();
  const { assetId } = await params;
  const actor = await pageActor();
  const [versions, org] = await Promise.all([orNotFound(listBaselineVersions(actor, assetId)), getOrganisation(actor)]);
  const tz = org.timeZone;
  const active = versions.find((b) => b.active);
  const previous = active ? versions.find((b) => b.version < active.version) : undefined;
  const window = defaultWindow(active, tz);

  return (
    <div className="space-y-4">
      <Panel title="Baseline versions" actions={<span className="text-xs text-muted">Times in {tz}</span>} bodyClassName="p-0">
        {versions.length === 0 ? (
          <div className="p-4"><Notice>No baseline yet: the asset stays in commissioning until one is fitted.</Notice></div>
        ) : (
          <Table>
            <thead>
              <tr>
                <Th>Version</Th><Th>Status</Th><Th>Training window</Th><Th>Model choice</Th><Th>Modes</Th><Th>Fitted</Th>
              </tr>
            </thead>
            <tbody data-testid="baseline-versions">
              {versions.map((b) => (
                <tr key={b.id} className={b.active ? "bg-accent-soft/40" : undefined}>
                  <Td className="font-medium">v{b.version}</Td>
                  <Td>{statusLabel(b)}</Td>
                  <Td>{formatDate(b.trainingFrom, tz)} – {formatDate(new Date(b.trainingTo.getTime() - 1), tz)}</Td>
                  <Td>{b.requestedModel}</Td>
                  <Td>{b.models.map((m) => `${m.label}: ${m.model.kind}`).join(", ")}</Td>
                  <Td>{b.createdByName ?? "System"}, {formatDateTime(b.createdAt, tz)}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
        )}
      </Panel>

      {active ? (
        <Panel title={`Active baseline v${active.version} (${active.status})`}>
          {active.status === "provisional" ? (
            <Notice className="mb-3">Provisional: the training window covers less than a full year of seasons, so temperatures of the missing seasons may fall outside its envelope (“out of envelope, no decision”).</Notice>
          ) : null}
          <ModelTable b={active} />
        </Panel>
      ) : null}

      {active && previous ? (
        <Panel title={`Active v${active.version} compared with v${previous.version}`}>
          <Comparison active={active} previous={previous} />
        </Panel>
      ) : null}

      {versions.filter((b) => !b.active).map((b) => (
        <details key={b.id} className="rounded-lg border border-line bg-surface">
          <summary className="cursor-pointer px-4 py-2.5 text-sm font-medium">v{b.version} ({b.status}) · {formatDate(b.trainingFrom, tz)} – {formatDate(new Date(b.trainingTo.getTime() - 1), tz)}</summary>
          <div className="p-4 pt-0"><ModelTable b={b} /></div>
        </details>
      ))}

      {can(actor.role, "baseline:write") ? (
        <Panel title="Fit a new baseline">
          <FitBaselineForm assetId={assetId} defaultFrom={window.from} defaultTo={window.to} />
        </Panel>
      ) : null}
    </div>
  );
}
