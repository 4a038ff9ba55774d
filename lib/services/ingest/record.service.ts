/**
 * Reading one record with its latest analysis: for the gateway that sent it (status,
 * quality, results) and for members of its organisation (the same plus the singular value
 * spectra). Any other caller gets not_found, so ids reveal nothing.
 */
import { db } from "@/lib/db/knex";
import { listAssignmentsOfResult, listModesOfResult, listResultsOfRecord } from "@/lib/db/repos/analysis-result.repo";
import { findRecordById } from "@/lib/db/repos/record.repo";
import { listTrackedModesOfAsset } from "@/lib/db/repos/tracked-mode.repo";
import { toRecordJson, type AnalysisResult, type RecordJson, type StoredMode, type VibrationRecord } from "@/lib/domain/records";
import type { Actor } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import type { DeviceActor } from "@/lib/services/assets/gateway.service";
import { assertCan, assertSameOrg, isUuid } from "@/lib/services/authz";

export interface TrackedModeOutcomeJson {
  trackedModeId: string;
  label: string;
  nominalFrequencyHz: number;
  identified: boolean;
  modeIndex: number | null;
  frequencyHz: number | null;
  mac: number | null;
  frequencyDeviation: number | null;
}

export interface AnalysisJson {
  settingsVersion: number;
  verdict: AnalysisResult["verdict"];
  quality: AnalysisResult["quality"];
  channelsUsed: string[];
  spectral: AnalysisResult["spectral"];
  warnings: string[];
  engineVersion: string;
  analysedAt: string;
  modes: Omit<StoredMode, "id" | "resultId">[];
  trackedModes: TrackedModeOutcomeJson[];
  singularValues?: AnalysisResult["singularValues"];
}

export interface RecordView {
  record: RecordJson;
  analysis: AnalysisJson | null;
}

const notFound = () => new AppError("not_found", "No such record.");

export async function getRecordForDevice(device: DeviceActor, recordId: string): Promise<RecordView> {
  const record = isUuid(recordId) ? await findRecordById(db(), recordId) : null;
  if (!record || record.gatewayId !== device.gatewayId) throw notFound();
  return viewOf(record, false);
}

export async function getRecordForActor(actor: Actor, recordId: string): Promise<RecordView> {
  assertCan(actor, "portfolio:read");
  const record = isUuid(recordId) ? await findRecordById(db(), recordId) : null;
  assertSameOrg(actor, record, "record");
  return viewOf(record, true);
}

async function viewOf(record: VibrationRecord, withSpectra: boolean): Promise<RecordView> {
  const [latest] = await listResultsOfRecord(db(), record.id);
  if (!latest) return { record: toRecordJson(record), analysis: null };
  const [modes, assignments, tracked] = await Promise.all([
    listModesOfResult(db(), latest.id), listAssignmentsOfResult(db(), latest.id), listTrackedModesOfAsset(db(), record.assetId, { includeInactive: true }),
  ]);
  const modeById = new Map(modes.map((m) => [m.id, m]));
  const trackedModes = tracked.flatMap((t): TrackedModeOutcomeJson[] => {
    const a = assignments.find((x) => x.trackedModeId === t.id);
    if (!a) return [];
    const m = a.identifiedModeId ? modeById.get(a.identifiedModeId) ?? null : null;
    return [{
      trackedModeId: t.id, label: t.label, nominalFrequencyHz: t.nominalFrequencyHz, identified: m !== null,
      modeIndex: m?.modeIndex ?? null, frequencyHz: m?.frequencyHz ?? null, mac: a.mac, frequencyDeviation: a.frequencyDeviation,
    }];
  });
  const analysis: AnalysisJson = {
    settingsVersion: latest.settingsVersion, verdict: latest.verdict, quality: latest.quality, channelsUsed: latest.channelsUsed,
    spectral: latest.spectral, warnings: latest.warnings, engineVersion: latest.engineVersion,
    analysedAt: latest.analysedAt.toISOString(),
    modes: modes.map(({ id: _id, resultId: _r, ...m }) => m),
    trackedModes,
    ...(withSpectra ? { singularValues: latest.singularValues } : {}),
  };
  return { record: toRecordJson(record), analysis };
}
