/**
 * Reads for the Records list and the Record page (issue 4 §6). Everyone with
 * `portfolio:read` in the asset's organisation; results are JSON-ready (ISO strings), so a
 * server component can pass them to client components and a route can send them as they are.
 */
import { db } from "@/lib/db/knex";
import { listAssignmentsOfResult, listModesOfResult, listResultsOfRecord } from "@/lib/db/repos/analysis-result.repo";
import { findLatestAnalysisSettings } from "@/lib/db/repos/analysis-settings.repo";
import { listRecordSummariesOfAsset, type RecordSummaryRowOut } from "@/lib/db/repos/record-list.repo";
import { listTrackedModesOfAsset } from "@/lib/db/repos/tracked-mode.repo";
import {
  toRecordJson, type AnalysisExtras, type AnalysisResult, type RecordJson, type StoredMode,
} from "@/lib/domain/records";
import type { Actor } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { loadOwnAsset } from "@/lib/services/assets/asset.service";
import { assertCan, isUuid } from "@/lib/services/authz";
import type { ChannelQuality, QualityVerdict } from "@/lib/signal/quality";
import { loadRecordOfAsset } from "./reprocess.service";
import type { ListRecordsQuery } from "./schemas";
import { downsampleSpectra, type SpectraJson } from "./spectra";

export interface RecordSummary {
  record: RecordJson;
  latest: RecordSummaryRowOut["latest"];
}

export interface RecordPage { records: RecordSummary[]; nextCursor: string | null }

const encodeCursor = (startedAt: string, id: string) => Buffer.from(`${startedAt}|${id}`, "utf8").toString("base64url");

function decodeCursor(cursor: string): { startedAt: Date; id: string } {
  const [at, id] = Buffer.from(cursor, "base64url").toString("utf8").split("|");
  const startedAt = new Date(at ?? "");
  if (!id || !isUuid(id) || Number.isNaN(startedAt.getTime())) {
    throw new AppError("unprocessable", "The cursor is not valid.", { fieldErrors: { cursor: ["Start again from the first page."] } });
  }
  return { startedAt, id };
}

/** One page of the asset's records, newest first, with the latest analysis summary; `nextCursor` null at the end. */
export async function listRecords(actor: Actor, assetId: string, query: Partial<ListRecordsQuery> & { limit?: number }): Promise<RecordPage> {
  assertCan(actor, "portfolio:read");
  const asset = await loadOwnAsset(actor, assetId);
  const limit = Math.min(Math.max(Math.trunc(query.limit ?? 50), 1), 200);
  const rows = await listRecordSummariesOfAsset(db(), asset.id, {
    status: query.status, from: query.from, to: query.to, after: query.cursor ? decodeCursor(query.cursor) : undefined, limit: limit + 1,
  });
  const page = rows.slice(0, limit);
  const last = page[page.length - 1];
  return {
    records: page.map((r) => ({ record: toRecordJson(r.record), latest: r.latest })),
    nextCursor: rows.length > limit && last ? encodeCursor(last.record.startedAt.toISOString(), last.record.id) : null,
  };
}

export interface TrackedModeOutcome {
  trackedModeId: string;
  label: string;
  nominalFrequencyHz: number;
  bandLowHz: number;
  bandHighHz: number;
  active: boolean;
  /** Whether this result sought the mode (false: tracked after this analysis). */
  sought: boolean;
  identified: boolean;
  modeIndex: number | null;
  frequencyHz: number | null;
  mac: number | null;
  frequencyDeviation: number | null;
}

export type ModeJson = Omit<StoredMode, "id" | "resultId"> & {
  /** The tracked mode this identified mode was assigned to, or null (unassigned, kept and shown). */
  trackedModeId: string | null;
  trackedLabel: string | null;
  macToTracked: number | null;
};

