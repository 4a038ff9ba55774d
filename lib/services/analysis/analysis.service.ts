/**
 * Analysis of one record (the queued step of PRODUCT.md §Data flow 3): load the raw samples,
 * convert to m/s², identify modes with the asset's latest settings (the engine screens data
 * quality first), assign them to the tracked modes, and store everything in one transaction
 * as an upsert keyed by (record, settings version), so a retry is harmless.
 */
import { db } from "@/lib/db/knex";
import { upsertAnalysisResult, type AssignmentWrite, type ModeWrite } from "@/lib/db/repos/analysis-result.repo";
import { ensureAnalysisSettings, findAnalysisSettingsVersion } from "@/lib/db/repos/analysis-settings.repo";
import { findRecordById, updateRecordProgress, updateRecordStatus } from "@/lib/db/repos/record.repo";
import { listChannelsOfAsset } from "@/lib/db/repos/sensor-channel.repo";
import { listTrackedModesOfAsset } from "@/lib/db/repos/tracked-mode.repo";
import type { RecordStatus, StabilisationPointTuple, TrackedMode } from "@/lib/domain/records";
import { isAppError } from "@/lib/http/errors";
import { enqueueDrift } from "@/lib/jobs/drift";
import { assignModes } from "@/lib/modal/assign-modes";
import { identifyModes, type IdentifyResult } from "@/lib/modal/identify";
import { decimate } from "@/lib/signal/decimate";
import { toMetresPerSecondSquared } from "@/lib/signal/units";
import { computeChannelResponseLevels } from "@/lib/signal/response-levels"; // H5 response levels
import { upsertResponseLevels } from "@/lib/db/repos/serviceability.repo"; // H5 response levels
import { blobStore } from "@/lib/storage";
import { decodeSamples } from "@/lib/services/ingest/decode";
import { frfExtras } from "./extras";
import { AnalysisSettingsSchema, DEFAULT_ANALYSIS_SETTINGS, identifyOptionsFor } from "./settings";

/** Stored with each result so later engine changes can be told apart. */
export const ENGINE_VERSION = "modewarden-fdd-efdd-1";

/** A failure a retry cannot fix (record or samples missing, undecodable samples). */
export class PermanentAnalysisError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "PermanentAnalysisError";
  }
}

export interface AnalyseOutcome {
  recordId: string;
  status: RecordStatus;
  settingsVersion: number;
  resultId: string;
  modeCount: number;
  identifiedTracked: number;
}

/**
 * Analyse one record with `opts.settingsVersion` (a reprocess) or else the asset's latest
 * settings (version 1 is created with the defaults on first use).
 */
