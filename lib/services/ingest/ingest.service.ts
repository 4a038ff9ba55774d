/**
 * Gateway upload (PRODUCT.md §Upload contract): parse and check everything first, keep
 * nothing from a refused upload, then store the samples once (content-addressed), write the
 * record and queue its analysis. Idempotent on (gateway, recordId) with the SHA-256 of the
 * (decompressed) data part: the same record again answers 200 with the stored one, other
 * content under the same recordId answers 409.
 */
import { env } from "@/lib/config/env";
import { db } from "@/lib/db/knex";
import { countRecordsWithBlob, findRecordByGatewayRecordId, insertRecord, updateRecordStatus } from "@/lib/db/repos/record.repo";
import { listChannelsOfAsset } from "@/lib/db/repos/sensor-channel.repo";
import { listTrackedModesOfAsset } from "@/lib/db/repos/tracked-mode.repo";
import type { DataFormat, TrackedMode, VibrationRecord } from "@/lib/domain/records";
import type { SensorChannel } from "@/lib/domain/types";
import { AppError, isAppError } from "@/lib/http/errors";
import { fieldErrorsOf } from "@/lib/http/validation";
import { enqueueNewRecordAnalysis } from "@/lib/jobs/analysis";
import { blobStore, contentKey } from "@/lib/storage";
import type { DeviceActor } from "@/lib/services/assets/gateway.service";
import { checkAndHashSamples, dataFormatOf, inflateIfGzip } from "./decode";
import { readUploadParts, type UploadParts } from "./multipart";
import { consumeUploadAllowance } from "./rate-limit";
import { UploadRecordMeta } from "./schemas";

export interface UploadRequest {
  body: AsyncIterable<Uint8Array> | null;
  contentType: string | null;
  /** Content-Length when declared (refused early when over the limit). */
  contentLength: number | null;
}

export interface IngestOutcome {
  /** `queued`: new record (202); `duplicate`: the same record was already stored (200). */
  outcome: "queued" | "duplicate";
  record: VibrationRecord;
}

/**
 * Periods of the lowest tracked mode a record must span to be worth identifying [practice]:
 * a Welch segment of ≥ 10 periods (so the peak sits ≥ 10 lines above DC) and ≥ 20 averages
 * at 50 % overlap (random error ≈ 1/√20 ≈ 22 % per line, Bendat & Piersol §8.5) need
 * (20 + 1)/2 × 10 = 105 periods.
 */
export const MIN_PERIODS_OF_LOWEST_MODE = 105;

export async function ingestRecord(device: DeviceActor, req: UploadRequest): Promise<IngestOutcome> {
  await consumeUploadAllowance(device.gatewayId);
  const e = env();
  const parts = await readUploadParts(req.body, req.contentType, req.contentLength, e.UPLOAD_MAX_BYTES);
  try {
    return await checkAndStore(device, parts);
  } finally {
    // Only now: without gzip the stored bytes are the pooled buffer itself.
    parts.release();
  }
}

async function checkAndStore(device: DeviceActor, parts: UploadParts): Promise<IngestOutcome> {
  const e = env();
  const rawMeta = parseMetaJson(parts.meta);
  const claimedAsset = (rawMeta as { assetId?: unknown }).assetId;
  if (claimedAsset !== undefined && claimedAsset !== device.assetId) {
    throw new AppError("forbidden", "This gateway is not assigned to that asset.", { details: { field: "meta.assetId", rule: "asset_assigned" } });
  }
  const format = dataFormatOf(parts.data.mimeType);
  const parsed = UploadRecordMeta.safeParse(rawMeta);
  if (!parsed.success) {
    throw new AppError("unprocessable", "The meta part has invalid fields.", {
      details: { field: "meta", rule: "meta_schema" }, fieldErrors: prefix("meta", fieldErrorsOf(parsed.error)),
    });
  }
  const meta = parsed.data;
  // The lookups and the inflate (zlib's thread pool) run together; their outcomes are still
  // checked one by one in the contract's order, so every answer is what a sequential check gives.
  const channels = quiet(listChannelsOfAsset(db(), device.assetId));
  const tracked = quiet(listTrackedModesOfAsset(db(), device.assetId));
  const previous = quiet(findRecordByGatewayRecordId(db(), device.gatewayId, meta.recordId));
  const inflated = quiet(inflateIfGzip(parts.data.bytes, format, e.UPLOAD_MAX_DECODED_BYTES));
  try {
    assertChannelsConfigured(await channels, meta.channels);
  } catch (err) {
    // The pooled input goes back to the pool after this returns: let zlib finish reading it
    // first, and hand its pooled output back.
    (await inflated.catch(() => null))?.release();
    throw err;
  }
  const decoded = await inflated;
  try {
    const bytes = decoded.bytes;
    const { sampleCount, sha256: hash } = await checkAndHashSamples(bytes, format, meta.channels);
    const durationS = sampleCount / meta.sampleRateHz;
    assertLongEnough(await tracked, durationS);
    const existing = await previous;
    if (existing) return sameOrConflict(existing, hash);
    return await storeNew(device, meta, { bytes, format, hash, sampleCount, durationS });
  } finally {
    decoded.release();
  }
}

