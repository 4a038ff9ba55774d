"use client";

import dynamic from "next/dynamic";
import { useAssets } from "@/lib/client/use-assets";
import { Notice } from "@/components/ui/notice";
import { AssetTable } from "./asset-table";
import { ConditionSummary } from "./condition-summary";

// MapLibre needs the browser (WebGL, workers): no server rendering for the map.
const PortfolioMap = dynamic(() => import("@/components/map/portfolio-map").then((m) => m.PortfolioMap), {
  ssr: false,
  loading: () => <MapPlaceholder text="Loading map…" />,
});

function MapPlaceholder({ text }: { text: string }) {
  return (
    <div className="flex h-[460px] items-center justify-center rounded-lg border border-line bg-sunken text-sm text-muted">{text}</div>
  );
}

export function PortfolioView({ styleUrl }: { styleUrl: string }) {
  const { assets, error, isLoading } = useAssets();
  return (
    <div className="space-y-5">
      {error ? <Notice tone="error">Could not load the assets: {error.message}</Notice> : null}
      {assets ? <ConditionSummary assets={assets} /> : null}
      <div className="grid gap-5 xl:grid-cols-2">
        {assets ? <PortfolioMap assets={assets} styleUrl={styleUrl} /> : <MapPlaceholder text={isLoading ? "Loading assets…" : "No data"} />}
        <AssetTable assets={assets ?? []} loading={!assets && isLoading} />
      </div>
    </div>
  );
}
