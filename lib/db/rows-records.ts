/**
 * Rows of the record, analysis and tracked-mode tables and their mapping to domain objects
 * (the counterpart of rows.ts for these tables; repos select exactly these columns).
 */
import type {
  AnalysisExtras, AnalysisResult, AnalysisSettings, AnalysisSettingsValues, DataFormat, ModeAssignment, QualityVerdictKind,
  RecordEnvironment, RecordStatus, RecordUnits, StoredMode, TrackedMode, VibrationRecord,
} from "@/lib/domain/records";
import type { QualityReport } from "@/lib/signal/quality";

export interface RecordRow {
  id: string; organisation_id: string; asset_id: string; gateway_id: string; gateway_record_id: string;
  started_at: Date; sample_rate_hz: number; channels: string[]; units: RecordUnits; temperature_c: number | null;
  environment: RecordEnvironment | null; content_hash: string; blob_key: string; data_format: DataFormat;
  byte_size: number | string; sample_count: number; duration_s: number; status: RecordStatus; progress: number;
  failure_reason: string | null; analysed_settings_version: number | null; created_at: Date; updated_at: Date;
}
export interface AnalysisSettingsRow {
  id: string; asset_id: string; version: number; settings: AnalysisSettingsValues; created_by_user_id: string | null;
  created_at: Date;
}
export interface TrackedModeRow {
  id: string; asset_id: string; label: string; nominal_frequency_hz: number; band_low_hz: number; band_high_hz: number;
  reference_shape: Record<string, number> | null; active: boolean; source_record_id: string | null;
  source_mode_index: number | null; created_at: Date; updated_at: Date;
}
export interface AnalysisResultRow {
  id: string; record_id: string; settings_version: number; verdict: QualityVerdictKind; quality: QualityReport;
  channels_used: string[]; spectral: AnalysisResult["spectral"]; singular_values: AnalysisResult["singularValues"];
  warnings: string[]; timings_ms: Record<string, number>; engine_version: string; extras: AnalysisExtras | null;
  analysed_at: Date;
}
export interface IdentifiedModeRow {
  id: string; result_id: string; mode_index: number; frequency_hz: number; damping_ratio: number | null;
  damping_method: StoredMode["dampingMethod"]; damping_reliable: boolean; mpc: number; shape: Record<string, number>;
  shape_complex: StoredMode["shapeComplex"]; estimates: Record<string, unknown>; possibly_coupled: boolean;
}
export interface ModeAssignmentRow {
  id: string; result_id: string; tracked_mode_id: string; identified_mode_id: string | null; mac: number | null;
  frequency_deviation: number | null; cost: number | null;
}

export const toVibrationRecord = (r: RecordRow): VibrationRecord => ({
  id: r.id, organisationId: r.organisation_id, assetId: r.asset_id, gatewayId: r.gateway_id,
  gatewayRecordId: r.gateway_record_id, startedAt: r.started_at, sampleRateHz: r.sample_rate_hz, channels: r.channels,
  units: r.units, temperatureC: r.temperature_c, environment: r.environment ?? {}, contentHash: r.content_hash,
  blobKey: r.blob_key, dataFormat: r.data_format, byteSize: Number(r.byte_size), sampleCount: r.sample_count,
  durationS: r.duration_s, status: r.status, progress: r.progress, failureReason: r.failure_reason,
  analysedSettingsVersion: r.analysed_settings_version, createdAt: r.created_at, updatedAt: r.updated_at,
});

export const toAnalysisSettings = (r: AnalysisSettingsRow): AnalysisSettings => ({
  id: r.id, assetId: r.asset_id, version: r.version, settings: r.settings, createdByUserId: r.created_by_user_id,
  createdAt: r.created_at,
});

export const toTrackedMode = (r: TrackedModeRow): TrackedMode => ({
  id: r.id, assetId: r.asset_id, label: r.label, nominalFrequencyHz: r.nominal_frequency_hz, bandLowHz: r.band_low_hz,
  bandHighHz: r.band_high_hz, referenceShape: r.reference_shape, active: r.active, sourceRecordId: r.source_record_id,
  sourceModeIndex: r.source_mode_index, createdAt: r.created_at, updatedAt: r.updated_at,
});

export const toAnalysisResult = (r: AnalysisResultRow): AnalysisResult => ({
  id: r.id, recordId: r.record_id, settingsVersion: r.settings_version, verdict: r.verdict, quality: r.quality,
  channelsUsed: r.channels_used, spectral: r.spectral, singularValues: r.singular_values, warnings: r.warnings,
  timingsMs: r.timings_ms, engineVersion: r.engine_version, extras: r.extras ?? null,
  analysedAt: r.analysed_at,
});

export const toStoredMode = (r: IdentifiedModeRow): StoredMode => ({
  id: r.id, resultId: r.result_id, modeIndex: r.mode_index, frequencyHz: r.frequency_hz, dampingRatio: r.damping_ratio,
  dampingMethod: r.damping_method, dampingReliable: r.damping_reliable, mpc: r.mpc, shape: r.shape,
  shapeComplex: r.shape_complex, estimates: r.estimates, possiblyCoupled: r.possibly_coupled,
});

export const toModeAssignment = (r: ModeAssignmentRow): ModeAssignment => ({
  id: r.id, resultId: r.result_id, trackedModeId: r.tracked_mode_id, identifiedModeId: r.identified_mode_id,
  mac: r.mac, frequencyDeviation: r.frequency_deviation, cost: r.cost,
});
