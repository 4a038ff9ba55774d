/**
 * The asset's condition in plain words (issue 6 §1), from the drift view: which mode is how
 * far from its temperature-compensated baseline, for how many days, and what became of the
 * alert. Pure: the Overview and the tests give it the view and the open alerts.
 *
 * Rules:
 * - a mode is "beyond" on a day when its daily EWMA is beyond its limits (lib/stats, the
 *   drift monitor); "for N days" counts the calendar days from the first to the last day of
 *   the run of consecutive beyond days that ends at the mode's latest day (inclusive);
 * - the size of the shift is the mean of the daily residuals over that run, as a percent of
 *   the mode's nominal frequency (a daily mean, so one noisy record does not set it);
 * - modes are numbered 1, 2, … in the order of the view (by nominal frequency).
 */
import type { AlertState, BaselineStatus } from "@/lib/domain/drift";
import type { AssetCondition } from "@/lib/domain/types";

const DAY_MS = 86_400_000;

/** The parts of the drift view (lib/services/drift/drift-view.service.ts) the reason reads. */
export interface ReasonView {
  condition: AssetCondition;
  skipped: string | null;
  baseline: { version: number; status: BaselineStatus } | null;
  modes: {
    label: string;
    nominalHz: number;
    daily: { dayMs: number; residualHz: number | null; beyond: boolean }[];
  }[];
  t2: { dayMs: number; beyond: boolean }[];
}

export interface ReasonContext {
  /** The condition stored on the asset (what the Portfolio shows). */
  condition: AssetCondition;
  openAlerts: { id: string; state: AlertState; raisedAt: Date }[];
  /** Start of the newest accepted record, null when none. */
  lastAcceptedAt: Date | null;
  expectedIntervalMin: number;
  now: Date;
}

export interface ModeShift { number: number; label: string; shiftPct: number; days: number; sinceMs: number }

export interface ConditionReason {
  /** One or more sentences, the first one the headline. */
  sentences: string[];
  /** Modes currently beyond their limits (most shifted first). */
  shifts: ModeShift[];
}

export const modeName = (number: number, label: string) => `Mode ${number} (${label})`;

