"use client";

import type { AssetKind, AssetSummary } from "@/lib/domain/types";
import { ASSET_KINDS } from "@/lib/domain/types";
import { CONDITION_STYLES } from "@/components/condition/conditions";
import { cx } from "@/components/ui/cx";
import { inputClass } from "@/components/ui/field";
import { KIND_LABELS } from "@/components/ui/format";
import type { PortfolioFilter } from "./filters";

const chip = (on: boolean) =>
  cx("inline-flex h-8 items-center gap-1.5 rounded-full border px-2.5 text-xs", on ? "border-ink bg-ink text-white" : "border-line-strong bg-surface text-ink hover:bg-sunken");

/** Text and kind filters of the Portfolio (conditions are toggled on the counts above). */
export function FilterBar({
  assets, filter, onQuery, onToggleKind, onClear, shown,
}: {
  assets: AssetSummary[]; filter: PortfolioFilter; shown: number;
  onQuery: (q: string) => void; onToggleKind: (k: AssetKind) => void; onClear: () => void;
}) {
  const kinds = ASSET_KINDS.filter((k) => assets.some((a) => a.kind === k));
  const active = filter.query.trim() !== "" || filter.kinds.size > 0 || filter.conditions.size > 0;
  return (
    <div className="flex flex-wrap items-center gap-2" data-testid="portfolio-filters">
      <label htmlFor="asset-filter" className="sr-only">Filter assets</label>
      <input
        id="asset-filter"
        type="search"
        placeholder="Filter by name, kind, material"
        value={filter.query}
        onChange={(e) => onQuery(e.target.value)}
        className={cx(inputClass, "h-8 max-w-[15rem]")}
      />
      <div className="flex flex-wrap gap-1" role="group" aria-label="Filter by kind">
        {kinds.map((k) => (
          <button key={k} type="button" aria-pressed={filter.kinds.has(k)} onClick={() => onToggleKind(k)} className={chip(filter.kinds.has(k))} data-kind-filter={k}>
            {KIND_LABELS[k]}
          </button>
        ))}
      </div>
      {active ? (
        <span className="ml-auto flex items-center gap-2 text-xs text-muted" data-testid="filter-status">
          {shown} of {assets.length} shown
          {filter.conditions.size > 0 ? ` · ${[...filter.conditions].map((c) => CONDITION_STYLES[c].label).join(", ")}` : ""}
          <button type="button" onClick={onClear} className="font-medium text-accent hover:underline">Clear filters</button>
        </span>
      ) : null}
    </div>
  );
}
