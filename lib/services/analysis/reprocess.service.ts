/**
 * Reprocessing (issue 4 §4): queue one record, or every record of a date range, for analysis
 * with the asset's current settings version (`record:reprocess`: engineers and admins).
 * Earlier results stay: a new version adds a result row; the job is pinned to the version
 * (`analyse-<recordId>-v<version>`). A record that failed for good can be retried.
 * Order: the status change and audit entry commit first, then the job is queued, so a lost
 * enqueue is picked up by the sweeper (which also analyses with the latest version).
 */
import { db, type Db } from "@/lib/db/knex";
import { ensureAnalysisSettings } from "@/lib/db/repos/analysis-settings.repo";
import { listRecordIdsInRange, markRecordsQueued } from "@/lib/db/repos/record-list.repo";
import { findRecordById, updateRecordStatus } from "@/lib/db/repos/record.repo";
import type { Actor, Asset } from "@/lib/domain/types";
import { hasRawSamples, type RecordStatus, type VibrationRecord } from "@/lib/domain/records";
import { AppError } from "@/lib/http/errors";
import { enqueueAnalysis } from "@/lib/jobs/analysis";
import { recordAudit } from "@/lib/services/audit/audit.service";
import { loadOwnAsset } from "@/lib/services/assets/asset.service";
import { assertCan, isUuid } from "@/lib/services/authz";
import type { ReprocessRangeInput } from "./schemas";
import { DEFAULT_ANALYSIS_SETTINGS } from "./settings";

/** At most this many records per range request [practice: keeps one request well under a minute]. */
export const MAX_REPROCESS_RECORDS = 5000;

export interface ReprocessOutcome { recordId: string; settingsVersion: number; jobId: string; added: boolean }

/** A record of the asset (not_found for a foreign, unknown or malformed id). */
export async function loadRecordOfAsset(actor: Actor, assetId: string, recordId: string, q: Db = db()): Promise<{ asset: Asset; record: VibrationRecord }> {
  const asset = await loadOwnAsset(actor, assetId, q);
  const record = isUuid(recordId) ? await findRecordById(q, recordId) : null;
  if (!record || record.assetId !== asset.id) throw new AppError("not_found", "No such record.");
  return { asset, record };
}

/** A record without raw samples (seeded demo history) keeps its results: 'conflict'. */
function assertReprocessable(record: VibrationRecord): void {
  if (!hasRawSamples(record)) {
    throw new AppError("conflict", "This record keeps its results but not its raw samples (demo history), so it cannot be analysed again.");
  }
}

/** Queue the record for analysis with the asset's current settings version. */
export async function reprocessRecord(actor: Actor, assetId: string, recordId: string): Promise<ReprocessOutcome> {
  assertCan(actor, "record:reprocess");
  const { record, version } = await db().transaction(async (trx) => {
    const { asset, record } = await loadRecordOfAsset(actor, assetId, recordId, trx);
    assertReprocessable(record);
    const settings = await ensureAnalysisSettings(trx, asset.id, DEFAULT_ANALYSIS_SETTINGS);
    await updateRecordStatus(trx, record.id, { status: "queued", progress: 0, failureReason: null });
    await recordAudit(trx, actor, {
      action: "record.reprocess", subjectType: "record", subjectId: record.id,
      details: { assetId: asset.id, settingsVersion: settings.version, previousVersion: record.analysedSettingsVersion },
    });
    return { record, version: settings.version };
  });
  const { jobId, added } = await enqueueAnalysis(record.id, { settingsVersion: version, replaceFinished: true });
  return { recordId: record.id, settingsVersion: version, jobId, added };
}

/** What a range reprocess would do: the records it queues and those it leaves alone. */
export interface ReprocessRangePlan { settingsVersion: number; total: number; toQueue: number; skipped: number }

/** Records still waiting for their first analysis run with the latest version anyway; demo history has no raw samples. */
const isRequeueable = (r: { status: RecordStatus; blobKey: string }) => r.status !== "received" && r.status !== "queued" && hasRawSamples(r);

