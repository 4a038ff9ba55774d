/**
 * Plain data of the Analysis screen (what the client parts receive) and the period of the
 * identification rates read from the URL: days of the organisation, the last one inclusive.
 */
import { zonedDayStart } from "@/components/records/zoned-day";
import type { AnalysisSettingsValues } from "@/lib/domain/records";

const DAY_MS = 86_400_000;

/** YYYY-MM-DD of instant `d` in `timeZone`. */
export function dayIn(d: Date, timeZone: string): string {
  return new Intl.DateTimeFormat("en-CA", { timeZone, year: "numeric", month: "2-digit", day: "2-digit" }).format(d);
}

export interface RatePeriod { fromDay: string; toDay: string; from: Date; to: Date; errors: Record<string, string[]> }

/** The period from `?from=&to=` (days), by default the last `defaultDays` days up to today. */
export function ratePeriodOf(fromParam: string | undefined, toParam: string | undefined, timeZone: string, now: Date, defaultDays: number): RatePeriod {
  const errors: Record<string, string[]> = {};
  const today = dayIn(now, timeZone);
  let toDay = toParam ?? today;
  let to = zonedDayStart(toDay, timeZone, 1);
  if (!to) {
    errors.to = ["Use a day such as 2026-03-31."];
    toDay = today;
    to = zonedDayStart(today, timeZone, 1) ?? now;
  }
  let fromDay = fromParam ?? dayIn(new Date(to.getTime() - defaultDays * DAY_MS), timeZone);
  let from = zonedDayStart(fromDay, timeZone);
  if (!from) errors.from = ["Use a day such as 2026-03-01."];
  if (from && from >= to) errors.to = ["The last day must not be before the first."];
  if (!from || from >= to) {
    fromDay = dayIn(new Date(to.getTime() - defaultDays * DAY_MS), timeZone);
    from = zonedDayStart(fromDay, timeZone) ?? new Date(to.getTime() - defaultDays * DAY_MS);
  }
  return { fromDay, toDay, from, to, errors };
}

const num = (v: number) => String(Number(v.toPrecision(6)));

/** One line per setting, for the read-only view and the version history. */
export function describeSettings(s: AnalysisSettingsValues): { label: string; value: string }[] {
  const q = s.quality;
  return [
    { label: "Band of interest", value: s.bandHz ? `${num(s.bandHz[0])}–${num(s.bandHz[1])} Hz` : "Whole spectrum" },
    { label: "Decimation target", value: s.decimationTargetHz ? `${num(s.decimationTargetHz)} Hz` : "None" },
    { label: "Segment length", value: s.nperseg ? `${s.nperseg} samples` : "Automatic" },
    { label: "Segment overlap", value: s.overlap !== undefined ? `${Math.round(s.overlap * 100)} %` : "Default (50 %)" },
    { label: "Methods", value: s.methods.map((m) => (m === "fdd" ? "FDD/EFDD" : "SSI-COV")).join(" + ") },
    { label: "Flat-line limit", value: q.flatRunS !== undefined ? `${num(q.flatRunS)} s` : "Default (1 s)" },
    { label: "Spike threshold", value: q.spikeSigma !== undefined ? `${num(q.spikeSigma)} σ` : "Default (10 σ)" },
    { label: "Minimum RMS", value: q.minRms !== undefined ? num(q.minRms) : "Default (1e-7)" },
    { label: "Sensor full scale", value: q.fullScale !== undefined ? num(q.fullScale) : "Not set" },
  ];
}

/** A tracked mode row as the client table receives it. */
export interface TrackedModeRowView {
  id: string;
  label: string;
  nominalFrequencyHz: number;
  bandLowHz: number;
  bandHighHz: number;
  source: { kind: "record"; recordId: string; modeIndex: number } | { kind: "design" };
  hasReferenceShape: boolean;
  active: boolean;
  sought: number;
  identified: number;
  rate: number | null;
  notSought: number;
  lastIdentifiedAt: string | null;
}
