import type { RecordStatus } from "@/lib/domain/records";
import { cx } from "@/components/ui/cx";
import { STATUS_LABELS, VERDICT_LABELS } from "./format";

const STATUS_TONE: Record<RecordStatus, string> = {
  received: "text-muted",
  queued: "text-muted",
  analysing: "text-accent",
  analysed: "text-ink",
  rejected: "text-[var(--condition-watch-stroke)]",
  failed: "text-danger",
};

/** A record's status; while analysing, a thin progress bar with the percentage. */
export function RecordStatusBadge({ status, progress }: { status: RecordStatus; progress: number }) {
  const busy = status === "analysing" || status === "queued" || status === "received";
  return (
    <span className={cx("inline-flex items-center gap-2 text-sm", STATUS_TONE[status])} data-record-status={status}>
      <span>{STATUS_LABELS[status]}</span>
      {busy ? (
        <span
          className="inline-block h-1.5 w-16 overflow-hidden rounded-full bg-sunken"
          role="progressbar"
          aria-label="Analysis progress"
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={Math.round(progress * 100)}
        >
          <span className="block h-full bg-accent transition-[width]" style={{ width: `${Math.round(progress * 100)}%` }} />
        </span>
      ) : null}
      {status === "analysing" ? <span className="tabular-nums text-xs text-muted">{Math.round(progress * 100)} %</span> : null}
    </span>
  );
}

const VERDICT_COLOUR = { accept: "steady", accept_without: "watch", reject: "alert" } as const;

/** The quality verdict with the matching condition colour (steady / watch / alert). */
export function VerdictBadge({ verdict }: { verdict: "accept" | "accept_without" | "reject" | null }) {
  if (!verdict) return <span className="text-faint">—</span>;
  const c = VERDICT_COLOUR[verdict];
  return (
    <span className="inline-flex items-center gap-1.5 text-sm" data-verdict={verdict}>
      <span aria-hidden className="inline-block size-2 rounded-full" style={{ background: `var(--condition-${c}-fill)` }} />
      {verdict === "accept_without" ? "Partial" : VERDICT_LABELS[verdict]}
    </span>
  );
}