/** Store checked samples once (content-addressed), insert the record and queue its analysis. */
async function storeNew(device: DeviceActor, meta: UploadRecordMeta, data: {
  bytes: Buffer; format: DataFormat; hash: string; sampleCount: number; durationS: number;
}): Promise<IngestOutcome> {
  const { bytes, format, hash, sampleCount, durationS } = data;

  const blobKey = contentKey(hash);
  // The samples are stored first, then the row is written on its own (no transaction held open
  // across the file write: 8 uploads at once would hold 8 pooled connections while writing).
  // A crash between the two leaves an unreferenced blob, never a row without its samples; the
  // gateway got no answer, sends again, and the content-addressed put finds the blob there.
  await blobStore().put(blobKey, bytes);
  let record: VibrationRecord;
  try {
    record = await insertRecord(db(), {
      organisationId: device.organisationId, assetId: device.assetId, gatewayId: device.gatewayId,
      gatewayRecordId: meta.recordId, startedAt: new Date(meta.startedAt), sampleRateHz: meta.sampleRateHz,
      channels: meta.channels, units: meta.units, temperatureC: meta.temperatureC, environment: meta.environment ?? {},
      contentHash: hash, blobKey, dataFormat: format, byteSize: bytes.length, sampleCount, durationS, status: "queued",
    });
  } catch (err) {
    if (!(isAppError(err) && err.code === "conflict")) throw err;
    // Lost a race with the same (gateway, recordId).
    const winner = await findRecordByGatewayRecordId(db(), device.gatewayId, meta.recordId);
    if (!winner) throw err;
    if (winner.contentHash !== hash && (await countRecordsWithBlob(db(), blobKey)) === 0) await blobStore().delete(blobKey);
    return sameOrConflict(winner, hash);
  }
  return { outcome: "queued", record: await queueRecord(record) };
}

/**
 * Queue the analysis of a record inserted as `queued`. PostgreSQL stays the truth: if Redis
 * is down the record goes back to `received` and the sweeper queues it later (as it does for
 * a `queued` record whose job was lost in a crash).
 */
async function queueRecord(record: VibrationRecord): Promise<VibrationRecord> {
  try {
    await enqueueNewRecordAnalysis(record.id);
  } catch {
    return (await updateRecordStatus(db(), record.id, { status: "received" }, ["queued"])) ?? record;
  }
  return record;
}

function sameOrConflict(existing: VibrationRecord, hash: string): IngestOutcome {
  if (existing.contentHash === hash) return { outcome: "duplicate", record: existing };
  throw new AppError("conflict", `Record '${existing.gatewayRecordId}' was already uploaded with other content.`, {
    details: { field: "meta.recordId", rule: "record_id_unique", recordId: existing.id },
  });
}

function parseMetaJson(text: string): unknown {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    throw new AppError("bad_request", "The meta part is not valid JSON.", { details: { field: "meta", rule: "json" }, fieldErrors: { meta: ["Not valid JSON."] } });
  }
  if (typeof value !== "object" || value === null || Array.isArray(value)) {
    throw new AppError("bad_request", "The meta part must be a JSON object.", { details: { field: "meta", rule: "json_object" }, fieldErrors: { meta: ["Must be a JSON object."] } });
  }
  return value;
}

/**
 * Every code must be an active channel of the asset: accelerometers, plus at most one force
 * channel (a forced test: the analysis leaves it out of the identification and computes FRFs).
 */
function assertChannelsConfigured(assetChannels: SensorChannel[], codes: string[]): void {
  const active = assetChannels.filter((c) => c.active);
  const configured = new Set(active.map((c) => c.code));
  const forceCodes = new Set(active.filter((c) => c.quantity === "force").map((c) => c.code));
  const unknown = codes.filter((c) => !configured.has(c));
  const forces = codes.filter((c) => forceCodes.has(c));
  const refuse = (rule: string, message: string, extra: Record<string, unknown>) => new AppError("unprocessable", message, {
    details: { field: "meta.channels", rule, ...extra }, fieldErrors: { "meta.channels": [message] },
  });
  if (unknown.length) throw refuse("channels_configured", `Channels not configured (or inactive) on the asset: ${unknown.join(", ")}.`, { unknown });
  if (forces.length > 1) throw refuse("one_force_channel", `At most one force channel per record (got ${forces.join(", ")}).`, { forces });
  if (forces.length === codes.length) throw refuse("acceleration_channels", "A record needs at least one acceleration channel.", { forces });
}

function assertLongEnough(tracked: TrackedMode[], durationS: number): void {
  if (tracked.length === 0) return;
  const lowestHz = Math.min(...tracked.map((t) => t.bandLowHz));
  const neededS = MIN_PERIODS_OF_LOWEST_MODE / lowestHz;
  if (durationS < neededS) {
    const message = `The record lasts ${durationS.toFixed(1)} s; identifying the lowest tracked mode (from ${lowestHz} Hz) needs at least ${neededS.toFixed(1)} s (${MIN_PERIODS_OF_LOWEST_MODE} periods).`;
    throw new AppError("unprocessable", message, {
      details: { field: "data", rule: "too_short", durationS, minDurationS: neededS }, fieldErrors: { data: [message] },
    });
  }
}

/** Mark a promise's rejection as handled now; awaiting it later still throws. */
function quiet<T>(p: Promise<T>): Promise<T> {
  p.catch(() => undefined);
  return p;
}

function prefix(p: string, errors: Record<string, string[]>): Record<string, string[]> {
  return Object.fromEntries(Object.entries(errors).map(([k, v]) => [k === "_form" ? p : `${p}.${k}`, v]));
}