/** The asset's records of [from, to) that a range reprocess may take (at most MAX_REPROCESS_RECORDS, else 'unprocessable'). */
async function loadRange(actor: Actor, assetId: string, range: ReprocessRangeInput, trx: Db) {
  const asset = await loadOwnAsset(actor, assetId, trx);
  const rows = await listRecordIdsInRange(trx, asset.id, range.from, range.to, MAX_REPROCESS_RECORDS + 1);
  if (rows.length > MAX_REPROCESS_RECORDS) {
    throw new AppError("unprocessable", `The range holds more than ${MAX_REPROCESS_RECORDS} records: choose a shorter one.`, {
      fieldErrors: { to: [`At most ${MAX_REPROCESS_RECORDS} records per request.`] },
    });
  }
  const settings = await ensureAnalysisSettings(trx, asset.id, DEFAULT_ANALYSIS_SETTINGS);
  const ids = rows.filter(isRequeueable).map((r) => r.id);
  return { asset, ids, total: rows.length, version: settings.version };
}

/** Preview of {@link reprocessRange}: how many records it would queue, with which settings version. Changes nothing. */
export async function planReprocessRange(actor: Actor, assetId: string, range: ReprocessRangeInput): Promise<ReprocessRangePlan> {
  assertCan(actor, "record:reprocess");
  const { ids, total, version } = await loadRange(actor, assetId, range, db());
  return { settingsVersion: version, total, toQueue: ids.length, skipped: total - ids.length };
}

/**
 * Queue every record of the asset that started in [from, to) with the current settings
 * version. Records still waiting for their first analysis (received, queued) are left alone:
 * they will run with the latest version anyway; records without raw samples are skipped.
 * @throws AppError('unprocessable') when the range holds more than MAX_REPROCESS_RECORDS.
 */
export async function reprocessRange(
  actor: Actor, assetId: string, range: ReprocessRangeInput,
): Promise<{ settingsVersion: number; queued: number; skipped: number }> {
  assertCan(actor, "record:reprocess");
  const { ids, skipped, version } = await db().transaction(async (trx) => {
    const { asset, ids, total, version } = await loadRange(actor, assetId, range, trx);
    await markRecordsQueued(trx, ids);
    await recordAudit(trx, actor, {
      action: "record.reprocess_range", subjectType: "asset", subjectId: asset.id,
      details: { from: range.from.toISOString(), to: range.to.toISOString(), settingsVersion: version, records: ids.length },
    });
    return { ids, skipped: total - ids.length, version };
  });
  for (const id of ids) await enqueueAnalysis(id, { settingsVersion: version, replaceFinished: true });
  return { settingsVersion: version, queued: ids.length, skipped };
}

/** Queue a record that failed for good again (its failed job is replaced). Only `failed` records: else 'conflict'. */
export async function retryFailedRecord(actor: Actor, assetId: string, recordId: string): Promise<ReprocessOutcome> {
  assertCan(actor, "record:reprocess");
  const { record, version } = await db().transaction(async (trx) => {
    const { asset, record } = await loadRecordOfAsset(actor, assetId, recordId, trx);
    if (record.status !== "failed") throw new AppError("conflict", `Only a failed record can be retried (this one is ${record.status}).`);
    const settings = await ensureAnalysisSettings(trx, asset.id, DEFAULT_ANALYSIS_SETTINGS);
    const updated = await updateRecordStatus(trx, record.id, { status: "queued", progress: 0, failureReason: null }, ["failed"]);
    if (!updated) throw new AppError("conflict", "The record changed meanwhile; reload and try again.");
    await recordAudit(trx, actor, {
      action: "record.retry", subjectType: "record", subjectId: record.id,
      details: { assetId: asset.id, settingsVersion: settings.version, failureReason: record.failureReason },
    });
    return { record, version: settings.version };
  });
  const { jobId, added } = await enqueueAnalysis(record.id, { settingsVersion: version, replaceFinished: true });
  return { recordId: record.id, settingsVersion: version, jobId, added };
}
