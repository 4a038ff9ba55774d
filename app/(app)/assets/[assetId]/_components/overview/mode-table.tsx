import { cx } from "@/components/ui/cx";
import { formatDateTime } from "@/components/ui/format";
import { Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";

export interface ModeRow {
  number: number;
  label: string;
  nominalHz: number;
  latest: {
    atMs: number; frequencyHz: number; predictedHz: number | null; residualHz: number | null; residualPct: number | null;
    ewma: number | null; ewmaLimit: number | null;
  } | null;
  /** The mode's daily EWMA is beyond its limits on its latest day. */
  beyond: boolean;
  /** Identification rate over the availability window: identified / analysed (null: no analysis). */
  identified: number;
  analysed: number;
}

const signed = (x: number, digits: number) => `${x > 0 ? "+" : x < 0 ? "−" : ""}${Math.abs(x).toFixed(digits)}`;

/**
 * Each tracked mode's latest identified frequency beside the baseline's prediction at that
 * record's temperature: residual in Hz and %, and the EWMA of the daily residuals against its
 * control limit (± half-width); plus how often the mode was identified.
 */
export function ModeTable({
  rows, t2, timeZone, windowDays, hasBaseline,
}: {
  rows: ModeRow[]; t2: { t2: number; ucl: number; beyond: boolean } | null; timeZone: string; windowDays: number; hasBaseline: boolean;
}) {
  return (
    <Panel title="Tracked modes: latest value against the baseline" bodyClassName="p-0">
      <Table>
        <thead>
          <tr>
            <Th>Mode</Th>
            <Th>Latest record</Th>
            <Th className="text-right">Measured</Th>
            <Th className="text-right">Predicted</Th>
            <Th className="text-right">Residual</Th>
            <Th className="text-right">EWMA / limit</Th>
            <Th className="text-right" title={`Identified in the last ${windowDays} days`}>Identified ({windowDays} d)</Th>
          </tr>
        </thead>
        <tbody data-testid="mode-table">
          {rows.map((m) => {
            const l = m.latest;
            const rate = m.analysed > 0 ? m.identified / m.analysed : null;
            return (
              <tr key={m.number} data-mode-row={m.number} data-beyond={m.beyond ? "true" : "false"}>
                <Td>
                  <span className="font-medium">Mode {m.number}</span> <span className="text-muted">({m.label})</span>
                  <span className="block text-xs text-faint">nominal {m.nominalHz.toFixed(3)} Hz</span>
                </Td>
                <Td className="whitespace-nowrap text-muted">{l ? formatDateTime(new Date(l.atMs), timeZone) : "—"}</Td>
                <Td className="text-right tabular-nums">{l ? `${l.frequencyHz.toFixed(3)} Hz` : "—"}</Td>
                <Td className="text-right tabular-nums">{l?.predictedHz != null ? `${l.predictedHz.toFixed(3)} Hz` : "—"}</Td>
                <Td className="text-right tabular-nums whitespace-nowrap">
                  {l?.residualHz != null ? `${signed(l.residualHz, 3)} Hz` : "—"}
                  {l?.residualPct != null ? <span className="block text-xs text-muted">{signed(l.residualPct, 2)} %</span> : null}
                </Td>
                <Td className={cx("text-right tabular-nums whitespace-nowrap", m.beyond && "font-semibold text-danger")}>
                  {l?.ewma != null && l.ewmaLimit != null ? (
                    <>
                      {signed(l.ewma, 4)} / ±{l.ewmaLimit.toFixed(4)} Hz
                      <span className="block text-xs font-normal">{m.beyond ? "beyond the limit" : "within the limit"}</span>
                    </>
                  ) : "—"}
                </Td>
                <Td className="text-right tabular-nums">
                  {rate === null ? "—" : `${Math.round(100 * rate)} %`}
                  <span className="block text-xs text-muted">{m.identified} of {m.analysed}</span>
                </Td>
              </tr>
            );
          })}
          {rows.length === 0 ? (
            <tr><Td colSpan={7} className="py-6 text-center text-muted">No tracked mode yet.</Td></tr>
          ) : null}
        </tbody>
      </Table>
      <p className="border-t border-line px-4 py-2 text-xs text-muted" data-testid="t2-line">
        {!hasBaseline
          ? "Predictions and control statistics appear once a baseline is fitted."
          : t2
            ? <>All modes together: Hotelling T² {t2.t2.toFixed(1)} against its limit {t2.ucl.toFixed(1)} on the latest day ({t2.beyond ? <span className="font-semibold text-danger">beyond</span> : "within"}).</>
            : "Hotelling T² needs at least two modes with daily values."}
        {" "}Residual = measured − predicted at the record&apos;s temperature; EWMA of the daily mean residuals with its control limit.
      </p>
    </Panel>
  );
}
