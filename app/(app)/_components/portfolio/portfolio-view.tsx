"use client";

import dynamic from "next/dynamic";
import { useSearchParams } from "next/navigation";
import { useCallback, useMemo, useState } from "react";
import { useAssets } from "@/lib/client/use-assets";
import type { AttentionItem } from "@/lib/services/overview/attention";
import { Notice } from "@/components/ui/notice";
import { AssetTable } from "./asset-table";
import { ConditionSummary } from "./condition-summary";
import { FilterBar } from "./filter-bar";
import { filterFromSearch, matchesFilter, searchFromFilter, toggled, type PortfolioFilter } from "./filters";
import { NeedsAttention } from "./needs-attention";

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

/**
 * Portfolio: counts by condition (press to filter), text and kind filters, the map and the
 * table (both show the filtered assets), and the "needs attention" list. Filters live in the
 * URL (`?condition=…&kind=…&q=…`) so a filtered view can be shared or reloaded.
 */
export function PortfolioView({ styleUrl, attention, timeZone }: { styleUrl: string; attention: AttentionItem[]; timeZone: string }) {
  const { assets, error, isLoading } = useAssets();
  const params = useSearchParams();
  const [filter, setFilterState] = useState<PortfolioFilter>(() => filterFromSearch(new URLSearchParams(params.toString())));
  const setFilter = useCallback((next: PortfolioFilter) => {
    setFilterState(next);
    window.history.replaceState(null, "", `${window.location.pathname}${searchFromFilter(next)}`);
  }, []);
  const shown = useMemo(() => (assets ?? []).filter((a) => matchesFilter(a, filter)), [assets, filter]);

  return (
    <div className="space-y-4">
      {error ? <Notice tone="error">Could not load the assets: {error.message}</Notice> : null}
      {assets ? (
        <ConditionSummary
          assets={assets}
          selected={filter.conditions}
          onToggle={(c) => setFilter({ ...filter, conditions: toggled(filter.conditions, c) })}
          onClear={() => setFilter({ ...filter, conditions: new Set() })}
        />
      ) : null}
      {assets ? (
        <FilterBar
          assets={assets}
          filter={filter}
          shown={shown.length}
          onQuery={(query) => setFilter({ ...filter, query })}
          onToggleKind={(k) => setFilter({ ...filter, kinds: toggled(filter.kinds, k) })}
          onClear={() => setFilter({ query: "", conditions: new Set(), kinds: new Set() })}
        />
      ) : null}
      <div className="grid gap-5 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        {assets ? <PortfolioMap assets={shown} styleUrl={styleUrl} /> : <MapPlaceholder text={isLoading ? "Loading assets…" : "No data"} />}
        <NeedsAttention items={attention} timeZone={timeZone} className="xl:h-[460px]" />
      </div>
      <AssetTable assets={shown} total={assets?.length ?? 0} loading={!assets && isLoading} />
    </div>
  );
}
