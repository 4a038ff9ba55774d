/**
 * The owners' summary of an asset report in plain language: the condition, what was found
 * and what was done (alerts and their outcomes). Shared by the PDF and the print page so
 * both say the same thing.
 */
import type { AlertOutcome, AlertState } from "@/lib/domain/drift";
import type { AssetCondition } from "@/lib/domain/types";
import type { AssetReport, ReportAlert } from "./report-data";

export interface ReportSummary {
  conditionWord: string;
  condition: string;
  found: string[];
  done: string[];
}

export const CONDITION_WORDS: Record<AssetCondition, string> = {
  commissioning: "Commissioning",
  steady: "Steady",
  watch: "Watch",
  alert: "Alert",
  silent: "Silent",
};

const CONDITION_TEXT: Record<AssetCondition, string> = {
  commissioning: "The monitoring is still learning how this structure normally vibrates: no baseline has been set yet, so no drift can be judged.",
  steady: "The structure's vibration stayed within its usual range once the effect of temperature is allowed for. Nothing calls for action.",
  watch: "Some vibration frequencies have started to move away from their usual range. This is an early warning, not yet confirmed; the engineers keep watching it.",
  alert: "A persistent change in how the structure vibrates has been confirmed after allowing for temperature. An inspection has been asked for.",
  silent: "No usable measurement has arrived for longer than expected. The monitoring equipment needs attention; the structure's condition cannot be judged meanwhile.",
};

export const OUTCOME_WORDS: Record<AlertOutcome, string> = {
  no_defect_found: "inspected, no defect found",
  environmental_cause: "explained by an environmental cause",
  sensor_fault: "traced to a sensor fault",
  defect_found: "a defect was found",
  repaired: "repaired",
};

export const STATE_WORDS: Record<AlertState, string> = {
  open: "open, not yet acknowledged",
  acknowledged: "acknowledged by the team",
  inspection_scheduled: "inspection scheduled",
  closed: "closed",
};

export const formatDay = (ms: number): string => new Date(ms).toISOString().slice(0, 10);

/** One sentence on an alert: when it was raised, where it stands, what was found. */
export function describeAlert(a: ReportAlert): string {
  const modes = a.modesBeyond.length ? ` (${a.modesBeyond.join(", ")})` : "";
  let s = `Alert raised on ${formatDay(a.raisedAtMs)}${modes}: `;
  if (a.state === "closed") {
    s += `closed${a.closedAtMs !== null ? ` on ${formatDay(a.closedAtMs)}` : ""}, ${a.outcome ? OUTCOME_WORDS[a.outcome] : "no outcome recorded"}.`;
  } else if (a.state === "inspection_scheduled" && a.inspectionAtMs !== null) {
    s += `inspection scheduled for ${formatDay(a.inspectionAtMs)}.`;
  } else {
    s += `${STATE_WORDS[a.state]}.`;
  }
  if (a.findings) s += ` Findings: ${a.findings}`;
  return s;
}

/** The summary (see the file header). */
export function summariseReport(r: AssetReport): ReportSummary {
  const found: string[] = [];
  const moved = r.modes.filter((m) => m.sustainedChangePct !== null && m.minimalShift !== null && Math.abs(m.sustainedChangePct) >= m.minimalShift.shiftPct);
  for (const m of moved) {
    const dir = (m.sustainedChangePct ?? 0) < 0 ? "lower" : "higher";
    found.push(`${m.label} has vibrated ${Math.abs(m.sustainedChangePct ?? 0).toFixed(2)} % ${dir === "lower" ? "below" : "above"} its expected frequency for the temperature over recent days, `
      + `more than the smallest change the monitoring can confirm (${m.minimalShift?.shiftPct.toFixed(2)} %).`
      + (dir === "lower" ? " A lower frequency can mean a loss of stiffness, or an environmental or sensor effect." : ""));
  }
  if (r.modes.length > 0 && moved.length === 0 && r.baseline) found.push("No tracked mode moved by more than the smallest change the monitoring can confirm.");
  const raisedInPeriod = r.alerts.filter((a) => a.raisedAtMs >= r.period.fromMs && a.raisedAtMs < r.period.toMs).length;
  found.push(raisedInPeriod === 0 ? "No new alert was raised in this period." : `${raisedInPeriod} alert${raisedInPeriod > 1 ? "s were" : " was"} raised in this period.`);
  const av = r.availability;
  if (av.coverage !== null) {
    found.push(`${av.accepted} usable measurement${av.accepted === 1 ? "" : "s"} of about ${av.expected} expected (${Math.round(av.coverage * 100)} %)`
      + (av.rejected > 0 ? `; ${av.rejected} rejected by the quality check.` : "."));
  }
  if (r.driftSkipped && r.baseline) found.push(`Drift statistics could not be computed: ${r.driftSkipped}.`);
  const done = r.alerts.map(describeAlert);
  if (done.length === 0) done.push("Nothing needed doing: no alert was open in this period.");
  return { conditionWord: CONDITION_WORDS[r.asset.condition], condition: CONDITION_TEXT[r.asset.condition], found, done };
}
