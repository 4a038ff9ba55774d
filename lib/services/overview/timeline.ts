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