export async function analyseRecord(
  recordId: string, opts: { settingsVersion?: number; onProgress?: (fraction: number) => Promise<void> | void } = {},
): Promise<AnalyseOutcome> {
  const progress = async (p: number) => {
    await updateRecordProgress(db(), recordId, p);
    await opts.onProgress?.(p);
  };
  const record = await findRecordById(db(), recordId);
  if (!record) throw new PermanentAnalysisError(`record ${recordId} does not exist`);
  const latestRow = await ensureAnalysisSettings(db(), record.assetId, DEFAULT_ANALYSIS_SETTINGS);
  const settingsRow = opts.settingsVersion === undefined || opts.settingsVersion === latestRow.version
    ? latestRow : await findAnalysisSettingsVersion(db(), record.assetId, opts.settingsVersion);
  if (!settingsRow) throw new PermanentAnalysisError(`settings version ${opts.settingsVersion} of asset ${record.assetId} does not exist`);
  const settings = AnalysisSettingsSchema.parse(settingsRow.settings);
  await updateRecordStatus(db(), record.id, { status: "analysing", progress: 0.05, failureReason: null });
  await opts.onProgress?.(0.05);

  const bytes = await blobStore().get(record.blobKey);
  if (!bytes) throw new PermanentAnalysisError(`the raw samples of record ${record.id} are missing (${record.blobKey})`);
  let data: Float64Array[];
  try {
    data = decodeSamples(bytes, record.dataFormat, record.channels).data;
  } catch (e) {
    throw new PermanentAnalysisError(`the raw samples do not decode: ${isAppError(e) ? e.message : String(e)}`);
  }
  // A force channel (forced test) is left out of the output-only identification and used for FRFs.
  const assetChannels = await listChannelsOfAsset(db(), record.assetId);
  const forceCodes = new Set(assetChannels.filter((c) => c.quantity === "force").map((c) => c.code));
  const forceIdx = record.channels.findIndex((c) => forceCodes.has(c));
  let force = forceIdx >= 0 ? data[forceIdx] : null;
  const channels = record.channels.filter((_, i) => i !== forceIdx);
  // Decoded samples are finite Float64Arrays already: m/s² needs no converted copy.
  data = data.filter((_, i) => i !== forceIdx).map((x) => (record.units === "m/s2" ? x : toMetresPerSecondSquared(x, record.units)));
  // --- Response levels for serviceability (issue 6 §2; owner H5): per channel, before any
  // decimation, in m/s²; the serviceability view keeps only the channels the analysis used.
  const directionOf = new Map(assetChannels.map((c) => [c.code, c.direction as string]));
  await upsertResponseLevels(db(), record.id, computeChannelResponseLevels({
    sampleRateHz: record.sampleRateHz, units: "m/s2", data, channels: channels.map((code) => ({ code, direction: directionOf.get(code) ?? "" })),
  }));
  // --- end response levels
  let fs = record.sampleRateHz;
  const q = settings.decimationTargetHz ? Math.floor(fs / settings.decimationTargetHz) : 1;
  if (q >= 2) {
    data = data.map((x) => decimate(x, q));
    if (force) force = decimate(force, q);
    fs /= q;
  }
  await progress(0.2);

  const tracked = await listTrackedModesOfAsset(db(), record.assetId);
  const identified = identifyModes({ sampleRateHz: fs, channels, data }, identifyOptionsFor(settings, tracked, data[0].length));
  const frf = force && forceIdx >= 0
    ? frfExtras(fs, record.channels[forceIdx], force, channels, data, identified.spectral.nperseg || 2048) : null;
  // SSI-COV's stabilisation diagram as [order, frequency Hz, damping ratio, label] tuples.
  const stabilisation: StabilisationPointTuple[] | null = identified.stabilisation
    ? identified.stabilisation.map((p) => [p.order, p.frequencyHz, p.dampingRatio, p.stable]) : null;
  await progress(0.8);

  const verdict = identified.quality.verdict;
  const modes = identified.modes.map((m, i) => modeWrite(identified, i));
  const assignments = verdict.kind === "reject" ? tracked.map(notIdentified) : assignTracked(identified, tracked);
  const status: RecordStatus = verdict.kind === "reject" ? "rejected" : "analysed";
  const stored = await db().transaction(async (trx) => {
    const out = await upsertAnalysisResult(trx, {
      recordId: record.id, settingsVersion: settingsRow.version, verdict: verdict.kind, quality: identified.quality,
      channelsUsed: identified.channels, spectral: identified.spectral,
      singularValues: {
        frequencyHz: Array.from(identified.singularValues.frequencyHz), s1: Array.from(identified.singularValues.s1),
        s2: identified.singularValues.s2 ? Array.from(identified.singularValues.s2) : null,
        s3: identified.singularValues.s3 ? Array.from(identified.singularValues.s3) : null,
      },
      warnings: identified.warnings, timingsMs: identified.timingsMs, engineVersion: ENGINE_VERSION,
      extras: frf || stabilisation ? { stabilisation, frf } : null,
    }, modes, assignments);
    await updateRecordStatus(trx, record.id, {
      status, progress: 1, analysedSettingsVersion: settingsRow.version,
      failureReason: verdict.kind === "reject" ? `quality: ${verdict.reason}` : null,
    });
    return out;
  });
  await opts.onProgress?.(1);
  if (status === "analysed") await enqueueDrift(record.assetId);
  return {
    recordId: record.id, status, settingsVersion: settingsRow.version, resultId: stored.result.id, modeCount: stored.modes.length,
    identifiedTracked: stored.assignments.filter((a) => a.identifiedModeId !== null).length,
  };
}

/** Mark a record failed for good (the worker's last attempt), with the reason shown in the UI. */
export async function markRecordFailed(recordId: string, reason: string): Promise<void> {
  await updateRecordStatus(db(), recordId, { status: "failed", failureReason: reason.slice(0, 1000) });
}

function byCode(channels: string[], values: ArrayLike<number>): Record<string, number> {
  return Object.fromEntries(channels.map((c, i) => [c, values[i]]));
}

function modeWrite(r: IdentifyResult, i: number): ModeWrite {
  const m = r.modes[i];
  return {
    modeIndex: i, frequencyHz: m.frequencyHz, dampingRatio: m.dampingRatio, dampingMethod: m.dampingMethod,
    dampingReliable: m.dampingReliable, mpc: Math.min(1, m.mpc), shape: byCode(r.channels, m.shape),
    shapeComplex: { re: byCode(r.channels, m.shapeComplex.re), im: byCode(r.channels, m.shapeComplex.im) },
    estimates: { fdd: m.fdd, efdd: m.efdd, halfPower: m.halfPower, ssi: m.ssi, reliability: m.reliability, band: m.band },
    possiblyCoupled: m.possiblyCoupled,
  };
}

const notIdentified = (t: TrackedMode): AssignmentWrite => ({ trackedModeId: t.id, modeIndex: null, mac: null, frequencyDeviation: null, cost: null });

function assignTracked(r: IdentifyResult, tracked: TrackedMode[]): AssignmentWrite[] {
  const targets = tracked.map((t) => ({
    nominalFrequencyHz: t.nominalFrequencyHz, bandLowHz: t.bandLowHz, bandHighHz: t.bandHighHz,
    referenceShape: t.referenceShape ? r.channels.map((c) => t.referenceShape?.[c] ?? Number.NaN) : null,
  }));
  const candidates = r.modes.map((m) => ({ frequencyHz: m.frequencyHz, shape: m.shapeComplex }));
  const { assignments } = assignModes(targets, candidates);
  return tracked.map((t, j) => ({
    trackedModeId: t.id, modeIndex: assignments[j].mode, mac: assignments[j].mac,
    frequencyDeviation: assignments[j].frequencyDeviation, cost: assignments[j].cost,
  }));
}
