import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";
import { toVibrationRecord, type RecordRow } from "@/lib/db/rows-records";
import type { DataFormat, RecordEnvironment, RecordStatus, RecordUnits, VibrationRecord } from "@/lib/domain/records";

const COLS = [
  "id", "organisation_id", "asset_id", "gateway_id", "gateway_record_id", "started_at", "sample_rate_hz", "channels",
  "units", "temperature_c", "environment", "content_hash", "blob_key", "data_format", "byte_size", "sample_count",
  "duration_s", "status", "progress", "failure_reason", "analysed_settings_version", "created_at", "updated_at",
] as const;

export interface RecordWrite {
  organisationId: string; assetId: string; gatewayId: string; gatewayRecordId: string; startedAt: Date;
  sampleRateHz: number; channels: string[]; units: RecordUnits; temperatureC: number | null;
  environment: RecordEnvironment; contentHash: string; blobKey: string; dataFormat: DataFormat; byteSize: number;
  sampleCount: number; durationS: number;
  /** Initial status: `received` (default) or `queued` when its analysis job is about to be added. */
  status?: "received" | "queued";
}

/** Insert a new record (status `received` unless told); a second (gateway, record id) raises AppError('conflict'). */
export async function insertRecord(db: Db, r: RecordWrite): Promise<VibrationRecord> {
  const [row] = await withDbErrors(() =>
    db("records")
      .insert({
        organisation_id: r.organisationId, asset_id: r.assetId, gateway_id: r.gatewayId,
        gateway_record_id: r.gatewayRecordId, started_at: r.startedAt, sample_rate_hz: r.sampleRateHz,
        channels: r.channels, units: r.units, temperature_c: r.temperatureC, environment: JSON.stringify(r.environment),
        content_hash: r.contentHash, blob_key: r.blobKey, data_format: r.dataFormat, byte_size: r.byteSize,
        sample_count: r.sampleCount, duration_s: r.durationS, status: r.status ?? "received",
      })
      .returning(COLS),
  );
  return toVibrationRecord(row as RecordRow);
}

export async function findRecordById(db: Db, id: string): Promise<VibrationRecord | null> {
  const row = await withDbErrors(() => db<RecordRow>("records").select(...COLS).where({ id }).first());
  return row ? toVibrationRecord(row) : null;
}

export async function findRecordByGatewayRecordId(db: Db, gatewayId: string, gatewayRecordId: string): Promise<VibrationRecord | null> {
  const row = await withDbErrors(() =>
    db<RecordRow>("records").select(...COLS).where({ gateway_id: gatewayId, gateway_record_id: gatewayRecordId }).first(),
  );
  return row ? toVibrationRecord(row) : null;
}

export interface RecordStatusPatch {
  status: RecordStatus;
  progress?: number;
  failureReason?: string | null;
  analysedSettingsVersion?: number;
}

/**
 * Set a record's status (and progress, failure reason, analysed version). With `onlyFrom`,
 * only rows currently in one of those statuses change; returns the row or null.
 */
export async function updateRecordStatus(
  db: Db, id: string, patch: RecordStatusPatch, onlyFrom?: readonly RecordStatus[],
): Promise<VibrationRecord | null> {
  const update: Record<string, unknown> = { status: patch.status, updated_at: db.fn.now() };
  if (patch.progress !== undefined) update.progress = patch.progress;
  if (patch.failureReason !== undefined) update.failure_reason = patch.failureReason;
  if (patch.analysedSettingsVersion !== undefined) update.analysed_settings_version = patch.analysedSettingsVersion;
  const [row] = await withDbErrors(() => {
    const q = db("records").where({ id });
    if (onlyFrom) q.whereIn("status", onlyFrom);
    return q.update(update).returning(COLS);
  });
  return row ? toVibrationRecord(row as RecordRow) : null;
}

/** Progress only (no updated_at bump, so the sweeper's age test is about status changes). */
export async function updateRecordProgress(db: Db, id: string, progress: number): Promise<void> {
  await withDbErrors(() => db("records").where({ id }).update({ progress }));
}

/** Records in `statuses` whose status last changed before `before`, oldest first (keyset by updated_at, id). */
export async function listRecordsInStatus(
  db: Db, statuses: readonly RecordStatus[], before: Date, limit: number,
): Promise<VibrationRecord[]> {
  const rows = await withDbErrors(() =>
    db<RecordRow>("records").select(...COLS).whereIn("status", statuses).where("updated_at", "<", before)
      .orderBy([{ column: "updated_at" }, { column: "id" }]).limit(limit),
  );
  return rows.map(toVibrationRecord);
}

/** How many records point at a blob (a blob is deleted only when none does). */
export async function countRecordsWithBlob(db: Db, blobKey: string): Promise<number> {
  const row = await withDbErrors(() => db("records").where({ blob_key: blobKey }).count<{ n: string }[]>({ n: "*" }).first());
  return Number(row?.n ?? 0);
}
