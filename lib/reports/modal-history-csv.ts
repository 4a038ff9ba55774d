/**
 * The modal-history export: one CSV row per tracked mode identified in an accepted record or
 * imported row, and its data dictionary (each column's meaning, unit and source). Pure; the
 * dictionary renders as Markdown or CSV.
 */

export interface ModalHistoryRow {
  atMs: number;
  label: string;
  trackedModeId: string;
  frequencyHz: number;
  dampingRatio: number | null;
  temperatureC: number | null;
  predictedHz: number | null;
  residualHz: number | null;
  outOfEnvelope: boolean;
}

export interface DictionaryEntry { column: string; type: string; unit: string; description: string; source: string }

export const MODAL_HISTORY_DICTIONARY: readonly DictionaryEntry[] = [
  { column: "time_utc", type: "ISO 8601 timestamp", unit: "UTC", description: "Start of the record (or time of the imported row).", source: "records.started_at or modal_estimates.at" },
  { column: "mode_label", type: "text", unit: "", description: "Label of the tracked mode, as named by the engineer.", source: "tracked_modes.label" },
  { column: "tracked_mode_id", type: "uuid", unit: "", description: "Stable id of the tracked mode.", source: "tracked_modes.id" },
  { column: "frequency_hz", type: "number", unit: "Hz", description: "Natural frequency identified for this mode (FDD peak matched by MAC and frequency band).", source: "identified_modes.frequency_hz or modal_estimates.frequency_hz" },
  { column: "damping_ratio", type: "number (fraction)", unit: "1 (0.01 = 1 %)", description: "Damping ratio estimated by enhanced FDD or half-power bandwidth; empty when not estimated.", source: "identified_modes.damping_ratio or modal_estimates.damping_ratio" },
  { column: "temperature_c", type: "number", unit: "°C", description: "Structure or air temperature sent with the record.", source: "records.temperature_c or modal_estimates.temperature_c" },
  { column: "predicted_hz", type: "number", unit: "Hz", description: "Frequency the active baseline expects at this temperature; empty without a baseline.", source: "computed: baseline model (frequency against temperature)" },
  { column: "residual_hz", type: "number", unit: "Hz", description: "frequency_hz minus predicted_hz: the change left after temperature compensation.", source: "computed" },
  { column: "residual_pct", type: "number", unit: "%", description: "residual_hz as a percentage of predicted_hz.", source: "computed" },
  { column: "out_of_envelope", type: "true/false", unit: "", description: "true when the temperature lies outside the baseline's training range: no drift decision is made on this row.", source: "computed: baseline envelope" },
];

const iso = (ms: number) => new Date(ms).toISOString();
const num = (v: number | null) => (v === null || !Number.isFinite(v) ? "" : String(v));

/** RFC 4180 quoting for text cells (labels are user input). */
export function csvCell(s: string): string {
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** The CSV (header row, CRLF line ends per RFC 4180). */
export function modalHistoryCsv(rows: ModalHistoryRow[]): string {
  const lines = [MODAL_HISTORY_DICTIONARY.map((d) => d.column).join(",")];
  for (const r of rows) {
    const pct = r.residualHz !== null && r.predictedHz ? (100 * r.residualHz) / r.predictedHz : null;
    lines.push([
      iso(r.atMs), csvCell(r.label), r.trackedModeId, num(r.frequencyHz), num(r.dampingRatio), num(r.temperatureC),
      num(r.predictedHz), num(r.residualHz), num(pct), String(r.outOfEnvelope),
    ].join(","));
  }
  return lines.join("\r\n") + "\r\n";
}

/** The data dictionary as Markdown (a table) or CSV. */
export function dataDictionary(format: "md" | "csv"): string {
  const d = MODAL_HISTORY_DICTIONARY;
  if (format === "csv") {
    return ["column,type,unit,description,source", ...d.map((e) => [e.column, e.type, e.unit, e.description, e.source].map(csvCell).join(","))].join("\r\n") + "\r\n";
  }
  const esc = (s: string) => s.replace(/\|/g, "\\|");
  return [
    "# Modal history export: data dictionary",
    "",
    "File `modal-history.csv`: one row per tracked mode identified in an accepted record (data-quality screen passed) or an imported row, "
      + "in time order per mode. Comma-separated, UTF-8, header row, CRLF line ends (RFC 4180). Empty cell = no value.",
    "",
    "| column | type | unit | description | source |",
    "|---|---|---|---|---|",
    ...d.map((e) => `| ${e.column} | ${esc(e.type)} | ${esc(e.unit)} | ${esc(e.description)} | ${esc(e.source)} |`),
    "",
    "Frequencies and residuals are indications from vibration data; see the caution in the asset report.",
    "",
  ].join("\n");
}
