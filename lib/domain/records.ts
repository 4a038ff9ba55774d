/**
 * Domain types of uploaded records, their analyses and the modes tracked on an asset.
 * Server objects carry `Date`; the `…Json` variants are what the API returns.
 */
import type { QualityReport } from "@/lib/signal/quality";

export const RECORD_STATUSES = ["received", "queued", "analysing", "analysed", "rejected", "failed"] as const;
export type RecordStatus = (typeof RECORD_STATUSES)[number];

export const ACCELERATION_UNITS = ["m/s2", "g", "mg"] as const;
export type RecordUnits = (typeof ACCELERATION_UNITS)[number];

/** How the raw samples are stored: CSV text with a header row, or float32 little-endian interleaved. */
export type DataFormat = "csv" | "f32le";

export interface RecordEnvironment {
  windSpeedMps?: number;
  humidityPct?: number;
}

/** One uploaded ambient record (metadata, where its samples are, its analysis status). */
export interface VibrationRecord {
  id: string;
  organisationId: string;
  assetId: string;
  gatewayId: string;
  /** The gateway's own id of the record, unique per gateway. */
  gatewayRecordId: string;
  startedAt: Date;
  sampleRateHz: number;
  /** Channel codes in column order. */
  channels: string[];
  units: RecordUnits;
  temperatureC: number | null;
  environment: RecordEnvironment;
  /** Hex SHA-256 of the data part after gzip decompression. */
  contentHash: string;
  /** Storage key of the raw samples; NO_RAW_SAMPLES_BLOB_KEY when none are kept. */
  blobKey: string;
  dataFormat: DataFormat;
  /** Size of the stored (decompressed) data, bytes. */
  byteSize: number;
  /** Samples per channel. */
  sampleCount: number;
  durationS: number;
  status: RecordStatus;
  /** Analysis progress, fraction in [0, 1]. */
  progress: number;
  failureReason: string | null;
  /** Settings version of the latest analysis, null before the first. */
  analysedSettingsVersion: number | null;
  createdAt: Date;
  updatedAt: Date;
}

/** Analysis settings values (stored as JSON, versioned per asset). */
export interface AnalysisSettingsValues {
  /** Frequency band of interest [lo, hi] in Hz; null = the whole spectrum. */
  bandHz: [number, number] | null;
  /** Decimate (zero-phase FIR, integer factor) to about this rate before analysis, Hz; null = none. */
  decimationTargetHz: number | null;
  /** Welch segment length (power of two); null = automatic from the lowest tracked mode. */
  nperseg: number | null;
  /** Welch segment overlap as a fraction in [0, 0.9]; absent = the engine's default (0.5). */
  overlap?: number;
  methods: ("fdd" | "ssi")[];
  quality: { flatRunS?: number; spikeSigma?: number; minRms?: number; fullScale?: number };
}

export interface AnalysisSettings {
  id: string;
  assetId: string;
  version: number;
  settings: AnalysisSettingsValues;
  createdByUserId: string | null;
  createdAt: Date;
}

export interface TrackedMode {
  id: string;
  assetId: string;
  label: string;
  nominalFrequencyHz: number;
  bandLowHz: number;
  bandHighHz: number;
  /** Reference shape by channel code, or null (frequency band only). */
  referenceShape: Record<string, number> | null;
  /** False once deactivated: no longer assigned in new analyses; its history stays. */
  active: boolean;
  /** The record and mode index it was taken from ("track this mode"), or null (entered by hand). */
  sourceRecordId: string | null;
  sourceModeIndex: number | null;
  createdAt: Date;
  updatedAt: Date;
}

/** One pole of the SSI-COV stabilisation diagram, compact: [order, frequency Hz, damping ratio, label]. */
export type StabilisationPointTuple = [number, number, number, "new" | "f" | "fd" | "fv" | "fdv"];

/** H1 FRF of one response channel against the force channel, downsampled for display. */
export interface FrfChannelData {
  channel: string;
  magnitude: number[];
  phaseRad: number[];
  coherence: number[];
}

/** Display data stored beside a result (null fields: not applicable). */
export interface AnalysisExtras {
  stabilisation: StabilisationPointTuple[] | null;
  frf: { forceChannel: string; frequencyHz: number[]; channels: FrfChannelData[] } | null;
}

export type QualityVerdictKind = "accept" | "accept_without" | "reject";

export interface AnalysisResult {
  id: string;
  recordId: string;
  settingsVersion: number;
  verdict: QualityVerdictKind;
  quality: QualityReport;
  channelsUsed: string[];
  spectral: { nperseg: number; noverlap: number; lineSpacingHz: number; averages: number };
  singularValues: { frequencyHz: number[]; s1: number[]; s2: number[] | null; s3: number[] | null };
  warnings: string[];
  timingsMs: Record<string, number>;
  engineVersion: string;
  /** Stabilisation diagram and FRF data, or null when neither was produced. */
  extras: AnalysisExtras | null;
  analysedAt: Date;
}

/** A mode identified in one analysis result. */
export interface StoredMode {
  id: string;
  resultId: string;
  modeIndex: number;
  frequencyHz: number;
  dampingRatio: number | null;
  dampingMethod: "efdd" | "half-power" | "ssi-cov" | null;
  dampingReliable: boolean;
  mpc: number;
  /** Real shape by channel code (max |value| = 1). */
  shape: Record<string, number>;
  shapeComplex: { re: Record<string, number>; im: Record<string, number> };
  /** Per-estimator values (fdd, efdd, halfPower, ssi, reliability) as the engine gave them. */
  estimates: Record<string, unknown>;
  possiblyCoupled: boolean;
}

/** A tracked mode's outcome in one result: the identified mode assigned to it, or none. */
export interface ModeAssignment {
  id: string;
  resultId: string;
  trackedModeId: string;
  identifiedModeId: string | null;
  mac: number | null;
  /** (f − f_nominal) / f_nominal. */
  frequencyDeviation: number | null;
  cost: number | null;
}

/** JSON form of a record for the API. */
export interface RecordJson extends Omit<VibrationRecord, "startedAt" | "createdAt" | "updatedAt" | "blobKey"> {
  startedAt: string;
  createdAt: string;
  updatedAt: string;
}

export function toRecordJson(r: VibrationRecord): RecordJson {
  const { blobKey: _blobKey, ...rest } = r;
  return { ...rest, startedAt: r.startedAt.toISOString(), createdAt: r.createdAt.toISOString(), updatedAt: r.updatedAt.toISOString() };
}

/**
 * Blob key of a record that carries results but no raw samples (the seeded demo history):
 * such a record cannot be analysed again.
 */
export const NO_RAW_SAMPLES_BLOB_KEY = "demo-history/none";

/** Whether the record's raw samples are stored, so that it can be reprocessed. */
export function hasRawSamples(record: { blobKey: string }): boolean {
  return record.blobKey !== NO_RAW_SAMPLES_BLOB_KEY;
}
