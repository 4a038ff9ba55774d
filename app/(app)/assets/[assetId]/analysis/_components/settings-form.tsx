"use client";

import { Button } from "@/components/ui/button";
import { FieldError, TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { useFormAction } from "@/lib/client/use-form-action";
import { saveSettingsAction } from "../actions";

/** The flat form values of the current version (UpdateAnalysisSettingsInput). */
export interface SettingsFormValues {
  bandLowHz: number | null;
  bandHighHz: number | null;
  decimationTargetHz: number | null;
  segmentLength: number | "auto";
  overlap: number | null;
  methods: ("fdd" | "ssi")[];
  flatRunS: number | null;
  spikeSigma: number | null;
  minRms: number | null;
  fullScale: number | null;
}

const text = (v: number | null) => (v === null ? "" : String(v));
const SEGMENTS = [256, 512, 1024, 2048, 4096, 8192, 16384];

/** Analysis settings form (engineers, admins); saving adds the asset's next settings version. */
export function SettingsForm({ assetId, values }: { assetId: string; values: SettingsFormValues }) {
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(saveSettingsAction, { refreshOnSuccess: true });
  return (
    <form onSubmit={onSubmit} className="grid gap-4" data-testid="settings-form" noValidate>
      <input type="hidden" name="assetId" value={assetId} />
      <fieldset className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <legend className="mb-2 text-sm font-medium">Spectrum</legend>
        <TextField label="Band low (Hz)" name="bandLowHz" inputMode="decimal" defaultValue={text(values.bandLowHz)} placeholder="whole spectrum" errors={fieldErrors.bandLowHz} />
        <TextField label="Band high (Hz)" name="bandHighHz" inputMode="decimal" defaultValue={text(values.bandHighHz)} placeholder="whole spectrum" errors={fieldErrors.bandHighHz} hint="Peaks are picked in this band only." />
        <TextField label="Decimation target (Hz)" name="decimationTargetHz" inputMode="decimal" defaultValue={text(values.decimationTargetHz)} placeholder="none" errors={fieldErrors.decimationTargetHz} hint="Sample rate to reduce records to before analysis." />
        <TextField
          label="Segment length (samples)" name="segmentLength" list="segment-lengths" defaultValue={String(values.segmentLength)}
          errors={fieldErrors.segmentLength} hint="“auto”: chosen from the lowest tracked mode. Else a power of two."
        />
        <datalist id="segment-lengths">
          <option value="auto" />
          {SEGMENTS.map((n) => <option key={n} value={n} />)}
        </datalist>
        <TextField label="Segment overlap" name="overlap" inputMode="decimal" defaultValue={text(values.overlap)} placeholder="0.5" errors={fieldErrors.overlap} hint="Fraction 0–0.9; empty = 0.5." />
      </fieldset>
      <fieldset>
        <legend className="mb-2 text-sm font-medium">Methods</legend>
        <div className="flex flex-wrap gap-5 text-sm" aria-describedby={fieldErrors.methods ? "f-methods-error" : undefined}>
          <label className="inline-flex items-center gap-2">
            <input type="checkbox" name="methods" value="fdd" defaultChecked={values.methods.includes("fdd")} /> FDD / EFDD
          </label>
          <label className="inline-flex items-center gap-2">
            <input type="checkbox" name="methods" value="ssi" defaultChecked={values.methods.includes("ssi")} /> SSI-COV (with stabilisation diagram)
          </label>
        </div>
        <FieldError id="f-methods-error" messages={fieldErrors.methods} />
      </fieldset>
      <fieldset className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <legend className="mb-2 text-sm font-medium">Data-quality limits <span className="font-normal text-muted">(empty = default)</span></legend>
        <TextField label="Flat-line limit (s)" name="flatRunS" inputMode="decimal" defaultValue={text(values.flatRunS)} placeholder="1" errors={fieldErrors.flatRunS} hint="Longest run of identical samples accepted." />
        <TextField label="Spike threshold" name="spikeSigma" inputMode="decimal" defaultValue={text(values.spikeSigma)} placeholder="10" errors={fieldErrors.spikeSigma} hint="In robust standard deviations (σ)." />
        <TextField label="Minimum RMS" name="minRms" inputMode="decimal" defaultValue={text(values.minRms)} placeholder="1e-7" errors={fieldErrors.minRms} hint="Below it a channel counts as dead (record units)." />
        <TextField label="Sensor full scale" name="fullScale" inputMode="decimal" defaultValue={text(values.fullScale)} placeholder="not set" errors={fieldErrors.fullScale} hint="|a| limit for clipping (record units)." />
      </fieldset>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" variant="primary" disabled={pending}>{pending ? "Saving…" : "Save as new version"}</Button>
        {state?.ok ? (
          <Notice tone="success">Saved as version {state.data.version}. New records use it; reprocess a date range below to apply it to earlier ones.</Notice>
        ) : null}
        {message ? <Notice tone="error">{message}</Notice> : null}
      </div>
    </form>
  );
}
