import Link from "next/link";
import type { AttentionItem, AttentionKind } from "@/lib/services/overview/attention";
import { cx } from "@/components/ui/cx";
import { formatDateTime } from "@/components/ui/format";

const KIND_STYLE: Record<AttentionKind, { label: string; dot: string }> = {
  alert: { label: "Alert", dot: "var(--condition-alert-fill)" },
  watch: { label: "Watch", dot: "var(--condition-watch-fill)" },
  silent: { label: "Silent", dot: "var(--condition-silent-fill)" },
  data: { label: "Data", dot: "#7c5a2e" },
  no_baseline: { label: "Baseline", dot: "var(--condition-commissioning-stroke)" },
  provisional_baseline: { label: "Baseline", dot: "var(--condition-commissioning-stroke)" },
};

const COMPACT: ReadonlySet<AttentionKind> = new Set(["no_baseline", "provisional_baseline"]);

/** The "needs attention" list: alerts, warnings, silence, sensor data issues and baselines, each with a link. */
export function NeedsAttention({ items, timeZone, className }: { items: AttentionItem[]; timeZone: string; className?: string }) {
  return (
    <section className={cx("flex min-h-0 flex-col rounded-lg border border-line bg-surface", className)} data-testid="needs-attention" aria-labelledby="needs-attention-title">
      <header className="flex items-center justify-between border-b border-line px-4 py-2.5">
        <h2 id="needs-attention-title" className="text-sm font-semibold tracking-tight">Needs attention</h2>
        <span className="text-xs text-muted tabular-nums">{items.length === 0 ? "nothing" : `${items.length} item${items.length === 1 ? "" : "s"}`}</span>
      </header>
      {items.length === 0 ? (
        <p className="p-4 text-sm text-muted">No open alert, silent asset, sensor data issue or missing baseline.</p>
      ) : (
        <ul className="min-h-0 flex-1 divide-y divide-line/70 overflow-y-auto">
          {items.map((it, i) => (
            <li key={`${it.kind}-${it.assetId}-${i}`} data-attention-kind={it.kind} data-asset-id={it.assetId}>
              {COMPACT.has(it.kind) ? (
                // Baseline items are less urgent: one line each, the detail as a tooltip.
                <Link href={it.href} title={it.detail} className="group flex items-center gap-3 px-4 py-1.5 text-sm hover:bg-canvas">
                  <span aria-hidden className="inline-block h-2.5 w-2.5 shrink-0 rounded-full" style={{ background: KIND_STYLE[it.kind].dot }} />
                  <span className="min-w-0 flex-1 truncate">
                    <span className="font-medium text-ink group-hover:text-accent group-hover:underline">{it.assetName}</span>
                    <span className="text-muted"> · {it.title.toLowerCase()}</span>
                  </span>
                </Link>
              ) : (
                <Link href={it.href} className="group flex gap-3 px-4 py-2.5 hover:bg-canvas">
                  <span aria-hidden className="mt-1.5 inline-block h-2.5 w-2.5 shrink-0 rounded-full" style={{ background: KIND_STYLE[it.kind].dot }} />
                  <span className="min-w-0 flex-1">
                    <span className="flex flex-wrap items-baseline gap-x-2">
                      <span className="font-medium text-ink group-hover:text-accent group-hover:underline">{it.assetName}</span>
                      <span className="text-xs font-medium uppercase tracking-wide text-muted">{KIND_STYLE[it.kind].label}</span>
                      {it.at ? <time dateTime={it.at} className="ml-auto text-xs text-muted tabular-nums">{formatDateTime(it.at, timeZone)}</time> : null}
                    </span>
                    <span className="block text-sm">{it.title}</span>
                    <span className="block text-xs text-muted">{it.detail}</span>
                  </span>
                </Link>
              )}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
