import type { AssetCondition, AssetKind, AssetSummary } from "@/lib/domain/types";
import { ASSET_CONDITIONS, ASSET_KINDS } from "@/lib/domain/types";
import { KIND_LABELS } from "@/components/ui/format";

/** The Portfolio's filters; the table and the map both show the assets that pass them. */
export interface PortfolioFilter {
  query: string;
  conditions: ReadonlySet<AssetCondition>;
  kinds: ReadonlySet<AssetKind>;
}

export const EMPTY_FILTER: PortfolioFilter = { query: "", conditions: new Set(), kinds: new Set() };

export function matchesFilter(a: AssetSummary, f: PortfolioFilter): boolean {
  const q = f.query.trim().toLowerCase();
  return (f.conditions.size === 0 || f.conditions.has(a.condition))
    && (f.kinds.size === 0 || f.kinds.has(a.kind))
    && (!q || a.name.toLowerCase().includes(q) || KIND_LABELS[a.kind].toLowerCase().includes(q) || (a.material ?? "").toLowerCase().includes(q));
}

/** `?condition=alert,watch&kind=mast&q=…` ⇄ filter (unknown values are ignored). */
export function filterFromSearch(params: URLSearchParams): PortfolioFilter {
  const split = (k: string) => (params.get(k) ?? "").split(",").filter(Boolean);
  return {
    query: params.get("q") ?? "",
    conditions: new Set(split("condition").filter((c): c is AssetCondition => (ASSET_CONDITIONS as readonly string[]).includes(c))),
    kinds: new Set(split("kind").filter((k): k is AssetKind => (ASSET_KINDS as readonly string[]).includes(k))),
  };
}

export function searchFromFilter(f: PortfolioFilter): string {
  const p = new URLSearchParams();
  if (f.conditions.size) p.set("condition", [...f.conditions].join(","));
  if (f.kinds.size) p.set("kind", [...f.kinds].join(","));
  if (f.query.trim()) p.set("q", f.query.trim());
  const s = p.toString();
  return s ? `?${s}` : "";
}

export function toggled<T>(set: ReadonlySet<T>, v: T): Set<T> {
  const next = new Set(set);
  if (next.has(v)) next.delete(v);
  else next.add(v);
  return next;
}
