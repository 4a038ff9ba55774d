/** Domain types of issue 5: imported modal estimates, baselines and alerts. */
import type { BaselineModel } from "@/lib/stats/baseline-fit";

export type BaselineStatus = "provisional" | "complete" | "superseded";
export type BaselineModelChoice = "auto" | "linear" | "bilinear";

/** One tracked mode's fitted model inside a baseline version. */
export interface BaselineModeModel { trackedModeId: string; label: string; model: BaselineModel }

export interface Baseline {
  id: string;
  assetId: string;
  version: number;
  trainingFrom: Date;
  trainingTo: Date;
  status: BaselineStatus;
  requestedModel: BaselineModelChoice;
  models: BaselineModeModel[];
  createdByUserId: string | null;
  createdAt: Date;
  active: boolean;
}

export const ALERT_STATES = ["open", "acknowledged", "inspection_scheduled", "closed"] as const;
export type AlertState = (typeof ALERT_STATES)[number];
export const ALERT_OUTCOMES = ["no_defect_found", "environmental_cause", "sensor_fault", "defect_found", "repaired"] as const;
export type AlertOutcome = (typeof ALERT_OUTCOMES)[number];
export type AlertEventKind = "raised" | "acknowledged" | "inspection_scheduled" | "assigned" | "comment" | "closed" | "attachment";

export interface Alert {
  id: string;
  assetId: string;
  state: AlertState;
  outcome: AlertOutcome | null;
  raisedAt: Date;
  /** Snapshot at raise time (lib/stats AlertEvidence plus mode labels and baseline version). */
  evidence: Record<string, unknown>;
  assigneeUserId: string | null;
  inspectionAt: Date | null;
  closedAt: Date | null;
  findings: string | null;
  createdAt: Date;
  updatedAt: Date;
}

export interface AlertEvent {
  id: string;
  alertId: string;
  actorUserId: string | null;
  kind: AlertEventKind;
  details: Record<string, unknown>;
  at: Date;
}

/** One aggregated day of a tracked mode in the drift view (service) and on the Trends charts. */
export interface DriftViewDaily {
  dayMs: number;
  residualHz: number | null;
  residualLcl: number;
  residualUcl: number;
  ewma: number;
  ewmaLcl: number;
  ewmaUcl: number;
  beyond: boolean;
  residualBeyond: boolean;
  outOfEnvelope: boolean;
}
