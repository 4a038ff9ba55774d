import Link from "next/link";
import { ALERT_STATES } from "@/lib/domain/drift";
import { buttonClass } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { cx } from "@/components/ui/cx";
import { STATE_LABELS } from "./labels";

interface Option { value: string; label: string }

function Select({ name, label, value, options, any }: { name: string; label: string; value?: string; options: Option[]; any: string }) {
  return (
    <div className="min-w-0">
      <label htmlFor={`f-${name}`} className="mb-1 block text-xs font-medium uppercase tracking-wide text-muted">{label}</label>
      <select id={`f-${name}`} name={name} defaultValue={value ?? ""} className={cx(inputClass, "pr-8")}>
        <option value="">{any}</option>
        {options.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
      </select>
    </div>
  );
}

/** Filters as a plain GET form: the URL's search params are the inbox's state. */
export function AlertFilters({ assets, assignees, assetId, state, assigneeUserId }: {
  assets: Option[]; assignees: Option[]; assetId?: string; state?: string; assigneeUserId?: string;
}) {
  return (
    <form method="get" action="/alerts" data-testid="alert-filters"
      className="grid grid-cols-1 items-end gap-3 border-b border-line px-3 py-3 sm:grid-cols-2 lg:grid-cols-[repeat(3,minmax(0,14rem))_auto]">
      <Select name="assetId" label="Asset" value={assetId} options={assets} any="All assets" />
      <Select name="state" label="State" value={state} any="Any state" options={ALERT_STATES.map((s) => ({ value: s, label: STATE_LABELS[s] }))} />
      <Select name="assigneeUserId" label="Assignee" value={assigneeUserId} options={assignees} any="Anyone" />
      <div className="flex gap-2">
        <button type="submit" className={buttonClass("primary")}>Apply</button>
        <Link href="/alerts" className={buttonClass("quiet")}>Clear</Link>
      </div>
    </form>
  );
}
