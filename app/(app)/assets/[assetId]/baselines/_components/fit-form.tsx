"use client";

import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { useFormAction } from "@/lib/client/use-form-action";
import { fitBaselineAction } from "../actions";

/** Engineer form: fit a new baseline on a training window and make it the active one. */
export function FitBaselineForm({ assetId, defaultFrom, defaultTo }: { assetId: string; defaultFrom: string; defaultTo: string }) {
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(fitBaselineAction, { refreshOnSuccess: true });
  return (
    <form onSubmit={onSubmit} className="space-y-3" aria-label="Fit a new baseline">
      <input type="hidden" name="assetId" value={assetId} />
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
        <TextField label="Training from (day)" name="from" type="date" defaultValue={defaultFrom} errors={fieldErrors.from} required />
        <TextField label="Training to (day, included)" name="to" type="date" defaultValue={defaultTo} errors={fieldErrors.to} required />
        <SelectField
          label="Model" name="model" defaultValue="auto" errors={fieldErrors.model}
          options={[
            { value: "auto", label: "Auto (lowest BIC)" },
            { value: "linear", label: "Linear" },
            { value: "bilinear", label: "Bilinear (knot near 0 °C)" },
          ]}
        />
      </div>
      <p className="text-xs text-muted">
        A full year of seasons gives a complete baseline; a shorter window is provisional. Fitting makes the new version active,
        keeps the earlier ones for comparison and replays the drift statistics with it.
      </p>
      {message ? <Notice tone="error">{message}</Notice> : null}
      {state?.ok ? (
        <Notice tone="success">
          Version {state.data.version} is active ({state.data.status}): {state.data.modes.join(", ")}. The drift replay is queued.
        </Notice>
      ) : null}
      <Button type="submit" variant="primary" disabled={pending}>{pending ? "Fitting…" : "Fit and activate"}</Button>
    </form>
  );
}
