/**
 * The instant a calendar day (YYYY-MM-DD) starts in an IANA time zone, so a date filter
 * means the organisation's day whatever the browser's zone. Pure (Intl only).
 */
const DAY = /^(\d{4})-(\d{2})-(\d{2})$/;

/** Offset of `timeZone` from UTC at instant `ms`, in ms (positive east of Greenwich). */
function zoneOffsetMs(ms: number, timeZone: string): number {
  const parts = new Intl.DateTimeFormat("en-US", {
    timeZone, hourCycle: "h23", year: "numeric", month: "2-digit", day: "2-digit", hour: "2-digit", minute: "2-digit", second: "2-digit",
  }).formatToParts(new Date(ms));
  const get = (t: string) => Number(parts.find((p) => p.type === t)?.value);
  const asUtc = Date.UTC(get("year"), get("month") - 1, get("day"), get("hour"), get("minute"), get("second"));
  return asUtc - Math.floor(ms / 1000) * 1000;
}

/**
 * Start of `day` (+ `addDays`) in `timeZone` as a Date, or null for a malformed day.
 * Two passes of the offset settle days that begin next to a daylight-saving change.
 */
export function zonedDayStart(day: string, timeZone: string, addDays = 0): Date | null {
  const m = DAY.exec(day);
  if (!m) return null;
  const wall = Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]) + addDays);
  if (Number.isNaN(wall)) return null;
  let t = wall - zoneOffsetMs(wall, timeZone);
  t = wall - zoneOffsetMs(t, timeZone);
  return new Date(t);
}
