"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { useFormAction } from "@/lib/client/use-form-action";
import type { DesignModeJson } from "./types";
import { createDesignModeAction, deleteDesignModeAction, updateDesignModeAction } from "../actions";

const DIRECTIONS = [{ value: "", label: "—" }, { value: "vertical", label: "Vertical" }, { value: "lateral", label: "Lateral" }, { value: "torsional", label: "Torsional" }];

/**
 * Add or edit one design mode: label, frequency, direction, optional link to a tracked mode,
 * source note and, folded away, the design shape at each sensor channel.
 */
export function DesignModeForm({ assetId, channels, trackedOptions, mode, onDone }: {
  assetId: string; channels: string[]; trackedOptions: { value: string; label: string }[]; mode?: DesignModeJson; onDone?: () => void;
}) {
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(mode ? updateDesignModeAction : createDesignModeAction, { refreshOnSuccess: true });
  const [showShape, setShowShape] = useState(Boolean(mode?.shape));
  const key = state?.ok ? `${mode?.id ?? "new"}-${state.data.id}` : mode?.id ?? "new"; // a fresh add form after each success
  return (
    <form key={key} onSubmit={onSubmit} className="space-y-3" data-testid={mode ? "design-mode-edit" : "design-mode-form"} noValidate>
      <input type="hidden" name="assetId" value={assetId} />
      {mode ? <input type="hidden" name="designModeId" value={mode.id} /> : null}
      <div className="flex flex-wrap items-start gap-3">
        <TextField label="Label" name="label" defaultValue={mode?.label} placeholder="e.g. FE mode 1, vertical" errors={fieldErrors.label} wrapperClassName="w-60" />
        <TextField label="Design frequency (Hz)" name="frequencyHz" inputMode="decimal" defaultValue={mode?.frequencyHz} errors={fieldErrors.frequencyHz} wrapperClassName="w-40" />
        <SelectField label="Direction" name="direction" options={DIRECTIONS} defaultValue={mode?.direction ?? ""} errors={fieldErrors.direction} wrapperClassName="w-36" />
        <SelectField label="Tracked mode" name="trackedModeId" options={[{ value: "", label: "Nearest frequency" }, ...trackedOptions]}
          defaultValue={mode?.trackedModeId ?? ""} errors={fieldErrors.trackedModeId} wrapperClassName="w-56" />
        <TextField label="Source" name="sourceNote" defaultValue={mode?.sourceNote ?? ""} placeholder="e.g. FE model rev. C, 2019" errors={fieldErrors.sourceNote} wrapperClassName="w-64" />
      </div>
      <div>
        <button type="button" className="text-xs text-accent underline" onClick={() => setShowShape((s) => !s)}>
          {showShape ? "Hide design shape" : "Design shape at the sensor channels (optional)"}
        </button>
        <div className={showShape ? "mt-2 flex flex-wrap gap-2" : "hidden"}>
          {channels.map((c) => (
            <TextField key={c} label={c} name={`shape_${c}`} inputMode="decimal" defaultValue={mode?.shape?.[c] ?? ""} wrapperClassName="w-20" />
          ))}
        </div>
        {fieldErrors.shape ? <Notice tone="error" className="mt-1">{fieldErrors.shape.join(" ")}</Notice> : null}
      </div>
      <div className="flex items-center gap-2">
        <Button type="submit" variant="primary" disabled={pending}>{pending ? "Saving…" : mode ? "Save" : "Add design mode"}</Button>
        {onDone ? <Button variant="quiet" onClick={onDone}>Cancel</Button> : null}
        {message ? <Notice tone="error">{message}</Notice> : null}
        {state?.ok && !mode ? <Notice tone="success">Added “{state.data.label}”.</Notice> : null}
      </div>
    </form>
  );
}

export function DeleteDesignModeButton({ assetId, designModeId }: { assetId: string; designModeId: string }) {
  const { onSubmit, pending, message } = useFormAction(deleteDesignModeAction, { refreshOnSuccess: true });
  return (
    <form onSubmit={onSubmit} className="inline">
      <input type="hidden" name="assetId" value={assetId} />
      <input type="hidden" name="designModeId" value={designModeId} />
      <Button type="submit" size="sm" variant="danger" disabled={pending}>Remove</Button>
      {message ? <span className="ml-2 text-xs text-danger">{message}</span> : null}
    </form>
  );
}
