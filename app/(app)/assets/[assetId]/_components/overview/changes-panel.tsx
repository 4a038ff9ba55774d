import Link from "next/link";
import type { ChangeCategory, ChangeItem } from "@/lib/services/overview/changes";
import { buttonClass } from "@/components/ui/button";
import { cx } from "@/components/ui/cx";
import { inputClass } from "@/components/ui/field";
import { formatDateTime } from "@/components/ui/format";
import { Panel } from "@/components/ui/panel";

const CATEGORY_LABELS: Record<ChangeCategory, string> = {
  baseline: "Baseline", settings: "Settings", channel: "Sensors", mode: "Modes", gateway: "Gateway", asset: "Asset", data: "Data", alert: "Alert",
};

/**
 * "What changed since <date>": a GET form (date picker, default 30 days ago) and the list of
 * changes from the versioned tables, the alerts and the audit log.
 */
export function ChangesPanel({ items, since, timeZone, action }: { items: ChangeItem[]; since: string; timeZone: string; action: string }) {
  return (
    <Panel
      title={`What changed since ${since}`}
      actions={
        <form method="get" action={action} className="flex items-center gap-2" data-testid="changes-form">
          <label htmlFor="changes-since" className="text-xs text-muted">Since</label>
          <input id="changes-since" name="since" type="date" defaultValue={since} className={cx(inputClass, "h-8 w-[10rem]")} />
          <button type="submit" className={buttonClass("secondary", "sm")}>Show</button>
        </form>
      }
      bodyClassName="p-0"
    >
      <ol className="divide-y divide-line/70" data-testid="overview-changes">
        {items.map((c, i) => (
          <li key={`${c.at}-${i}`} className="grid grid-cols-[9.5rem_5.5rem_1fr] gap-3 px-4 py-2 text-sm" data-change-category={c.category}>
            <span className="whitespace-nowrap text-muted tabular-nums">{formatDateTime(c.at, timeZone)}</span>
            <span className="text-xs font-medium uppercase tracking-wide text-muted">{CATEGORY_LABELS[c.category]}</span>
            <span>
              {c.href ? <Link href={c.href} className="hover:text-accent hover:underline">{c.text}</Link> : c.text}
              {c.by ? <span className="text-muted"> — {c.by}</span> : null}
            </span>
          </li>
        ))}
        {items.length === 0 ? <li className="px-4 py-4 text-sm text-muted">Nothing changed since {since}.</li> : null}
      </ol>
    </Panel>
  );
}
