/**
 * The rows of the report's engineering tables as text, shared by the PDF and the print page:
 * the modal table, the baseline fit, the alerts and the data availability.
 */
import type { AssetReport } from "./report-data";
import { formatDay, OUTCOME_WORDS, STATE_WORDS } from "./summary";

const num = (v: number | null, d: number, unit = "") => (v === null || !Number.isFinite(v) ? "-" : `${v.toFixed(d)}${unit}`);
const signed = (v: number | null, d: number, unit = "") => (v === null || !Number.isFinite(v) ? "-" : `${v >= 0 ? "+" : "-"}${Math.abs(v).toFixed(d)}${unit}`);

export const MODAL_COLUMNS = [
  "Mode", "Nominal (Hz)", "Latest (Hz)", "Median (Hz)", "Median damping", "Identified", "Sustained change (EWMA)", "Smallest detectable change",
] as const;

export function modalRows(r: AssetReport): string[][] {
  return r.modes.map((m) => [
    m.label,
    num(m.nominalHz, 3),
    num(m.latestHz, 3),
    num(m.medianHz, 3),
    m.medianDampingRatio === null ? "-" : `${(m.medianDampingRatio * 100).toFixed(2)} %`,
    m.identificationRate === null ? "-" : `${Math.round(m.identificationRate * 100)} % (${m.identified}/${m.accepted})`,
    signed(m.sustainedChangePct, 2, " %"),
    m.minimalShift ? `${m.minimalShift.shiftHz.toFixed(4)} Hz (${m.minimalShift.shiftPct.toFixed(2)} %)` : "-",
  ]);
}

export const FIT_COLUMNS = ["Mode", "Model", "Temperature slope", "Residual std", "Training points", "Temperature range"] as const;

export function fitRows(r: AssetReport): string[][] {
  return r.modes.filter((m) => m.fit).map((m) => {
    const f = m.fit!;
    return [
      m.label, f.kind, `${signed(f.slopeHzPerC * 1000, 2)} mHz/°C`, `${(f.residualStdHz * 1000).toFixed(2)} mHz`, String(f.n),
      `${f.temperatureRangeC[0].toFixed(1)} to ${f.temperatureRangeC[1].toFixed(1)} °C`,
    ];
  });
}

export const ALERT_COLUMNS = ["Raised", "Rule", "Modes", "State", "Outcome", "Findings"] as const;

export function alertRows(r: AssetReport): string[][] {
  return r.alerts.map((a) => [
    formatDay(a.raisedAtMs), a.rule ?? "-", a.modesBeyond.join(", ") || "-",
    a.state === "inspection_scheduled" && a.inspectionAtMs !== null ? `inspection scheduled ${formatDay(a.inspectionAtMs)}` : STATE_WORDS[a.state],
    a.outcome ? `${OUTCOME_WORDS[a.outcome]}${a.closedAtMs !== null ? ` (${formatDay(a.closedAtMs)})` : ""}` : "-",
    a.findings ?? "-",
  ]);
}

/** Label/value pairs of the data availability. */
export function availabilityRows(r: AssetReport): [string, string][] {
  const a = r.availability;
  return [
    ["Expected records (one every " + r.asset.expectedIntervalMin + " min)", String(a.expected)],
    ["Accepted records and imported rows", `${a.accepted} (${a.fromRecords} from gateway records)`],
    ["Rejected by the quality check", String(a.rejected)],
    ["Coverage", a.coverage === null ? "-" : `${Math.round(a.coverage * 100)} %`],
    ["Longest gap without an accepted record", a.longestGapH === null ? "-" : `${a.longestGapH.toFixed(1)} h`],
  ];
}

export function baselineLine(r: AssetReport): string {
  if (!r.baseline) return "No baseline has been fitted yet: the asset is commissioning, so no drift is judged.";
  const b = r.baseline;
  return `Baseline version ${b.version} (${b.status}), fitted on ${formatDay(b.trainingFromMs)} to ${formatDay(b.trainingToMs)}: `
    + "frequency against temperature per tracked mode; residuals are measured minus predicted frequency.";
}
