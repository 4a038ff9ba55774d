"use client";

import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import type { ModeView } from "@/components/records/types";
import { useFormAction } from "@/lib/client/use-form-action";
import { trackModeAction } from "../actions";

/**
 * "Track this mode": a label and, optionally, the search band (default ±5 % of the mode's
 * frequency, set by the service). Frequency and reference shape come from the record's mode.
 */
export function TrackModeForm({ assetId, recordId, mode, onDone }: { assetId: string; recordId: string; mode: ModeView; onDone: () => void }) {
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(trackModeAction);
  if (state?.ok) {
    return (
      <Notice tone="success">
        Now tracking “{state.data.label}”. New analyses assign their modes to it; reprocess this record to see the assignment here.{" "}
        <button type="button" className="underline" onClick={onDone}>Close</button>
      </Notice>
    );
  }
  return (
    <form onSubmit={onSubmit} className="flex flex-wrap items-end gap-3" data-testid="track-mode-form" noValidate>
      <input type="hidden" name="assetId" value={assetId} />
      <input type="hidden" name="fromRecordId" value={recordId} />
      <input type="hidden" name="fromModeIndex" value={mode.modeIndex} />
      <TextField label="Label" name="label" placeholder="e.g. first vertical bending" errors={fieldErrors.label} wrapperClassName="w-72" autoFocus />
      <TextField label="Band low (Hz)" name="bandLowHz" inputMode="decimal" placeholder={(mode.frequencyHz * 0.95).toFixed(3)} errors={fieldErrors.bandLowHz} wrapperClassName="w-32" />
      <TextField label="Band high (Hz)" name="bandHighHz" inputMode="decimal" placeholder={(mode.frequencyHz * 1.05).toFixed(3)} errors={fieldErrors.bandHighHz} wrapperClassName="w-32" />
      <Button type="submit" variant="primary" disabled={pending}>{pending ? "Saving…" : "Start tracking"}</Button>
      <Button variant="quiet" onClick={onDone}>Cancel</Button>
      {message || fieldErrors.fromRecordId || fieldErrors.fromModeIndex ? (
        <Notice tone="error" className="basis-full">{message ?? [...(fieldErrors.fromRecordId ?? []), ...(fieldErrors.fromModeIndex ?? [])].join(" ")}</Notice>
      ) : null}
    </form>
  );
}
