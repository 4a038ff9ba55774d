import { formatDate, formatDateTime } from "@/components/ui/format";
import { EVENT_LABELS, OUTCOME_LABELS } from "../../_components/labels";

export interface TimelineEvent { id: string; kind: string; at: string; actorName: string | null; details: Record<string, unknown> }

const str = (v: unknown) => (typeof v === "string" ? v : null);

function describe(e: TimelineEvent, names: Record<string, string>, timeZone: string): string | null {
  const d = e.details;
  switch (e.kind) {
    case "raised": return [str(d.rule), str(d.pointAt) ? `(drift statistics of ${formatDate(str(d.pointAt), timeZone)})` : null].filter(Boolean).join(" ") || null;
    case "inspection_scheduled": return [str(d.at) ? `for ${formatDate(str(d.at), timeZone)}` : null, str(d.note)].filter(Boolean).join(" — ") || null;
    case "assigned": return str(d.userId) ? `to ${names[str(d.userId) ?? ""] ?? "a former member"}` : null;
    case "comment": return str(d.text);
    case "closed": return `${OUTCOME_LABELS[str(d.outcome) ?? ""] ?? str(d.outcome) ?? ""}${str(d.findings) ? `: ${str(d.findings)}` : ""}`;
    case "attachment": return str(d.filename);
    default: return null;
  }
}

/** Everything that happened to the alert, oldest first. */
export function Timeline({ events, names, timeZone }: { events: TimelineEvent[]; names: Record<string, string>; timeZone: string }) {
  if (events.length === 0) return <p className="text-sm text-muted">Nothing recorded yet.</p>;
  return (
    <ol className="relative space-y-3 border-l border-line pl-4 text-sm" data-testid="alert-timeline">
      {events.map((e) => {
        const text = describe(e, names, timeZone);
        return (
          <li key={e.id} data-event-kind={e.kind} className="relative">
            <span aria-hidden className="absolute -left-[21px] top-1.5 h-2.5 w-2.5 rounded-full border-2 border-surface bg-accent" />
            <div className="flex flex-wrap items-baseline gap-x-2">
              <span className="font-medium">{EVENT_LABELS[e.kind] ?? e.kind}</span>
              <span className="text-xs text-muted">{formatDateTime(e.at, timeZone)} · {e.actorName ?? "Modewarden"}</span>
            </div>
            {text ? <p className="mt-0.5 whitespace-pre-wrap break-words text-ink/90">{text}</p> : null}
          </li>
        );
      })}
    </ol>
  );
}
