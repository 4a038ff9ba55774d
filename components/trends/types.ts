/**
 * What the Trends page hands to its client charts: the drift view of the asset (shape of
 * lib/services/drift/drift-view.service.ts DriftView, with the baseline reduced to its window).
 */
import type { DriftViewDaily } from "@/lib/domain/drift";

export interface TrendModel {
  kind: "linear" | "bilinear";
  knotC: number | null;
  interceptHz: number;
  slopeHzPerC: number;
  coldSlopeHzPerC: number | null;
  residualStdHz: number;
  lagHours: number | null;
  envelope: { temperatureC: [number, number] };
}

export interface TrendPoint {
  atMs: number;
  frequencyHz: number;
  temperatureC: number | null;
  outOfEnvelope: boolean;
}

/** The prediction band of one UTC day (x = noon): lowest lower and highest upper ±3 s edge, mean prediction. */
export interface TrendBandDay { x: number; lo: number; hi: number; mean: number }

export type TrendDaily = DriftViewDaily;

export interface TrendMode {
  trackedModeId: string;
  label: string;
  nominalHz: number;
  model: TrendModel | null;
  points: TrendPoint[];
  band: TrendBandDay[];
  daily: TrendDaily[];
  minimalShift: { shiftHz: number; shiftPct: number } | null;
  damping: { points: { atMs: number; dampingRatio: number }[]; median: number | null; lowerAdvisory: number | null; upperAdvisory: number | null };
}

export interface TrendsView {
  modes: TrendMode[];
  t2: { dayMs: number; t2: number; ucl: number; beyond: boolean }[];
  t2Ucl: number | null;
  /** Alert raise times to mark (stored alerts and the replay's). */
  alertTimesMs: number[];
  training: { fromMs: number; toMs: number } | null;
  /** Plotted x range, ms UTC. */
  xMinMs: number;
  xMaxMs: number;
  timeZone: string;
}
