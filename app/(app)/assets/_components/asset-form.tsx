"use client";

import dynamic from "next/dynamic";
import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import type { AssetJson } from "@/lib/domain/types";
import { ASSET_KINDS } from "@/lib/domain/types";
import { useFormAction, type ActionResult, type ActionState } from "@/lib/client/use-form-action";
import { Button, ButtonLink } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { KIND_LABELS } from "@/components/ui/format";
import { Notice } from "@/components/ui/notice";

const LocationPicker = dynamic(() => import("@/components/map/location-picker").then((m) => m.LocationPicker), {
  ssr: false,
  loading: () => <div className="h-64 rounded-md border border-line bg-sunken" />,
});

type AssetAction = (prev: ActionState<{ id: string }>, fd: FormData) => Promise<ActionResult<{ id: string }>>;

function num(s: string): number | null {
  if (s.trim() === "") return null;
  const n = Number(s);
  return Number.isFinite(n) ? n : null;
}

/** Create or edit an asset; the location is typed or picked on the small map. */
export function AssetForm({ action, asset, styleUrl }: { action: AssetAction; asset?: AssetJson; styleUrl: string }) {
  const router = useRouter();
  const { state, onSubmit, pending, fieldErrors, message } = useFormAction(action);
  const [lat, setLat] = useState(asset ? String(asset.latitude) : "");
  const [lon, setLon] = useState(asset ? String(asset.longitude) : "");

  useEffect(() => {
    if (state?.ok) {
      router.push(`/assets/${state.data.id}`);
      router.refresh();
    }
  }, [state, router]);

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-6 lg:grid-cols-2" data-testid="asset-form">
      {asset ? <input type="hidden" name="assetId" value={asset.id} /> : null}
      <div className="space-y-4">
        {message ? <Notice tone="error">{message}</Notice> : null}
        <TextField label="Name" name="name" defaultValue={asset?.name ?? ""} errors={fieldErrors.name} required maxLength={120} />
        <div className="grid grid-cols-2 gap-3">
          <SelectField
            label="Kind"
            name="kind"
            defaultValue={asset?.kind ?? "footbridge"}
            options={ASSET_KINDS.map((k) => ({ value: k, label: KIND_LABELS[k] }))}
            errors={fieldErrors.kind}
          />
          <TextField
            label="Main span or height (m)"
            name="mainDimensionM"
            inputMode="decimal"
            defaultValue={asset?.mainDimensionM ?? ""}
            errors={fieldErrors.mainDimensionM}
          />
        </div>
        <TextField label="Material" name="material" defaultValue={asset?.material ?? ""} errors={fieldErrors.material} hint="e.g. steel truss, glulam timber, reinforced concrete" />
        <TextField
          label="Expected record interval (min)"
          name="expectedIntervalMin"
          inputMode="numeric"
          defaultValue={asset?.expectedIntervalMin ?? 30}
          errors={fieldErrors.expectedIntervalMin}
          hint="With no accepted record for longer than this, the asset turns silent."
        />
        <div className="flex gap-2 pt-2">
          <Button type="submit" variant="primary" disabled={pending}>
            {pending ? "Saving…" : asset ? "Save changes" : "Create asset"}
          </Button>
          <ButtonLink href={asset ? `/assets/${asset.id}` : "/"}>Cancel</ButtonLink>
        </div>
      </div>
      <div className="space-y-3">
        <div className="grid grid-cols-2 gap-3">
          <TextField label="Latitude (°)" name="latitude" inputMode="decimal" value={lat} onChange={(e) => setLat(e.target.value)} errors={fieldErrors.latitude} />
          <TextField label="Longitude (°)" name="longitude" inputMode="decimal" value={lon} onChange={(e) => setLon(e.target.value)} errors={fieldErrors.longitude} />
        </div>
        <LocationPicker
          latitude={num(lat)}
          longitude={num(lon)}
          styleUrl={styleUrl}
          onPick={(la, lo) => {
            setLat(String(la));
            setLon(String(lo));
          }}
        />
        <p className="text-xs text-faint">Click the map to place the asset, or type WGS84 coordinates in decimal degrees.</p>
      </div>
    </form>
  );
}
