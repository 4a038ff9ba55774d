"use client";

import { Button } from "@/components/ui/button";
import { useFormAction } from "@/lib/client/use-form-action";
import { reprocessAction, retryAction } from "../actions";

/** Reprocess (any record) or Retry (a failed one) — engineers only; the page decides. */
export function RecordControls({ assetId, recordId, failed }: { assetId: string; recordId: string; failed: boolean }) {
  const action = failed ? retryAction : reprocessAction;
  const { state, onSubmit, pending, message } = useFormAction(action, { refreshOnSuccess: true });
  return (
    <form onSubmit={onSubmit} className="flex items-center gap-2" data-testid="record-controls">
      <input type="hidden" name="assetId" value={assetId} />
      <input type="hidden" name="recordId" value={recordId} />
      {message ? <span role="alert" className="text-xs text-danger">{message}</span> : null}
      {state?.ok ? <span role="status" className="text-xs text-muted">Queued for analysis.</span> : null}
      <Button type="submit" variant={failed ? "primary" : "secondary"} size="sm" disabled={pending}>
        {pending ? "Queuing…" : failed ? "Retry" : "Reprocess"}
      </Button>
    </form>
  );
}
