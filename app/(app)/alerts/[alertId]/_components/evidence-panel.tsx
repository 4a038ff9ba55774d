import Link from "next/link";
import type { EvidenceView } from "@/lib/services/alerts/evidence";
import { formatDate, formatDateTime } from "@/components/ui/format";
import { Table, Td, Th } from "@/components/ui/table";
import { cx } from "@/components/ui/cx";

export interface EvidenceRecordLink { id: string; startedAt: string; status: string; verdict: string | null }

const hz = (v: number) => `${v >= 0 ? "+" : "−"}${Math.abs(v).toFixed(4)}`;
const pct = (p: number | null) => (p === null ? "" : ` (${p >= 0 ? "+" : "−"}${Math.abs(p).toFixed(2)} %)`);

/** The snapshot taken when the alert was raised: modes with residuals and limits, statistics, quality, records. */
export function EvidencePanel({ evidence, records, assetId, timeZone }: {
  evidence: EvidenceView; records: EvidenceRecordLink[]; assetId: string; timeZone: string;
}) {
  const e = evidence;
  return (
    <div className="space-y-4 text-sm" data-testid="alert-evidence">
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
        <dt className="text-muted">Rule</dt><dd>{e.rule}</dd>
        <dt className="text-muted">Baseline</dt><dd>{e.baselineVersion === null ? "—" : `version ${e.baselineVersion}`}</dd>
        <dt className="text-muted">Window</dt>
        <dd>{e.windowStartMs !== null && e.pointTimeMs !== null ? `${formatDate(new Date(e.windowStartMs), timeZone)} – ${formatDate(new Date(e.pointTimeMs), timeZone)} (${e.windowPoints} daily points)` : "—"}</dd>
        <dt className="text-muted">Data quality</dt>
        <dd data-testid="evidence-quality">
          {e.qualityPassed === null ? "—" : e.qualityPassed ? "Records of the day passed the quality screen" : "Records of the day failed the quality screen"}
          {e.outOfEnvelope ? "; temperature outside the baseline's training range" : ""}
        </dd>
      </dl>
      {e.modes.length > 0 ? (
        <>
          {/* Phone: one card per mode; wider screens: one table. */}
          <ul className="space-y-2 md:hidden">
            {e.modes.map((m) => (
              <li key={m.modeId} data-evidence-mode={m.label} className={cx("rounded-md border px-3 py-2", m.beyond ? "border-red-700/30 bg-red-50" : "border-line")}>
                <div className="font-medium">{m.label}{m.beyond ? <span className="ml-1.5 text-xs text-danger">beyond</span> : null}</div>
                <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 text-xs tabular-nums">
                  <dt className="text-muted">Residual</dt><dd>{hz(m.residualHz)} Hz{pct(m.residualPct)}</dd>
                  <dt className="text-muted">Limits</dt><dd>{hz(m.residualLcl)} … {hz(m.residualUcl)} Hz</dd>
                  <dt className="text-muted">EWMA</dt><dd>{hz(m.ewma)} Hz (limits {hz(m.ewmaLcl)} … {hz(m.ewmaUcl)})</dd>
                </dl>
              </li>
            ))}
          </ul>
          <Table className="hidden md:block">
            <thead>
              <tr><Th>Mode</Th><Th className="text-right">Residual, Hz</Th><Th className="text-right">Limits, Hz</Th><Th className="text-right">EWMA, Hz</Th><Th className="text-right">EWMA limits, Hz</Th></tr>
            </thead>
            <tbody>
              {e.modes.map((m) => (
                <tr key={m.modeId} className={cx(m.beyond && "bg-red-50")}>
                  <Td className="whitespace-nowrap font-medium">{m.label}{m.beyond ? <span className="ml-1.5 text-xs text-danger">beyond</span> : null}</Td>
                  <Td className="text-right tabular-nums whitespace-nowrap">{hz(m.residualHz)}{pct(m.residualPct)}</Td>
                  <Td className="text-right tabular-nums whitespace-nowrap">{hz(m.residualLcl)} … {hz(m.residualUcl)}</Td>
                  <Td className="text-right tabular-nums">{hz(m.ewma)}</Td>
                  <Td className="text-right tabular-nums whitespace-nowrap">{hz(m.ewmaLcl)} … {hz(m.ewmaUcl)}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
        </>
      ) : <p className="text-muted">The snapshot holds no mode values.</p>}
      {e.t2 ? (
        <p>Hotelling T² of all tracked modes: <strong className="tabular-nums">{e.t2.value.toFixed(2)}</strong> (limit {e.t2.ucl.toFixed(2)}){e.t2.beyond ? <span className="ml-1 text-danger">beyond</span> : null}</p>
      ) : null}
      <div>
        <h3 className="mb-1 text-xs font-medium uppercase tracking-wide text-muted">Records of the window</h3>
        {records.length === 0 ? <p className="text-muted">No record in the window.</p> : (
          <ul className="divide-y divide-line/70" data-testid="evidence-records">
            {records.map((r) => (
              <li key={r.id} className="flex flex-wrap items-center justify-between gap-2 py-1.5">
                <Link href={`/assets/${assetId}/records/${r.id}`} className="text-accent underline-offset-2 hover:underline">{formatDateTime(r.startedAt, timeZone)}</Link>
                <span className="text-xs text-muted">{r.status}{r.verdict ? ` · quality ${r.verdict}` : ""}</span>
              </li>
            ))}
          </ul>
        )}
      </div>
    </div>
  );
}
