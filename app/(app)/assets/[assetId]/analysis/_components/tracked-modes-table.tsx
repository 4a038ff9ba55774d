import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { cx } from "@/components/ui/cx";
import { inputClass } from "@/components/ui/field";
import { Table, Th } from "@/components/ui/table";
import type { RatePeriod, TrackedModeRowView } from "../_lib/views";
import { AddTrackedModeForm, TrackedModeRow } from "./tracked-mode-forms";

interface Summary { analysedRecords: number; unassignedModes: number; recordsWithUnassigned: number }

/** The period of the rates as a plain GET form: the URL's search params hold it. */
function PeriodForm({ assetId, period }: { assetId: string; period: RatePeriod }) {
  const base = `/assets/${assetId}/analysis`;
  return (
    <form method="get" action={base} className="flex flex-wrap items-end gap-3" data-testid="rate-period">
      {(["from", "to"] as const).map((k) => (
        <div key={k}>
          <label htmlFor={`p-${k}`} className="mb-1 block text-xs font-medium uppercase tracking-wide text-muted">{k === "from" ? "From day" : "To day (inclusive)"}</label>
          <input id={`p-${k}`} name={k} type="date" defaultValue={k === "from" ? period.fromDay : period.toDay} aria-invalid={Boolean(period.errors[k]?.length)} className={cx(inputClass, "w-44")} />
          {period.errors[k]?.length ? <p className="mt-1 text-xs text-danger">{period.errors[k].join(" ")}</p> : null}
        </div>
      ))}
      <button type="submit" className={buttonClass("secondary")}>Apply</button>
      <Link href={base} className={buttonClass("quiet")}>Last 30 days</Link>
    </form>
  );
}

/** Tracked modes with their identification rate over the period; controls for engineers and admins. */
export function TrackedModesTable({ assetId, rows, canEdit, timeZone, period, summary }: {
  assetId: string; rows: TrackedModeRowView[]; canEdit: boolean; timeZone: string; period: RatePeriod; summary: Summary;
}) {
  return (
    <div>
      <div className="grid gap-3 px-4 py-3">
        <PeriodForm assetId={assetId} period={period} />
        <p className="text-sm text-muted" data-testid="rate-summary" data-analysed={summary.analysedRecords} data-unassigned={summary.unassignedModes}>
          {summary.analysedRecords} analysed record{summary.analysedRecords === 1 ? "" : "s"} from {period.fromDay} to {period.toDay}.{" "}
          <strong className="text-ink">{summary.unassignedModes}</strong> identified mode{summary.unassignedModes === 1 ? "" : "s"} in{" "}
          {summary.recordsWithUnassigned} of them {summary.unassignedModes === 1 ? "was" : "were"} assigned to no tracked mode.
        </p>
      </div>
      {rows.length === 0 ? (
        <p className="border-t border-line px-4 py-3 text-sm text-muted">No tracked modes yet. {canEdit ? "Add one from a design frequency below, or from a mode of a record." : ""}</p>
      ) : (
        <Table>
          <thead>
            <tr>
              <Th>Label</Th><Th className="text-right">Nominal</Th><Th>Search band</Th><Th>Source</Th><Th>Shape</Th><Th>Status</Th>
              <Th className="text-right">Identified</Th><Th>Last found</Th>{canEdit ? <Th className="text-right">Change</Th> : null}
            </tr>
          </thead>
          <tbody>
            {rows.map((m) => <TrackedModeRow key={m.id} assetId={assetId} mode={m} canEdit={canEdit} timeZone={timeZone} />)}
          </tbody>
        </Table>
      )}
      <p className="px-4 pt-2 text-xs text-faint">
        Identified: share of the period&apos;s analysed records (newest result of each) that looked for the mode and found it.
        A mode added after records were analysed is not sought in them until they are reprocessed.
      </p>
      {canEdit ? <div className="px-4 py-3" data-testid="add-mode"><AddTrackedModeForm assetId={assetId} /></div> : <div className="pb-3" />}
    </div>
  );
}
