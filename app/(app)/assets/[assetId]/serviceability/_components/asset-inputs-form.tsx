"use client";

import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { useFormAction } from "@/lib/client/use-form-action";
import { updateAssetServiceabilityAction } from "../actions";

/** Section width (towers) and the damping guidance row of the asset (engineers, admins). */
export function AssetInputsForm({ assetId, isTower, sectionWidthM, guidanceKey, guidanceOptions }: {
  assetId: string; isTower: boolean; sectionWidthM: number | null; guidanceKey: string | null;
  guidanceOptions: { value: string; label: string }[];
}) {
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(updateAssetServiceabilityAction, { refreshOnSuccess: true });
  return (
    <form onSubmit={onSubmit} className="flex flex-wrap items-end gap-3" data-testid="serviceability-inputs" noValidate>
      <input type="hidden" name="assetId" value={assetId} />
      {isTower ? (
        <TextField label="Section width b (m)" name="sectionWidthM" inputMode="decimal" defaultValue={sectionWidthM ?? ""} errors={fieldErrors.sectionWidthM}
          wrapperClassName="w-44" hint="Cross-wind width of the section near the top" />
      ) : <input type="hidden" name="sectionWidthM" value={sectionWidthM ?? ""} />}
      <SelectField label="Damping guidance" name="dampingGuidanceKey" defaultValue={guidanceKey ?? ""} errors={fieldErrors.dampingGuidanceKey}
        options={[{ value: "", label: "Guess from material" }, ...guidanceOptions]} wrapperClassName="w-80" />
      <Button type="submit" variant="primary" disabled={pending}>{pending ? "Saving…" : "Save"}</Button>
      {message ? <Notice tone="error" className="basis-full">{message}</Notice> : null}
      {state?.ok ? <Notice tone="success" className="basis-full">Saved.</Notice> : null}
    </form>
  );
}
