/**
 * Parser of the modal history CSV (issue 5 §1): header `timestamp,mode,frequencyHz,dampingRatio,temperatureC`,
 * one row per mode estimate; ISO 8601 UTC times; `dampingRatio` (a fraction) and
 * `temperatureC` may be empty. Every bad row is reported with its line number and reason.
 */
export const HISTORY_HEADER = ["timestamp", "mode", "frequencyHz", "dampingRatio", "temperatureC"] as const;
/** Largest number of data rows in one file. */
export const HISTORY_MAX_ROWS = 200_000;

export interface HistoryRow { line: number; at: Date; mode: string; frequencyHz: number; dampingRatio: number | null; temperatureC: number | null }
export interface HistoryRowError { line: number; reason: string }

// ISO 8601 date-time in UTC: a trailing Z or a zero offset.
const ISO_UTC = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,9})?)?(Z|[+-]00:?00)$/;

function optionalNumber(s: string): number | null | undefined {
  if (s === "") return null;
  const v = Number(s);
  return Number.isFinite(v) ? v : undefined;
}

/** Parse the whole file; rows are returned only when there are no errors. */
export function parseHistoryCsv(text: string): { rows: HistoryRow[]; errors: HistoryRowError[] } {
  const r = inspectHistoryCsv(text);
  return r.errors.length > 0 ? { rows: [], errors: r.errors } : r;
}

/** As {@link parseHistoryCsv} but the valid rows are returned even when other rows are bad (for a preview). */
export function inspectHistoryCsv(text: string): { rows: HistoryRow[]; errors: HistoryRowError[] } {
  const lines = text.replace(/^\uFEFF/, "").split(/\r?\n/);
  while (lines.length > 0 && lines[lines.length - 1].trim() === "") lines.pop();
  const errors: HistoryRowError[] = [];
  const header = (lines[0] ?? "").split(",").map((h) => h.trim());
  if (header.join(",") !== HISTORY_HEADER.join(",")) {
    return { rows: [], errors: [{ line: 1, reason: `the header must be ${HISTORY_HEADER.join(",")}` }] };
  }
  if (lines.length < 2) return { rows: [], errors: [{ line: 1, reason: "the file has no data rows" }] };
  if (lines.length - 1 > HISTORY_MAX_ROWS) return { rows: [], errors: [{ line: HISTORY_MAX_ROWS + 2, reason: `at most ${HISTORY_MAX_ROWS} rows per file` }] };
  const rows: HistoryRow[] = [];
  const seen = new Map<string, number>();
  for (let i = 1; i < lines.length; i++) {
    const line = i + 1;
    const cells = lines[i].split(",").map((c) => c.trim());
    const bad = (reason: string) => errors.push({ line, reason });
    if (cells.length !== HISTORY_HEADER.length) { bad(`expected ${HISTORY_HEADER.length} fields, got ${cells.length}`); continue; }
    const [ts, mode, f, d, t] = cells;
    const at = new Date(ts);
    if (!ISO_UTC.test(ts) || Number.isNaN(at.getTime())) { bad(`timestamp "${ts.slice(0, 40)}" is not an ISO 8601 UTC time`); continue; }
    if (mode.length < 1 || mode.length > 80) { bad("mode must be a label of 1 to 80 characters"); continue; }
    const freq = f === "" ? Number.NaN : Number(f);
    if (!Number.isFinite(freq) || freq <= 0) { bad(`frequencyHz "${f.slice(0, 40)}" must be a number > 0`); continue; }
    const damping = optionalNumber(d);
    if (damping === undefined || (damping !== null && (damping < 0 || damping >= 1))) { bad(`dampingRatio "${d.slice(0, 40)}" must be empty or a fraction in [0, 1)`); continue; }
    const temp = optionalNumber(t);
    if (temp === undefined || (temp !== null && (temp < -90 || temp > 90))) { bad(`temperatureC "${t.slice(0, 40)}" must be empty or a number in [−90, 90]`); continue; }
    const key = `${mode}\u0000${at.getTime()}`;
    const first = seen.get(key);
    if (first !== undefined) { bad(`mode ${mode} at ${ts} repeats line ${first}`); continue; }
    seen.set(key, line);
    rows.push({ line, at, mode, frequencyHz: freq, dampingRatio: damping, temperatureC: temp });
  }
  return { rows, errors };
}
