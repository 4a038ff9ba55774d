import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";
import type { ChannelResponseLevel } from "@/lib/signal/response-levels";
import type { AssetServiceabilitySettings, ServiceabilityOverride } from "@/lib/serviceability/types";

/* ---- overrides (organisation) ---- */

export async function listOverridesOfOrganisation(db: Db, organisationId: string): Promise<ServiceabilityOverride[]> {
  const rows = await withDbErrors(() =>
    db("serviceability_overrides").select("key", "value", "note", "updated_at").where({ organisation_id: organisationId }).orderBy("key"),
  ) as { key: string; value: number; note: string | null; updated_at: Date }[];
  return rows.map((r) => ({ key: r.key, value: r.value, note: r.note, updatedAt: r.updated_at }));
}

export async function upsertOverride(db: Db, organisationId: string, userId: string | null, o: { key: string; value: number; note: string | null }): Promise<void> {
  await withDbErrors(() =>
    db("serviceability_overrides")
      .insert({ organisation_id: organisationId, key: o.key, value: o.value, note: o.note, updated_by: userId })
      .onConflict(["organisation_id", "key"])
      .merge({ value: o.value, note: o.note, updated_by: userId, updated_at: db.fn.now() }),
  );
}

export async function deleteOverride(db: Db, organisationId: string, key: string): Promise<boolean> {
  return (await withDbErrors(() => db("serviceability_overrides").where({ organisation_id: organisationId, key }).delete())) > 0;
}

/* ---- per-asset settings ---- */

export async function findAssetServiceabilitySettings(db: Db, assetId: string): Promise<AssetServiceabilitySettings> {
  const row = await withDbErrors(() =>
    db("asset_serviceability_settings").select("section_width_m", "damping_guidance_key").where({ asset_id: assetId }).first(),
  ) as { section_width_m: number | null; damping_guidance_key: string | null } | undefined;
  return { assetId, sectionWidthM: row?.section_width_m ?? null, dampingGuidanceKey: row?.damping_guidance_key ?? null };
}

export async function upsertAssetServiceabilitySettings(db: Db, userId: string | null, s: AssetServiceabilitySettings): Promise<void> {
  const values = { section_width_m: s.sectionWidthM, damping_guidance_key: s.dampingGuidanceKey, updated_by: userId };
  await withDbErrors(() =>
    db("asset_serviceability_settings").insert({ asset_id: s.assetId, ...values }).onConflict("asset_id").merge({ ...values, updated_at: db.fn.now() }),
  );
}

/* ---- response levels (written by the analysis worker) ---- */

/** Store (or replace) the per-channel response levels of a record. */
export async function upsertResponseLevels(db: Db, recordId: string, levels: ChannelResponseLevel[]): Promise<void> {
  await withDbErrors(() =>
    db("record_response_levels").insert({ record_id: recordId, levels: JSON.stringify(levels) })
      .onConflict("record_id").merge({ levels: JSON.stringify(levels), computed_at: db.fn.now() }),
  );
}

export interface RecordLevels {
  recordId: string; startedAt: Date; windSpeedMps: number | null;
  /** Per-channel levels, null when none were computed (e.g. the seeded history). */
  levels: ChannelResponseLevel[] | null;
  /** Channels the current analysis kept after quality screening. */
  channelsUsed: string[];
}

/** Analysed records of the asset in [from, to): start time, reported wind speed, response levels; by time. */
export async function listRecordLevels(db: Db, assetId: string, from: Date, to: Date): Promise<RecordLevels[]> {
  const rows = await withDbErrors(() =>
    db("records as r")
      .join("analysis_results as ar", function current() {
        this.on("ar.record_id", "=", "r.id").andOn("ar.settings_version", "=", "r.analysed_settings_version");
      })
      .leftJoin("record_response_levels as l", "l.record_id", "r.id")
      .where("r.asset_id", assetId).where("r.status", "analysed").where("r.started_at", ">=", from).where("r.started_at", "<", to)
      .select("r.id", "r.started_at", "r.environment", "l.levels", "ar.channels_used").orderBy("r.started_at"),
  ) as { id: string; started_at: Date; environment: { windSpeedMps?: unknown } | null; levels: ChannelResponseLevel[] | null; channels_used: string[] }[];
  return rows.map((r) => {
    const w = r.environment?.windSpeedMps;
    return { recordId: r.id, startedAt: r.started_at, windSpeedMps: typeof w === "number" && Number.isFinite(w) ? w : null, levels: r.levels, channelsUsed: r.channels_used };
  });
}

export interface ModeObservation {
  recordId: string; startedAt: Date; trackedModeId: string; frequencyHz: number;
  dampingRatio: number | null; dampingReliable: boolean; shape: Record<string, number>;
}

/**
 * Identified frequencies, damping and shapes of the asset's tracked modes in analysed records
 * of [from, to) (each record's current result), ordered by time.
 */
export async function listModeObservations(db: Db, assetId: string, from: Date, to: Date): Promise<ModeObservation[]> {
  const rows = await withDbErrors(() =>
    db("records as r")
      .join("analysis_results as ar", function current() {
        this.on("ar.record_id", "=", "r.id").andOn("ar.settings_version", "=", "r.analysed_settings_version");
      })
      .join("mode_assignments as ma", "ma.result_id", "ar.id")
      .join("identified_modes as im", "im.id", "ma.identified_mode_id")
      .where("r.asset_id", assetId).where("r.status", "analysed").where("r.started_at", ">=", from).where("r.started_at", "<", to)
      .select("r.id as record_id", "r.started_at", "ma.tracked_mode_id", "im.frequency_hz", "im.damping_ratio", "im.damping_reliable", "im.shape")
      .orderBy("r.started_at"),
  ) as { record_id: string; started_at: Date; tracked_mode_id: string; frequency_hz: number; damping_ratio: number | null; damping_reliable: boolean; shape: Record<string, number> }[];
  return rows.map((r) => ({
    recordId: r.record_id, startedAt: r.started_at, trackedModeId: r.tracked_mode_id, frequencyHz: r.frequency_hz,
    dampingRatio: r.damping_ratio, dampingReliable: r.damping_reliable, shape: r.shape,
  }));
}
