"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { useFormAction } from "@/lib/client/use-form-action";
import { previewReprocessAction, reprocessRangeAction } from "../actions";

const records = (n: number) => `${n} record${n === 1 ? "" : "s"}`;

/**
 * Reprocess a date range (engineers, admins) in two steps: "Check" counts the records that
 * would be queued and names the settings version; "Queue" then queues exactly that range.
 */
export function ReprocessRangeForm({ assetId, defaultFrom, defaultTo, timeZone }: { assetId: string; defaultFrom: string; defaultTo: string; timeZone: string }) {
  const preview = useFormAction(previewReprocessAction);
  const queue = useFormAction(reprocessRangeAction, { refreshOnSuccess: true });
  const plan = preview.state?.ok ? preview.state.data : null;
  const done = queue.state?.ok ? queue.state.data : null;
  // The queue answer is shown while the preview it was sent from stands; a new check starts over.
  const [queuedFrom, setQueuedFrom] = useState<typeof preview.state>(null);
  const queuedThis = done !== null && queuedFrom !== null && queuedFrom === preview.state;
  return (
    <div className="grid gap-3" data-testid="reprocess-range">
      <form onSubmit={preview.onSubmit} className="flex flex-wrap items-start gap-3" noValidate>
        <input type="hidden" name="assetId" value={assetId} />
        <TextField label="First day" name="from" type="date" defaultValue={defaultFrom} errors={preview.fieldErrors.from} wrapperClassName="w-44" />
        <TextField label="Last day (inclusive)" name="to" type="date" defaultValue={defaultTo} errors={preview.fieldErrors.to} wrapperClassName="w-44" />
        <div className="pt-5">
          <Button type="submit" variant="secondary" disabled={preview.pending}>{preview.pending ? "Counting…" : "Check range"}</Button>
        </div>
        <p className="basis-full text-xs text-faint">Days in {timeZone}. Records are matched by the time they started.</p>
      </form>
      {preview.message ? <Notice tone="error">{preview.message}</Notice> : null}
      {plan && !queuedThis ? (
        <form onSubmit={(e) => { setQueuedFrom(preview.state); queue.onSubmit(e); }} className="flex flex-wrap items-center gap-3 rounded-md border border-line bg-sunken px-3 py-2" data-testid="reprocess-plan"
          data-to-queue={plan.toQueue} data-settings-version={plan.settingsVersion}>
          <input type="hidden" name="assetId" value={assetId} />
          <input type="hidden" name="from" value={plan.from} />
          <input type="hidden" name="to" value={plan.to} />
          <p className="text-sm">
            {plan.from} to {plan.to}: <strong>{records(plan.toQueue)}</strong> will be queued for analysis with settings{" "}
            <strong>version {plan.settingsVersion}</strong>
            {plan.skipped ? ` (${records(plan.skipped)} of ${plan.total} left alone: still waiting for analysis, or demo history without raw samples)` : ""}.
          </p>
          <Button type="submit" variant="primary" disabled={queue.pending || plan.toQueue === 0}>
            {queue.pending ? "Queuing…" : `Queue ${records(plan.toQueue)}`}
          </Button>
          {queue.message ? <Notice tone="error" className="basis-full">{queue.message}</Notice> : null}
        </form>
      ) : null}
      {queuedThis && done ? (
        <Notice tone="success">
          <span data-testid="reprocess-queued" data-queued={done.queued}>Queued {records(done.queued)}</span> ({done.from} to {done.to}) for analysis
          with settings version {done.settingsVersion}. Earlier results are kept: each record keeps the result of every version it
          was analysed with, and shows the newest.
        </Notice>
      ) : null}
    </div>
  );
}
