import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { cx } from "@/components/ui/cx";

export const RANGES = [
  { key: "30d", label: "Last 30 d", days: 30 },
  { key: "90d", label: "Last 90 d", days: 90 },
  { key: "1y", label: "Last year", days: 365 },
  { key: "all", label: "All", days: null },
] as const;
export type RangeKey = (typeof RANGES)[number]["key"] | "custom";

/** Time-range picker of the Trends page: preset links and a custom from/to (organisation days). */
export function RangePicker({ basePath, current, from, to, error }: { basePath: string; current: RangeKey; from?: string; to?: string; error?: string }) {
  return (
    <div className="flex flex-wrap items-end gap-2" data-testid="range-picker">
      <nav aria-label="Time range" className="flex flex-wrap gap-1">
        {RANGES.map((r) => (
          <Link
            key={r.key}
            href={`${basePath}?range=${r.key}`}
            aria-current={current === r.key ? "page" : undefined}
            className={cx(buttonClass(current === r.key ? "primary" : "secondary", "sm"))}
          >
            {r.label}
          </Link>
        ))}
      </nav>
      <form method="get" action={basePath} className="flex flex-wrap items-end gap-2" aria-label="Custom range">
        <input type="hidden" name="range" value="custom" />
        <label className="text-xs text-muted">
          From
          <input type="date" name="from" defaultValue={from} className={cx(inputClass, "h-8 w-40")} aria-invalid={Boolean(error)} />
        </label>
        <label className="text-xs text-muted">
          To
          <input type="date" name="to" defaultValue={to} className={cx(inputClass, "h-8 w-40")} aria-invalid={Boolean(error)} />
        </label>
        <button type="submit" className={buttonClass(current === "custom" ? "primary" : "secondary", "sm")}>Custom range</button>
      </form>
      {error ? <p className="w-full text-xs text-danger" role="alert">{error}</p> : null}
    </div>
  );
}
