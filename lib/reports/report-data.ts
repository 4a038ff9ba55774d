/**
 * What an asset report shows, as plain data: gathered by lib/services/reports/report.service.ts,
 * laid out by the PDF writer and the print page. Frequencies in Hz, damping ratios as
 * fractions, times as ms UTC.
 */
import type { AlertOutcome, AlertState } from "@/lib/domain/drift";
import type { AssetCondition } from "@/lib/domain/types";

export interface ReportModeSeries {
  /** Identified frequency per accepted record or imported row. */
  points: { atMs: number; frequencyHz: number; predictedHz: number | null; dampingRatio: number | null }[];
  /** Daily mean residual after temperature compensation with its EWMA and limits. */
  daily: { dayMs: number; residualHz: number; ewma: number; ewmaLcl: number; ewmaUcl: number }[];
}

export interface ReportMode {
  trackedModeId: string;
  label: string;
  nominalHz: number;
  latestHz: number | null;
  latestAtMs: number | null;
  medianHz: number | null;
  medianDampingRatio: number | null;
  /** Accepted records / rows of the period in which the mode was identified. */
  identified: number;
  accepted: number;
  /** identified / accepted, or null without accepted rows. */
  identificationRate: number | null;
  /**
   * Sustained change at the end of the period: the last daily EWMA of the residual after
   * temperature compensation, less its in-control centre, as % of the nominal frequency
   * (the same terms as minimalShift, so the two compare).
   */
  sustainedChangePct: number | null;
  /** Smallest sustained shift the EWMA detects (ARL ≈ 500 design). */
  minimalShift: { shiftHz: number; shiftPct: number } | null;
  /** Baseline fit of this mode, if any. */
  fit: { kind: string; residualStdHz: number; n: number; slopeHzPerC: number; temperatureRangeC: [number, number] } | null;
  series: ReportModeSeries;
}

export interface ReportAlert {
  id: string;
  raisedAtMs: number;
  state: AlertState;
  outcome: AlertOutcome | null;
  closedAtMs: number | null;
  inspectionAtMs: number | null;
  findings: string | null;
  rule: string | null;
  /** Labels of the modes beyond their limits at raise time. */
  modesBeyond: string[];
}

export interface ReportAvailability {
  /** Records or rows expected in the period from the asset's expected interval. */
  expected: number;
  /** Accepted (quality passed) records and imported rows. */
  accepted: number;
  /** Records rejected by the quality screen. */
  rejected: number;
  /** Of the accepted, how many came from gateway records (the rest are imported). */
  fromRecords: number;
  /** accepted / expected, capped at 1, or null when nothing was expected. */
  coverage: number | null;
  /** Longest time without an accepted record inside the period, hours. */
  longestGapH: number | null;
}

export interface AssetReport {
  generatedAtMs: number;
  period: { fromMs: number; toMs: number };
  organisationName: string;
  asset: {
    id: string; name: string; kind: string; material: string | null; mainDimensionM: number | null;
    expectedIntervalMin: number; condition: AssetCondition;
  };
  baseline: { version: number; trainingFromMs: number; trainingToMs: number; status: string } | null;
  /** Why no drift statistics exist (no baseline, too little data), else null. */
  driftSkipped: string | null;
  modes: ReportMode[];
  alerts: ReportAlert[];
  availability: ReportAvailability;
  caution: string;
  /** Link to the asset in the app. */
  link: string;
}
