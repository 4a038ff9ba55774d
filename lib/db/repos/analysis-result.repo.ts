import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";
import {
  toAnalysisResult, toModeAssignment, toStoredMode, type AnalysisResultRow, type IdentifiedModeRow, type ModeAssignmentRow,
} from "@/lib/db/rows-records";
import type { AnalysisResult, ModeAssignment, StoredMode } from "@/lib/domain/records";

const RESULT_COLS = [
  "id", "record_id", "settings_version", "verdict", "quality", "channels_used", "spectral", "singular_values", "warnings",
  "timings_ms", "engine_version", "extras", "analysed_at",
] as const;
const MODE_COLS = [
  "id", "result_id", "mode_index", "frequency_hz", "damping_ratio", "damping_method", "damping_reliable", "mpc", "shape",
  "shape_complex", "estimates", "possibly_coupled",
] as const;
const ASSIGNMENT_COLS = ["id", "result_id", "tracked_mode_id", "identified_mode_id", "mac", "frequency_deviation", "cost"] as const;

export type ResultWrite = Omit<AnalysisResult, "id" | "analysedAt">;
export type ModeWrite = Omit<StoredMode, "id" | "resultId">;
/** `modeIndex` refers to a ModeWrite of the same call (null: not identified). */
export interface AssignmentWrite { trackedModeId: string; modeIndex: number | null; mac: number | null; frequencyDeviation: number | null; cost: number | null }

/**
 * Store one analysis as an upsert keyed by (record, settings version): the result row is
 * updated in place (its id kept), its modes and assignments replaced. Call inside a
 * transaction so a retry never sees half a result.
 */
export async function upsertAnalysisResult(
  db: Db, r: ResultWrite, modes: ModeWrite[], assignments: AssignmentWrite[],
): Promise<{ result: AnalysisResult; modes: StoredMode[]; assignments: ModeAssignment[] }> {
  const values = {
    record_id: r.recordId, settings_version: r.settingsVersion, verdict: r.verdict, quality: JSON.stringify(r.quality),
    channels_used: r.channelsUsed, spectral: JSON.stringify(r.spectral), singular_values: JSON.stringify(r.singularValues),
    warnings: JSON.stringify(r.warnings), timings_ms: JSON.stringify(r.timingsMs), engine_version: r.engineVersion,
    extras: r.extras === null ? null : JSON.stringify(r.extras), analysed_at: db.fn.now(),
  };
  const [row] = await withDbErrors(() =>
    db("analysis_results").insert(values).onConflict(["record_id", "settings_version"]).merge().returning(RESULT_COLS),
  );
  const result = toAnalysisResult(row as AnalysisResultRow);
  await withDbErrors(() => db("identified_modes").where({ result_id: result.id }).delete());
  const modeRows = modes.length === 0 ? [] : await withDbErrors(() =>
    db("identified_modes")
      .insert(modes.map((m) => ({
        result_id: result.id, mode_index: m.modeIndex, frequency_hz: m.frequencyHz, damping_ratio: m.dampingRatio,
        damping_method: m.dampingMethod, damping_reliable: m.dampingReliable, mpc: m.mpc, shape: JSON.stringify(m.shape),
        shape_complex: JSON.stringify(m.shapeComplex), estimates: JSON.stringify(m.estimates), possibly_coupled: m.possiblyCoupled,
      })))
      .returning(MODE_COLS),
  );
  const stored = (modeRows as IdentifiedModeRow[]).map(toStoredMode).sort((a, b) => a.modeIndex - b.modeIndex);
  const idByIndex = new Map(stored.map((m) => [m.modeIndex, m.id]));
  await withDbErrors(() => db("mode_assignments").where({ result_id: result.id }).delete());
  const assignmentRows = assignments.length === 0 ? [] : await withDbErrors(() =>
    db("mode_assignments")
      .insert(assignments.map((a) => ({
        result_id: result.id, tracked_mode_id: a.trackedModeId,
        identified_mode_id: a.modeIndex === null ? null : idByIndex.get(a.modeIndex) ?? null,
        mac: a.mac, frequency_deviation: a.frequencyDeviation, cost: a.cost,
      })))
      .returning(ASSIGNMENT_COLS),
  );
  return { result, modes: stored, assignments: (assignmentRows as ModeAssignmentRow[]).map(toModeAssignment) };
}

/** Results of a record, newest settings version first. */
export async function listResultsOfRecord(db: Db, recordId: string): Promise<AnalysisResult[]> {
  const rows = await withDbErrors(() =>
    db<AnalysisResultRow>("analysis_results").select(...RESULT_COLS).where({ record_id: recordId }).orderBy("settings_version", "desc"),
  );
  return rows.map(toAnalysisResult);
}

export async function findResult(db: Db, recordId: string, settingsVersion: number): Promise<AnalysisResult | null> {
  const row = await withDbErrors(() =>
    db<AnalysisResultRow>("analysis_results").select(...RESULT_COLS).where({ record_id: recordId, settings_version: settingsVersion }).first(),
  );
  return row ? toAnalysisResult(row) : null;
}

export async function listModesOfResult(db: Db, resultId: string): Promise<StoredMode[]> {
  const rows = await withDbErrors(() =>
    db<IdentifiedModeRow>("identified_modes").select(...MODE_COLS).where({ result_id: resultId }).orderBy("mode_index"),
  );
  return rows.map(toStoredMode);
}

export async function listAssignmentsOfResult(db: Db, resultId: string): Promise<ModeAssignment[]> {
  const rows = await withDbErrors(() =>
    db<ModeAssignmentRow>("mode_assignments").select(...ASSIGNMENT_COLS).where({ result_id: resultId }),
  );
  return rows.map(toModeAssignment);
}
