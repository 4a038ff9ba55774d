"use client";

import Link from "next/link";
import { useCallback, useEffect, useState } from "react";
import { Button } from "@/components/ui/button";
import { formatDate } from "@/components/ui/format";
import { Notice } from "@/components/ui/notice";
import { Td } from "@/components/ui/table";
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
    <form onSubmit={onSubmit} className="flex flex-wrap items-start gap-3" data-testid="edit-mode-form" noValidate>
      <input type="hidden" name="assetId" value={assetId} />
      <input type="hidden" name="trackedModeId" value={mode.id} />
      <ScopedTextField scope={`edit-${mode.id}`} label="Label" name="label" defaultValue={mode.label} errors={fieldErrors.label} wrapperClassName="w-64" autoFocus />
      <ScopedTextField scope={`edit-${mode.id}`} label="Band low (Hz)" name="bandLowHz" inputMode="decimal" defaultValue={String(mode.bandLowHz)} errors={fieldErrors.bandLowHz} wrapperClassName="w-32" />
      <ScopedTextField scope={`edit-${mode.id}`} label="Band high (Hz)" name="bandHighHz" inputMode="decimal" defaultValue={String(mode.bandHighHz)} errors={fieldErrors.bandHighHz} wrapperClassName="w-32" />
      <div className="flex gap-1 pt-5">
        <Button type="submit" variant="primary" size="sm" disabled={pending}>{pending ? "Saving…" : "Save"}</Button>
        <Button variant="quiet" size="sm" onClick={onClose}>Cancel</Button>
      </div>
      {message ? <Notice tone="error" className="basis-full">{message}</Notice> : null}
    </form>
  );
}

const hz = (f: number) => f.toFixed(3);
const pct = (r: number) => `${Math.round(r * 100)} %`;

/**
 * One tracked mode of the table; with `canEdit` (engineers, admins) its Edit, Deactivate and
 * Reactivate controls, the edit form opening in a full-width row below it.
 */
export function TrackedModeRow({ assetId, mode: m, canEdit, timeZone }: { assetId: string; mode: TrackedModeRowView; canEdit: boolean; timeZone: string }) {
  const [editing, setEditing] = useState(false);
  const close = useCallback(() => setEditing(false), []);
  const toggle = useFormAction(setTrackedModeActiveAction, { refreshOnSuccess: true });
  return (
    <>
      <tr data-tracked-mode={m.label} data-active={m.active} className={m.active ? undefined : "text-muted"}>
        <Td className="font-medium">{m.label}</Td>
        <Td className="whitespace-nowrap text-right tabular-nums">{hz(m.nominalFrequencyHz)} Hz</Td>
        <Td className="whitespace-nowrap tabular-nums" data-band>{hz(m.bandLowHz)}–{hz(m.bandHighHz)} Hz</Td>
        <Td>
          {m.source.kind === "record" ? (
            <Link href={`/assets/${assetId}/records/${m.source.recordId}`} className="text-accent hover:underline">Record peak #{m.source.modeIndex + 1}</Link>
          ) : "Design / FE entry"}
        </Td>
        <Td>{m.hasReferenceShape ? "Reference shape" : <span className="text-muted">Band only</span>}</Td>
        <Td>{m.active ? "Active" : "Inactive"}</Td>
        <Td className="text-right tabular-nums" data-rate={m.rate ?? ""} data-identified={m.identified} data-sought={m.sought}>
          {m.rate === null ? <span className="text-muted">not sought</span> : <strong>{pct(m.rate)}</strong>}
          <span className="block whitespace-nowrap text-xs text-muted">{m.identified} of {m.sought}</span>
          {m.notSought ? <span className="block whitespace-nowrap text-xs text-faint">not sought in {m.notSought}</span> : null}
        </Td>
        <Td className="whitespace-nowrap">{formatDate(m.lastIdentifiedAt, timeZone)}</Td>
        {canEdit ? (
          <Td className="text-right">
            <div className="flex items-center justify-end gap-1">
              {toggle.message ? <span role="alert" className="text-xs text-danger">{toggle.message}</span> : null}
              <Button variant="quiet" size="sm" onClick={() => setEditing(true)} disabled={editing}>Edit</Button>
              <form onSubmit={toggle.onSubmit}>
                <input type="hidden" name="assetId" value={assetId} />
                <input type="hidden" name="trackedModeId" value={m.id} />
                <input type="hidden" name="active" value={m.active ? "false" : "true"} />
                <Button type="submit" variant={m.active ? "danger" : "secondary"} size="sm" disabled={toggle.pending}>
                  {toggle.pending ? "Saving…" : m.active ? "Deactivate" : "Reactivate"}
                </Button>
              </form>
            </div>
          </Td>
        ) : null}
      </tr>
      {canEdit && editing ? (
        <tr data-edit-row={m.label}>
          <Td colSpan={9} className="bg-sunken">
            <EditTrackedModeForm assetId={assetId} mode={m} onClose={close} />
          </Td>
        </tr>
      ) : null}
    </>
  );
}
