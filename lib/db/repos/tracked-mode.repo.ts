import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";
import { toTrackedMode, type TrackedModeRow } from "@/lib/db/rows-records";
import type { TrackedMode } from "@/lib/domain/records";

const COLS = [
  "id", "asset_id", "label", "nominal_frequency_hz", "band_low_hz", "band_high_hz", "reference_shape", "created_at", "updated_at",
] as const;

export type TrackedModeWrite = Pick<TrackedMode, "label" | "nominalFrequencyHz" | "bandLowHz" | "bandHighHz" | "referenceShape">;

/** Tracked modes of an asset, ascending in nominal frequency. */
export async function listTrackedModesOfAsset(db: Db, assetId: string): Promise<TrackedMode[]> {
  const rows = await withDbErrors(() =>
    db<TrackedModeRow>("tracked_modes").select(...COLS).where({ asset_id: assetId })
      .orderBy([{ column: "nominal_frequency_hz" }, { column: "id" }]),
  );
  return rows.map(toTrackedMode);
}

export async function insertTrackedMode(db: Db, assetId: string, m: TrackedModeWrite): Promise<TrackedMode> {
  const [row] = await withDbErrors(() =>
    db("tracked_modes")
      .insert({
        asset_id: assetId, label: m.label, nominal_frequency_hz: m.nominalFrequencyHz, band_low_hz: m.bandLowHz,
        band_high_hz: m.bandHighHz, reference_shape: m.referenceShape === null ? null : JSON.stringify(m.referenceShape),
      })
      .returning(COLS),
  );
  return toTrackedMode(row as TrackedModeRow);
}
