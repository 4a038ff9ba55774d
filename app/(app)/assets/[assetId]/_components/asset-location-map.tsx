"use client";

import dynamic from "next/dynamic";
import type { AssetSummary } from "@/lib/domain/types";

const PortfolioMap = dynamic(() => import("@/components/map/portfolio-map").then((m) => m.PortfolioMap), {
  ssr: false,
  loading: () => <div className="h-[380px] rounded-lg border border-line bg-sunken" />,
});

/** The asset on the map, drawn with the Portfolio's marker and legend. */
export function AssetLocationMap({ asset, styleUrl }: { asset: AssetSummary; styleUrl: string }) {
  return (
    <PortfolioMap assets={[asset]} styleUrl={styleUrl} maxZoom={7} className="relative h-[380px] overflow-hidden rounded-lg border border-line" />
  );
}
