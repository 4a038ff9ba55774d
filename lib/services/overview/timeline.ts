/**
 * The channel-availability timeline of the Overview: per configured channel and local day,
 * one state from the stored per-channel quality of the day's records:
 * - `removed`: the channel is out of service (inactive) on that day — from the day it was
 *   switched off (audit entry), or every day when that time is unknown — and carried no
 *   usable data that day;
 * - `dead`: every record of the day excluded the channel (flat line, clipping, gaps, invalid);
 * - `partial`: some records excluded it;
 * - `ok`: no record excluded it;
 * - `no_data`: no analysed record of the day carried the channel.
 */
import type { ChannelDay } from "@/lib/db/repos/overview.repo";
import type { SensorChannel } from "@/lib/domain/types";

const DAY_MS = 86_400_000;

export const CHANNEL_DAY_STATES = ["ok", "partial", "dead", "no_data", "removed"] as const;
export type ChannelDayState = (typeof CHANNEL_DAY_STATES)[number];

export interface ChannelTimelineCell { day: string; state: ChannelDayState; records: number; excluded: number; flags: string[] }
export interface ChannelTimelineRow { channel: string; active: boolean; cells: ChannelTimelineCell[] }

/** YYYY-MM-DD of an instant in a time zone. */
export function localDay(at: Date, timeZone: string): string {
  return new Intl.DateTimeFormat("en-CA", { timeZone, year: "numeric", month: "2-digit", day: "2-digit" }).format(at);
}

/** The instant a local day (YYYY-MM-DD) starts in a time zone (midnight, or the first instant after a DST gap). */
export function startOfLocalDay(day: string, timeZone: string): Date {
  const [y, m, d] = day.split("-").map(Number);
  const guess = Date.UTC(y, m - 1, d);
  // Offset of the zone at an instant: its wall-clock time read as UTC, minus the instant.
  const offsetAt = (t: number) => {
    const p = Object.fromEntries(new Intl.DateTimeFormat("en-US", {
      timeZone, hourCycle: "h23", year: "numeric", month: "2-digit", day: "2-digit", hour: "2-digit", minute: "2-digit", second: "2-digit",
    }).formatToParts(new Date(t)).map((x) => [x.type, x.value]));
    return Date.UTC(Number(p.year), Number(p.month) - 1, Number(p.day), Number(p.hour), Number(p.minute), Number(p.second)) - t;
  };
  const first = guess - offsetAt(guess);
  return new Date(guess - offsetAt(first));
}

/** The `n` local days ending with today's, oldest first. */
export function localDays(now: Date, n: number, timeZone: string): string[] {
  const out: string[] = [];
  for (let i = n - 1; i >= 0; i--) out.push(localDay(new Date(now.getTime() - i * DAY_MS), timeZone));
  // Around a DST change two instants 24 h apart can fall on the same local day: keep each once.
  return out.filter((d, i) => i === 0 || d !== out[i - 1]);
}

export function buildChannelTimeline(
  days: string[], channels: SensorChannel[], quality: ChannelDay[], deactivations: { channelId: string; at: Date }[], timeZone: string,
): ChannelTimelineRow[] {
  const q = new Map(quality.map((r) => [`${r.channel}|${r.day}`, r]));
  const offDay = new Map(deactivations.map((d) => [d.channelId, localDay(new Date(d.at), timeZone)]));
  return channels.map((c) => {
    const off = c.active ? null : offDay.get(c.id) ?? days[0];
    return {
      channel: c.code,
      active: c.active,
      cells: days.map((day) => {
        const r = q.get(`${c.code}|${day}`);
        const records = r?.records ?? 0;
        const excluded = r?.excluded ?? 0;
        const flags = r?.flags ?? [];
        let state: ChannelDayState;
        if (off !== null && day >= off && excluded === records) state = "removed";
        else if (records === 0) state = "no_data";
        else if (excluded === records) state = "dead";
        else if (excluded > 0) state = "partial";
        else state = "ok";
        return { day, state, records, excluded, flags };
      }),
    };
  });
}

const FLAG_WORDS: Record<string, string> = {
  flat_line: "flat line", clipping: "clipping", gap: "gaps", non_finite: "invalid samples",
};

/**
 * Plain sentences for channels that are unusable now: the run of `dead` days (days without a
 * record do not break it) that ends at the channel's latest day with data.
 */
export function describeChannelIssues(rows: ChannelTimelineRow[]): string[] {
  const out: string[] = [];
  for (const r of rows) {
    const withData = r.cells.filter((c) => c.state !== "no_data" && c.state !== "removed");
    let i = withData.length - 1;
    while (i >= 0 && withData[i].state === "dead") i--;
    const run = withData.slice(i + 1);
    if (run.length === 0) continue;
    const flags = [...new Set(run.flatMap((c) => c.flags))].map((f) => FLAG_WORDS[f] ?? f.replaceAll("_", " "));
    const since = i >= 0 ? `since ${run[0].day}` : `on every day with records since ${run[0].day}`;
    out.push(`Sensor ${r.channel} is excluded from every record ${since} (${run.length} day${run.length === 1 ? "" : "s"} with records${flags.length ? `; ${flags.join(", ")}` : ""}).`);
  }
  return out;
}
