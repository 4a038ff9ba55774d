"use client";

import { useCallback, useEffect, useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { useFormAction } from "@/lib/client/use-form-action";
import { addTrackedModeAction, editTrackedModeAction, setTrackedModeActiveAction } from "../actions";
import type { TrackedModeRowView } from "../_lib/views";
import { ScopedTextField } from "./scoped-field";

/** A tracked mode from a design or FE frequency: label, frequency and (optionally) the search band. */
export function AddTrackedModeForm({ assetId }: { assetId: string }) {
  const [open, setOpen] = useState(false);
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(addTrackedModeAction, { refreshOnSuccess: true });
  const added = state?.ok ? state.data : null;
  const notice = added ? (
    <Notice tone="success" className="basis-full">
      Now tracking “{added.label}”. New analyses look for it; reprocess a date range to look for it in earlier records.
    </Notice>
  ) : null;
  if (!open) {
    return (
      <div className="flex flex-wrap items-center gap-3">
        <Button variant="secondary" onClick={() => setOpen(true)}>Add from a design frequency</Button>
        {notice}
      </div>
    );
  }
  return (
    // A new key after each addition empties the inputs for the next one.
    <form key={added?.id ?? "new"} onSubmit={onSubmit} className="flex flex-wrap items-start gap-3" data-testid="add-mode-form" noValidate>
      <input type="hidden" name="assetId" value={assetId} />
      <ScopedTextField scope="add" label="Label" name="label" placeholder="e.g. first lateral sway" errors={fieldErrors.label} wrapperClassName="w-64" autoFocus />
      <ScopedTextField scope="add" label="Frequency (Hz)" name="nominalFrequencyHz" inputMode="decimal" placeholder="design / FE value" errors={fieldErrors.nominalFrequencyHz} wrapperClassName="w-40" />
      <ScopedTextField scope="add" label="Band low (Hz)" name="bandLowHz" inputMode="decimal" placeholder="−5 %" errors={fieldErrors.bandLowHz} wrapperClassName="w-32" />
      <ScopedTextField scope="add" label="Band high (Hz)" name="bandHighHz" inputMode="decimal" placeholder="+5 %" errors={fieldErrors.bandHighHz} wrapperClassName="w-32" />
      <div className="flex gap-2 pt-5">
        <Button type="submit" variant="primary" disabled={pending}>{pending ? "Adding…" : "Add tracked mode"}</Button>
        <Button variant="quiet" onClick={() => setOpen(false)}>Close</Button>
      </div>
      {notice}
      {message ? <Notice tone="error" className="basis-full">{message}</Notice> : null}
    </form>
  );
}

function EditTrackedModeForm({ assetId, mode, onClose }: { assetId: string; mode: TrackedModeRowView; onClose: () => void }) {
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(editTrackedModeAction, { refreshOnSuccess: true });
  useEffect(() => {
    if (state?.ok) onClose();
  }, [state, onClose]);
  return (
    <form onSubmit={onSubmit} className="flex flex-wrap items-start justify-end gap-2" data-testid="edit-mode-form" noValidate>
      <input type="hidden" name="assetId" value={assetId} />
      <input type="hidden" name="trackedModeId" value={mode.id} />
      <ScopedTextField scope={`edit-${mode.id}`} label="Label" name="label" defaultValue={mode.label} errors={fieldErrors.label} wrapperClassName="w-48" autoFocus />
      <ScopedTextField scope={`edit-${mode.id}`} label="Band low (Hz)" name="bandLowHz" inputMode="decimal" defaultValue={String(mode.bandLowHz)} errors={fieldErrors.bandLowHz} wrapperClassName="w-28" />
      <ScopedTextField scope={`edit-${mode.id}`} label="Band high (Hz)" name="bandHighHz" inputMode="decimal" defaultValue={String(mode.bandHighHz)} errors={fieldErrors.bandHighHz} wrapperClassName="w-28" />
      <div className="flex gap-1 pt-5">
        <Button type="submit" variant="primary" size="sm" disabled={pending}>{pending ? "Saving…" : "Save"}</Button>
        <Button variant="quiet" size="sm" onClick={onClose}>Cancel</Button>
      </div>
      {message ? <Notice tone="error" className="basis-full">{message}</Notice> : null}
    </form>
  );
}

/** Edit label and band, deactivate or reactivate: the controls of one row (engineers, admins). */
export function TrackedModeRowControls({ assetId, mode }: { assetId: string; mode: TrackedModeRowView }) {
  const [editing, setEditing] = useState(false);
  const close = useCallback(() => setEditing(false), []);
  const toggle = useFormAction(setTrackedModeActiveAction, { refreshOnSuccess: true });
  if (editing) return <EditTrackedModeForm assetId={assetId} mode={mode} onClose={close} />;
  return (
    <div className="flex items-center justify-end gap-1">
      {toggle.message ? <span role="alert" className="text-xs text-danger">{toggle.message}</span> : null}
      <Button variant="quiet" size="sm" onClick={() => setEditing(true)}>Edit</Button>
      <form onSubmit={toggle.onSubmit}>
        <input type="hidden" name="assetId" value={assetId} />
        <input type="hidden" name="trackedModeId" value={mode.id} />
        <input type="hidden" name="active" value={mode.active ? "false" : "true"} />
        <Button type="submit" variant={mode.active ? "danger" : "secondary"} size="sm" disabled={toggle.pending}>
          {toggle.pending ? "Saving…" : mode.active ? "Deactivate" : "Reactivate"}
        </Button>
      </form>
    </div>
  );
}