const pct = (x: number) => `${Math.abs(x).toFixed(1)} %`;
const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? "" : "s"}`;

/** The run of consecutive beyond days ending at the last daily point, or null. */
function currentRun<T extends { dayMs: number; beyond: boolean }>(daily: T[]): T[] | null {
  let i = daily.length - 1;
  while (i >= 0 && daily[i].beyond) i--;
  const run = daily.slice(i + 1);
  return run.length > 0 ? run : null;
}

const daysOf = (run: { dayMs: number }[]) => Math.round((run[run.length - 1].dayMs - run[0].dayMs) / DAY_MS) + 1;

/** Modes whose EWMA is beyond its limits on their latest day, with the size and length of the shift. */
export function currentShifts(view: Pick<ReasonView, "modes">): ModeShift[] {
  const out: ModeShift[] = [];
  view.modes.forEach((m, j) => {
    const run = currentRun(m.daily);
    if (!run) return;
    const r = run.map((d) => d.residualHz).filter((x): x is number => x !== null && Number.isFinite(x));
    if (r.length === 0 || !(m.nominalHz > 0)) return;
    const mean = r.reduce((s, x) => s + x, 0) / r.length;
    out.push({ number: j + 1, label: m.label, shiftPct: (100 * mean) / m.nominalHz, days: daysOf(run), sinceMs: run[0].dayMs });
  });
  return out.sort((a, b) => Math.abs(b.shiftPct) - Math.abs(a.shiftPct));
}

function alertClause(alerts: ReasonContext["openAlerts"]): string | null {
  if (alerts.length === 0) return null;
  const states = new Set(alerts.map((a) => a.state));
  if (states.has("inspection_scheduled")) return "an alert is open and an inspection is scheduled";
  if (states.has("acknowledged")) return "an alert is open and acknowledged";
  return "an alert is open";
}

function shiftPhrase(s: ModeShift): string {
  return `${modeName(s.number, s.label)} is ${pct(s.shiftPct)} ${s.shiftPct < 0 ? "below" : "above"} its temperature-compensated baseline for ${plural(s.days, "day")}`;
}

/** "a", "a and b", "a, b and c". */
function joinList(parts: string[]): string {
  return parts.length <= 1 ? parts.join("") : `${parts.slice(0, -1).join(", ")} and ${parts[parts.length - 1]}`;
}

/**
 * The most shifted mode in full; the others shifted the same way briefly ("as are Mode 1
 * (1st lateral, 1.0 %) …", their duration only when it differs); any shifted the other way
 * in a clause of their own.
 */
function shiftsSentence(shifts: ModeShift[]): string {
  const [first, ...rest] = shifts;
  const same = rest.filter((s) => Math.sign(s.shiftPct) === Math.sign(first.shiftPct));
  const other = rest.filter((s) => Math.sign(s.shiftPct) !== Math.sign(first.shiftPct));
  const brief = (s: ModeShift) => `Mode ${s.number} (${s.label}, ${pct(s.shiftPct)}${s.days !== first.days ? ` for ${plural(s.days, "day")}` : ""})`;
  let text = shiftPhrase(first);
  if (same.length > 0) text += `, as ${same.length === 1 ? "is" : "are"} ${joinList(same.map(brief))}`;
  if (other.length > 0) text += `; ${joinList(other.map(shiftPhrase))}`;
  return text;
}

/** The plain-words reason for the asset's condition (see the module header for the rules). */
export function describeCondition(view: ReasonView | null, ctx: ReasonContext): ConditionReason {
  const sentences: string[] = [];
  const shifts = view && !view.skipped ? currentShifts(view) : [];
  const alert = alertClause(ctx.openAlerts);
  const intervalH = ctx.expectedIntervalMin / 60;

  if (ctx.condition === "silent") {
    const since = ctx.lastAcceptedAt;
    const days = since ? Math.floor((ctx.now.getTime() - since.getTime()) / DAY_MS) : null;
    sentences.push(
      since
        ? `No accepted record for ${days === 0 ? "less than a day" : plural(days ?? 0, "day")} (the last one started ${since.toISOString().slice(0, 16).replace("T", " ")} UTC); a record is expected at least every ${intervalH % 1 === 0 ? plural(intervalH, "hour") : `${ctx.expectedIntervalMin} minutes`}.`
        : "No accepted record has arrived yet.",
    );
  } else if (ctx.condition === "commissioning" || !view || !view.baseline) {
    sentences.push("No baseline yet: modes are identified, but drift is judged only once an engineer fits a baseline.");
    if (view?.skipped && view.baseline) sentences.push(`No statistics: ${view.skipped}.`);
  } else if (view.skipped) {
    sentences.push(`No drift statistics could be computed: ${view.skipped}.`);
  } else if (shifts.length > 0) {
    const head = shiftsSentence(shifts);
    const tail = ctx.condition === "watch" && !alert ? "not confirmed yet" : alert;
    sentences.push(`${head}${tail ? `; ${tail}` : ""}.`);
  } else {
    const t2Run = currentRun(view.t2);
    if (t2Run) {
      sentences.push(`The tracked modes together (Hotelling T²) are beyond their limit for ${plural(daysOf(t2Run), "day")}, though no single mode is${alert ? `; ${alert}` : ""}.`);
    } else {
      sentences.push("Every tracked mode is within its temperature-compensated range on its latest day.");
      if (alert) sentences.push(`The alert raised ${ctx.openAlerts[0].raisedAt.toISOString().slice(0, 10)} is still ${ctx.openAlerts[0].state === "open" ? "open" : ctx.openAlerts[0].state.replace("_", " ")}: an inspector closes it after the inspection.`);
    }
  }
  if (view?.baseline && view.baseline.status === "provisional") {
    sentences.push(`Baseline version ${view.baseline.version} is provisional: its training window covers less than a full year of seasons.`);
  }
  return { sentences, shifts };
}