export interface RecordAnalysisDetail {
  settingsVersion: number;
  verdict: AnalysisResult["verdict"];
  qualityVerdict: QualityVerdict;
  /** Flags and figures per channel (non-finite, gap, clipping, flat line, spikes, hum, RMS). */
  channelQuality: ChannelQuality[];
  channelsUsed: string[];
  spectral: AnalysisResult["spectral"];
  warnings: string[];
  engineVersion: string;
  analysedAt: string;
  modes: ModeJson[];
  trackedModes: TrackedModeOutcome[];
  /** s₁…s₃ (s₂/s₃ null with too few channels), downsampled to ≤ 1024 lines keeping peaks. */
  singularValues: SpectraJson;
  stabilisation: AnalysisExtras["stabilisation"];
  frf: AnalysisExtras["frf"];
}

export interface RecordDetail {
  record: RecordJson;
  /** The asset's current settings version (a reprocess would use it). */
  currentSettingsVersion: number | null;
  /** Settings versions this record has results for, newest first. */
  resultVersions: number[];
  analysis: RecordAnalysisDetail | null;
}

/**
 * A record of the asset with one of its results (`settingsVersion`, else the newest): modes
 * with their assignments, per-channel quality, spectra, stabilisation and FRF data.
 */
export async function getRecordDetail(
  actor: Actor, assetId: string, recordId: string, opts: { settingsVersion?: number } = {},
): Promise<RecordDetail> {
  assertCan(actor, "portfolio:read");
  const { asset, record } = await loadRecordOfAsset(actor, assetId, recordId);
  const [results, settings] = await Promise.all([listResultsOfRecord(db(), record.id), findLatestAnalysisSettings(db(), asset.id)]);
  const result = opts.settingsVersion === undefined ? results[0] : results.find((r) => r.settingsVersion === opts.settingsVersion);
  if (opts.settingsVersion !== undefined && !result) throw new AppError("not_found", "No result with this settings version.");
  return {
    record: toRecordJson(record),
    currentSettingsVersion: settings?.version ?? null,
    resultVersions: results.map((r) => r.settingsVersion),
    analysis: result ? await analysisDetail(result, asset.id) : null,
  };
}

async function analysisDetail(result: AnalysisResult, assetId: string): Promise<RecordAnalysisDetail> {
  const [modes, assignments, tracked] = await Promise.all([
    listModesOfResult(db(), result.id), listAssignmentsOfResult(db(), result.id), listTrackedModesOfAsset(db(), assetId, { includeInactive: true }),
  ]);
  const trackedById = new Map(tracked.map((t) => [t.id, t]));
  const assignmentByMode = new Map(assignments.filter((a) => a.identifiedModeId).map((a) => [a.identifiedModeId as string, a]));
  const modeById = new Map(modes.map((m) => [m.id, m]));
  const trackedModes = tracked.flatMap((t): TrackedModeOutcome[] => {
    const a = assignments.find((x) => x.trackedModeId === t.id);
    if (!a && !t.active) return [];
    const m = a?.identifiedModeId ? modeById.get(a.identifiedModeId) ?? null : null;
    return [{
      trackedModeId: t.id, label: t.label, nominalFrequencyHz: t.nominalFrequencyHz, bandLowHz: t.bandLowHz, bandHighHz: t.bandHighHz,
      active: t.active, sought: a !== undefined, identified: m !== null, modeIndex: m?.modeIndex ?? null, frequencyHz: m?.frequencyHz ?? null,
      mac: a?.mac ?? null, frequencyDeviation: a?.frequencyDeviation ?? null,
    }];
  });
  return {
    settingsVersion: result.settingsVersion, verdict: result.verdict, qualityVerdict: result.quality.verdict,
    channelQuality: result.quality.channels, channelsUsed: result.channelsUsed, spectral: result.spectral, warnings: result.warnings,
    engineVersion: result.engineVersion, analysedAt: result.analysedAt.toISOString(),
    modes: modes.map(({ id, resultId: _r, ...m }) => {
      const a = assignmentByMode.get(id);
      return { ...m, trackedModeId: a?.trackedModeId ?? null, trackedLabel: a ? trackedById.get(a.trackedModeId)?.label ?? null : null, macToTracked: a?.mac ?? null };
    }),
    trackedModes,
    singularValues: downsampleSpectra(result.singularValues, 1024),
    stabilisation: result.extras?.stabilisation ?? null,
    frf: result.extras?.frf ?? null,
  };
}
