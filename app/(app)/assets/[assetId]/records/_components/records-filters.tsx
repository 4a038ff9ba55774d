import { RECORD_STATUSES } from "@/lib/domain/records";
import { STATUS_LABELS } from "@/components/records/format";
import { buttonClass } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { cx } from "@/components/ui/cx";
import Link from "next/link";

/** Filters as a plain GET form: the URL's search params are the list's state. */
export function RecordsFilters({ basePath, status, from, to, errors }: { basePath: string; status?: string; from?: string; to?: string; errors: Record<string, string[]> }) {
  return (
    <form method="get" action={basePath} className="flex flex-wrap items-end gap-3 px-3 py-3" data-testid="records-filters">
      <div>
        <label htmlFor="f-status" className="mb-1 block text-xs font-medium uppercase tracking-wide text-muted">Status</label>
        <select id="f-status" name="status" defaultValue={status ?? ""} className={cx(inputClass, "w-40 pr-8")}>
          <option value="">Any</option>
          {RECORD_STATUSES.map((s) => <option key={s} value={s}>{STATUS_LABELS[s]}</option>)}
        </select>
      </div>
      {(["from", "to"] as const).map((k) => (
        <div key={k}>
          <label htmlFor={`f-${k}`} className="mb-1 block text-xs font-medium uppercase tracking-wide text-muted">{k === "from" ? "From day" : "To day (inclusive)"}</label>
          <input id={`f-${k}`} name={k} type="date" defaultValue={k === "from" ? from : to} aria-invalid={Boolean(errors[k]?.length)} className={cx(inputClass, "w-44")} />
          {errors[k]?.length ? <p className="mt-1 text-xs text-danger">{errors[k].join(" ")}</p> : null}
        </div>
      ))}
      <button type="submit" className={buttonClass("primary")}>Apply</button>
      <Link href={basePath} className={buttonClass("quiet")}>Clear</Link>
    </form>
  );
}
