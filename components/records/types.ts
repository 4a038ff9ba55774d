/**
 * Plain (JSON-safe) shapes the Records screens draw from. Pages map service results onto
 * these, so the client components never depend on server modules or `Date` objects.
 */
import type { RecordStatus } from "@/lib/domain/records";

/** One row of the Records list. */
export interface RecordRowView {
  id: string;
  gatewayRecordId: string;
  startedAt: string;
  status: RecordStatus;
  /** Fraction in [0, 1]. */
  progress: number;
  durationS: number;
  channelCount: number;
  temperatureC: number | null;
  verdict: "accept" | "accept_without" | "reject" | null;
  modeCount: number | null;
  failureReason: string | null;
}

export interface RecordPageView {
  records: RecordRowView[];
  /** Opaque cursor of the next (older) page, or null on the last page. */
  nextCursor: string | null;
}

export interface TrackedModeView {
  id: string;
  label: string;
  nominalFrequencyHz: number;
  bandLowHz: number;
  bandHighHz: number;
}

/** A channel of the sensor layout (position in metres, direction of measurement). */
export interface LayoutChannel {
  code: string;
  positionM: { x: number; y: number; z: number };
  direction: "x" | "y" | "z" | "-x" | "-y" | "-z";
}

/** One identified mode, with its estimates and its tracked-mode assignment. */
export interface ModeView {
  modeIndex: number;
  frequencyHz: number;
  dampingRatio: number | null;
  dampingMethod: "efdd" | "half-power" | "ssi-cov" | null;
  dampingReliable: boolean;
  mpc: number;
  possiblyCoupled: boolean;
  /** Real shape by channel code, max |value| = 1. */
  shape: Record<string, number>;
  fddPeakHz: number | null;
  efdd: { frequencyHz: number; dampingRatio: number } | null;
  halfPower: { dampingRatio: number; q: number; lossFactor: number } | null;
  ssi: { frequencyHz: number; dampingRatio: number; mac: number } | null;
  reliability: { bandwidthLines: number | null; cyclesInRecord: number } | null;
  tracked: { id: string; label: string; mac: number | null; frequencyDeviation: number | null } | null;
}

export interface ChannelQualityView {
  channel: string;
  flags: string[];
  rms: number;
  notes: string[];
}

export interface StabilisationPointView {
  order: number;
  frequencyHz: number;
  dampingRatio: number;
  stable: "new" | "f" | "fd" | "fv" | "fdv";
}

export interface FrfView {
  frequencyHz: number[];
  channels: { code: string; magnitude: number[]; phaseDeg: number[]; coherence: number[] | null }[];
}

export interface SpectraView {
  frequencyHz: number[];
  s1: number[];
  s2: number[] | null;
  s3: number[] | null;
}

export interface AnalysisView {
  settingsVersion: number;
  verdict: "accept" | "accept_without" | "reject";
  verdictNote: string | null;
  analysedAt: string;
  lineSpacingHz: number;
  averages: number;
  warnings: string[];
  spectra: SpectraView | null;
  modes: ModeView[];
  quality: ChannelQualityView[];
  stabilisation: StabilisationPointView[] | null;
  frf: FrfView | null;
}

export interface RecordDetailView {
  record: RecordRowView & { sampleRateHz: number; units: string; channels: string[]; analysedSettingsVersion: number | null };
  analysis: AnalysisView | null;
  trackedModes: TrackedModeView[];
  layout: LayoutChannel[];
}
