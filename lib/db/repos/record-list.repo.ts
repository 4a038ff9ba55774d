/**
 * Reads of an asset's records for the Records screen (keyset pagination, newest first, with a
 * summary of the latest analysis) and the bulk selections of reprocessing.
 */
import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";
import { toVibrationRecord, type RecordRow } from "@/lib/db/rows-records";
import type { QualityVerdictKind, RecordStatus, VibrationRecord } from "@/lib/domain/records";

const R_COLS = [
  "id", "organisation_id", "asset_id", "gateway_id", "gateway_record_id", "started_at", "sample_rate_hz", "channels",
  "units", "temperature_c", "environment", "content_hash", "blob_key", "data_format", "byte_size", "sample_count",
  "duration_s", "status", "progress", "failure_reason", "analysed_settings_version", "created_at", "updated_at",
].map((c) => `r.${c}`);

export interface RecordSummaryRowOut {
  record: VibrationRecord;
  /** Latest result (highest settings version), or null before the first analysis. */
  latest: { settingsVersion: number; verdict: QualityVerdictKind; modeCount: number; trackedIdentified: number; trackedTotal: number } | null;
}

export interface RecordListFilter {
  status?: RecordStatus;
  from?: Date;
  to?: Date;
  /** Keyset: rows strictly after this (started_at, id) in descending order. */
  after?: { startedAt: Date; id: string };
  limit: number;
}

/** One page of the asset's records, newest first (started_at desc, id desc). */
export async function listRecordSummariesOfAsset(db: Db, assetId: string, f: RecordListFilter): Promise<RecordSummaryRowOut[]> {
  const rows = await withDbErrors(() => {
    const q = db("records as r")
      .select(...R_COLS, "lr.settings_version as lr_settings_version", "lr.verdict as lr_verdict", "lr.mode_count as lr_mode_count",
        "lr.tracked_identified as lr_tracked_identified", "lr.tracked_total as lr_tracked_total")
      .joinRaw(`left join lateral (
          select ar.settings_version, ar.verdict,
            (select count(*) from identified_modes im where im.result_id = ar.id) as mode_count,
            (select count(ma.identified_mode_id) from mode_assignments ma where ma.result_id = ar.id) as tracked_identified,
            (select count(*) from mode_assignments ma where ma.result_id = ar.id) as tracked_total
          from analysis_results ar where ar.record_id = r.id order by ar.settings_version desc limit 1
        ) lr on true`)
      .where("r.asset_id", assetId);
    if (f.status) q.where("r.status", f.status);
    if (f.from) q.where("r.started_at", ">=", f.from);
    if (f.to) q.where("r.started_at", "<", f.to);
    if (f.after) q.whereRaw("(r.started_at, r.id) < (?, ?)", [f.after.startedAt, f.after.id]);
    return q.orderBy([{ column: "r.started_at", order: "desc" }, { column: "r.id", order: "desc" }]).limit(f.limit);
  });
  return (rows as (RecordRow & Record<string, unknown>)[]).map((row) => ({
    record: toVibrationRecord(row),
    latest: row.lr_settings_version === null || row.lr_settings_version === undefined ? null : {
      settingsVersion: Number(row.lr_settings_version), verdict: row.lr_verdict as QualityVerdictKind,
      modeCount: Number(row.lr_mode_count), trackedIdentified: Number(row.lr_tracked_identified), trackedTotal: Number(row.lr_tracked_total),
    },
  }));
}

/** Ids of the asset's records that started in [from, to), oldest first, at most `limit`. */
export async function listRecordIdsInRange(db: Db, assetId: string, from: Date, to: Date, limit: number): Promise<{ id: string; status: RecordStatus; blobKey: string }[]> {
  return withDbErrors(() =>
    db("records").select("id", "status", { blobKey: "blob_key" }).where({ asset_id: assetId }).where("started_at", ">=", from).where("started_at", "<", to)
      .orderBy([{ column: "started_at" }, { column: "id" }]).limit(limit),
  );
}

/** Set many records to `queued` (progress 0, no failure reason) in one statement. */
export async function markRecordsQueued(db: Db, ids: readonly string[]): Promise<number> {
  if (ids.length === 0) return 0;
  return withDbErrors(() =>
    db("records").whereIn("id", ids).update({ status: "queued", progress: 0, failure_reason: null, updated_at: db.fn.now() }),
  );
}
