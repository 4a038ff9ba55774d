import type { ChannelDayState, ChannelTimelineRow } from "@/lib/services/overview/timeline";
import { Panel } from "@/components/ui/panel";

interface DayCount { day: string; total: number; analysed: number; rejected: number; failed: number }

const CELL: Record<ChannelDayState, { fill: string; label: string }> = {
  ok: { fill: "#8cc7bd", label: "usable" },
  partial: { fill: "#e6b34f", label: "excluded in some records" },
  dead: { fill: "#b3261e", label: "excluded in every record (e.g. flat-lined)" },
  no_data: { fill: "#e4e6e1", label: "no record" },
  removed: { fill: "#3f4a5a", label: "out of service" },
};

const shortDay = (d: string) => new Date(`${d}T12:00:00Z`).toLocaleDateString("en-GB", { day: "2-digit", month: "short", timeZone: "UTC" });

/** Records per day as small bars: analysed (ink-blue), rejected or failed (red); dashed line = expected. */
function RecordsPerDay({ counts, expected }: { counts: DayCount[]; expected: number }) {
  const W = 600, H = 90, pad = 2;
  const max = Math.max(expected, ...counts.map((c) => c.total), 1);
  const bw = W / counts.length;
  const y = (v: number) => H - (v / max) * (H - 8);
  const total = counts.reduce((s, c) => s + c.total, 0);
  return (
    <figure data-testid="records-per-day">
      <figcaption className="mb-1 flex justify-between text-xs text-muted">
        <span>Records per day ({total} in {counts.length} days; {expected % 1 === 0 ? expected : expected.toFixed(1)} expected a day)</span>
        <span className="flex gap-3">
          <span><span className="mr-1 inline-block h-2 w-2 bg-accent" />analysed</span>
          <span><span className="mr-1 inline-block h-2 w-2 bg-danger" />rejected or failed</span>
        </span>
      </figcaption>
      <svg viewBox={`0 0 ${W} ${H + 14}`} className="h-auto w-full" role="img" aria-label={`Records per day over the last ${counts.length} days`}>
        {counts.map((c, i) => {
          const bad = c.rejected + c.failed;
          const other = c.total - c.analysed - bad;
          return (
            <g key={c.day} data-day={c.day} data-count={c.total}>
              <title>{`${c.day}: ${c.total} records (${c.analysed} analysed, ${c.rejected} rejected, ${c.failed} failed${other > 0 ? `, ${other} waiting` : ""})`}</title>
              <rect x={i * bw + pad} y={y(c.analysed)} width={bw - 2 * pad} height={H - y(c.analysed)} fill="var(--color-accent)" />
              <rect x={i * bw + pad} y={y(c.analysed + bad)} width={bw - 2 * pad} height={y(c.analysed) - y(c.analysed + bad)} fill="var(--color-danger)" />
              <rect x={i * bw + pad} y={y(c.total)} width={bw - 2 * pad} height={y(c.analysed + bad) - y(c.total)} fill="var(--color-faint)" />
              {c.total === 0 ? <rect x={i * bw + pad} y={H - 2} width={bw - 2 * pad} height={2} fill="var(--color-danger)" /> : null}
            </g>
          );
        })}
        <line x1={0} x2={W} y1={y(expected)} y2={y(expected)} stroke="var(--color-muted)" strokeDasharray="4 3" strokeWidth={1} />
        <line x1={0} x2={W} y1={H} y2={H} stroke="var(--color-line-strong)" strokeWidth={1} />
        {[0, Math.floor(counts.length / 2), counts.length - 1].map((i) => (
          <text key={i} x={i * bw + bw / 2} y={H + 12} fontSize={10} textAnchor={i === 0 ? "start" : i === counts.length - 1 ? "end" : "middle"} fill="var(--color-muted)">
            {shortDay(counts[i].day)}
          </text>
        ))}
      </svg>
    </figure>
  );
}

/** One row per configured channel, one cell per day, coloured by the channel's state that day. */
function ChannelTimeline({ rows, days }: { rows: ChannelTimelineRow[]; days: string[] }) {
  const cols = { gridTemplateColumns: `minmax(2.5rem, max-content) repeat(${days.length}, minmax(0, 1fr))` };
  return (
    <figure data-testid="channel-timeline">
      <figcaption className="mb-1 text-xs text-muted">Sensor channels per day (from each record&apos;s quality screening)</figcaption>
      <div role="table" aria-label="Sensor channel state per day" className="grid gap-[2px] text-xs" style={cols}>
        {rows.map((r) => (
          <div role="row" key={r.channel} className="contents" data-channel={r.channel} data-active={r.active ? "true" : "false"}>
            <div role="rowheader" className="pr-2 font-medium whitespace-nowrap leading-4">
              {r.channel}
              {!r.active ? <span className="ml-1 font-normal text-muted">(out of service)</span> : null}
            </div>
            {r.cells.map((c) => (
              <div
                role="cell"
                key={c.day}
                data-day={c.day}
                data-state={c.state}
                title={`${r.channel} ${c.day}: ${CELL[c.state].label}${c.records > 0 ? ` (${c.excluded} of ${c.records} records excluded${c.flags.length ? `; ${c.flags.join(", ").replaceAll("_", " ")}` : ""})` : ""}`}
                className="h-4 rounded-[2px]"
                style={{ background: CELL[c.state].fill }}
              />
            ))}
          </div>
        ))}
        <div aria-hidden />
        {days.map((d, i) => (
          <div key={d} aria-hidden className="whitespace-nowrap text-center text-[10px] leading-3 text-muted">
            {(i % 7 === 0 && i < days.length - 4) || i === days.length - 1 ? shortDay(d) : ""}
          </div>
        ))}
      </div>
      <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-muted">
        {(Object.keys(CELL) as ChannelDayState[]).map((s) => (
          <li key={s} className="flex items-center gap-1.5">
            <span className="inline-block h-3 w-3 rounded-[2px]" style={{ background: CELL[s].fill }} />
            {CELL[s].label}
          </li>
        ))}
      </ul>
    </figure>
  );
}

/** Data availability of the last days: records per day and each channel's state per day. */
export function AvailabilityPanel({
  days, counts, expectedPerDay, channels, issues,
}: { days: string[]; counts: DayCount[]; expectedPerDay: number; channels: ChannelTimelineRow[]; issues: string[] }) {
  return (
    <div id="availability" className="min-w-0 scroll-mt-4">
    <Panel title={`Data availability, last ${days.length} days`} bodyClassName="space-y-4">
      {issues.length > 0 ? (
        <ul className="space-y-0.5 text-sm" data-testid="channel-issues">
          {issues.map((t) => <li key={t} className="text-danger">{t}</li>)}
        </ul>
      ) : null}
      <RecordsPerDay counts={counts} expected={expectedPerDay} />
      <ChannelTimeline rows={channels} days={days} />
    </Panel>
    </div>
  );
}
