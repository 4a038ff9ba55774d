import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";
import { AppError, isAppError } from "@/lib/http/errors";
import { toTrackedMode, type TrackedModeRow } from "@/lib/db/rows-records";
import type { TrackedMode } from "@/lib/domain/records";

const COLS = [
  "id", "asset_id", "label", "nominal_frequency_hz", "band_low_hz", "band_high_hz", "reference_shape", "active",
  "source_record_id", "source_mode_index", "created_at", "updated_at",
] as const;

export type TrackedModeWrite = Pick<TrackedMode, "label" | "nominalFrequencyHz" | "bandLowHz" | "bandHighHz" | "referenceShape">
  & Partial<Pick<TrackedMode, "sourceRecordId" | "sourceModeIndex">>;

/** A used label is a field error of `label` (the unique key is (asset, label)). */
async function withLabelConflict<T>(fn: () => Promise<T>): Promise<T> {
  try {
    return await withDbErrors(fn);
  } catch (e) {
    if (isAppError(e) && e.code === "conflict" && e.details?.constraint === "tracked_modes_asset_label_unique") {
      const message = "Another tracked mode of this asset has this label.";
      throw new AppError("conflict", message, { details: e.details, fieldErrors: { label: [message] } });
    }
    throw e;
  }
}

export type TrackedModePatch = Partial<Pick<TrackedMode, "label" | "nominalFrequencyHz" | "bandLowHz" | "bandHighHz" | "referenceShape" | "active">>;

/**
 * Tracked modes of an asset, ascending in nominal frequency. By default only the active ones
 * (those new analyses assign); `{ includeInactive: true }` lists all.
 */
export async function listTrackedModesOfAsset(db: Db, assetId: string, opts: { includeInactive?: boolean } = {}): Promise<TrackedMode[]> {
  const rows = await withDbErrors(() => {
    const q = db<TrackedModeRow>("tracked_modes").select(...COLS).where({ asset_id: assetId });
    if (!opts.includeInactive) q.where({ active: true });
    return q.orderBy([{ column: "nominal_frequency_hz" }, { column: "id" }]);
  });
  return rows.map(toTrackedMode);
}

export async function findTrackedModeById(db: Db, id: string): Promise<TrackedMode | null> {
  const row = await withDbErrors(() => db<TrackedModeRow>("tracked_modes").select(...COLS).where({ id }).first());
  return row ? toTrackedMode(row) : null;
}

/** Insert a tracked mode; a label already used on the asset raises AppError('conflict'). */
export async function insertTrackedMode(db: Db, assetId: string, m: TrackedModeWrite): Promise<TrackedMode> {
  const [row] = await withLabelConflict(() =>
    db("tracked_modes")
      .insert({
        asset_id: assetId, label: m.label, nominal_frequency_hz: m.nominalFrequencyHz, band_low_hz: m.bandLowHz,
        band_high_hz: m.bandHighHz, reference_shape: m.referenceShape === null ? null : JSON.stringify(m.referenceShape),
        source_record_id: m.sourceRecordId ?? null, source_mode_index: m.sourceModeIndex ?? null,
      })
      .returning(COLS),
  );
  return toTrackedMode(row as TrackedModeRow);
}

/** Patch a tracked mode (bumps updated_at); returns null when it does not exist. */
export async function updateTrackedModeById(db: Db, id: string, p: TrackedModePatch): Promise<TrackedMode | null> {
  const update: Record<string, unknown> = { updated_at: db.fn.now() };
  if (p.label !== undefined) update.label = p.label;
  if (p.nominalFrequencyHz !== undefined) update.nominal_frequency_hz = p.nominalFrequencyHz;
  if (p.bandLowHz !== undefined) update.band_low_hz = p.bandLowHz;
  if (p.bandHighHz !== undefined) update.band_high_hz = p.bandHighHz;
  if (p.referenceShape !== undefined) update.reference_shape = p.referenceShape === null ? null : JSON.stringify(p.referenceShape);
  if (p.active !== undefined) update.active = p.active;
  const [row] = await withLabelConflict(() => db("tracked_modes").where({ id }).update(update).returning(COLS));
  return row ? toTrackedMode(row as TrackedModeRow) : null;
}

export interface IdentificationCount { trackedModeId: string; analysed: number; identified: number; lastIdentifiedAt: Date | null }

/**
 * Per tracked mode of the asset: in how many analysed records (their current result, i.e.
 * the settings version the record was last analysed with) it had an assignment row, and in
 * how many of those it was identified.
 */
export async function countIdentificationsOfAsset(db: Db, assetId: string): Promise<IdentificationCount[]> {
  const rows = await withDbErrors(() =>
    db("mode_assignments as ma")
      .join("analysis_results as ar", "ar.id", "ma.result_id")
      .join("records as r", "r.id", "ar.record_id")
      .where("r.asset_id", assetId)
      .where("r.status", "analysed")
      .whereRaw("ar.settings_version = r.analysed_settings_version")
      .groupBy("ma.tracked_mode_id")
      .select("ma.tracked_mode_id")
      .count<{ tracked_mode_id: string; analysed: string; identified: string; last_identified_at: Date | null }[]>({ analysed: "*" })
      .select(db.raw("count(ma.identified_mode_id) as identified"))
      .select(db.raw("max(case when ma.identified_mode_id is not null then r.started_at end) as last_identified_at")),
  );
  return rows.map((r) => ({
    trackedModeId: r.tracked_mode_id, analysed: Number(r.analysed), identified: Number(r.identified),
    lastIdentifiedAt: r.last_identified_at,
  }));
}
