"use client";

import Link from "next/link";
import { useMemo, useState } from "react";
import type { AssetCondition, AssetSummary } from "@/lib/domain/types";
import { ASSET_CONDITIONS } from "@/lib/domain/types";
import { CONDITION_ORDER, CONDITION_STYLES } from "@/components/condition/conditions";
import { ConditionBadge, ConditionDot } from "@/components/condition/condition-badge";
import { cx } from "@/components/ui/cx";
import { inputClass } from "@/components/ui/field";
import { formatDate, KIND_LABELS } from "@/components/ui/format";
import { Table, Td, Th } from "@/components/ui/table";

type SortKey = "name" | "kind" | "condition" | "mainDimensionM" | "channelCount" | "updatedAt";

const COLUMNS: Array<{ key: SortKey; label: string; numeric?: boolean }> = [
  { key: "name", label: "Asset" },
  { key: "kind", label: "Kind" },
  { key: "mainDimensionM", label: "Size", numeric: true },
  { key: "condition", label: "Condition" },
  { key: "channelCount", label: "Channels", numeric: true },
  { key: "updatedAt", label: "Updated" },
];

function compare(a: AssetSummary, b: AssetSummary, key: SortKey): number {
  switch (key) {
    case "condition":
      return CONDITION_ORDER.indexOf(a.condition) - CONDITION_ORDER.indexOf(b.condition);
    case "mainDimensionM":
      return (a.mainDimensionM ?? -Infinity) - (b.mainDimensionM ?? -Infinity);
    case "channelCount":
      return a.channelCount - b.channelCount;
    case "updatedAt":
      return a.updatedAt.localeCompare(b.updatedAt);
    case "kind":
      return KIND_LABELS[a.kind].localeCompare(KIND_LABELS[b.kind]);
    default:
      return a.name.localeCompare(b.name);
  }
}

/** The Portfolio's asset table: text filter, condition filter, sort by any column. */
export function AssetTable({ assets, loading }: { assets: AssetSummary[]; loading: boolean }) {
  const [query, setQuery] = useState("");
  const [conditions, setConditions] = useState<ReadonlySet<AssetCondition>>(new Set());
  const [sort, setSort] = useState<{ key: SortKey; dir: 1 | -1 }>({ key: "condition", dir: 1 });

  const rows = useMemo(() => {
    const q = query.trim().toLowerCase();
    return assets
      .filter((a) => conditions.size === 0 || conditions.has(a.condition))
      .filter((a) => !q || a.name.toLowerCase().includes(q) || KIND_LABELS[a.kind].toLowerCase().includes(q) || (a.material ?? "").toLowerCase().includes(q))
      .sort((a, b) => compare(a, b, sort.key) * sort.dir || a.name.localeCompare(b.name));
  }, [assets, query, conditions, sort]);

  function toggle(c: AssetCondition) {
    setConditions((prev) => {
      const next = new Set(prev);
      if (next.has(c)) next.delete(c);
      else next.add(c);
      return next;
    });
  }

  return (
    <section className="flex min-w-0 flex-col rounded-lg border border-line bg-surface" data-testid="asset-table">
      <div className="flex flex-wrap items-center gap-2 border-b border-line p-3">
        <label htmlFor="asset-filter" className="sr-only">
          Filter assets
        </label>
        <input
          id="asset-filter"
          type="search"
          placeholder="Filter by name, kind, material"
          value={query}
          onChange={(e) => setQuery(e.target.value)}
          className={cx(inputClass, "h-8 max-w-[15rem]")}
        />
        <div className="flex flex-wrap gap-1" role="group" aria-label="Filter by condition">
          {ASSET_CONDITIONS.filter((c) => assets.some((a) => a.condition === c)).map((c) => {
            const on = conditions.has(c);
            return (
              <button
                key={c}
                type="button"
                aria-pressed={on}
                onClick={() => toggle(c)}
                className={cx(
                  "inline-flex h-8 items-center gap-1.5 rounded-full border px-2.5 text-xs",
                  on ? "border-ink bg-ink text-white" : "border-line-strong bg-surface text-ink hover:bg-sunken",
                )}
              >
                <ConditionDot condition={c} size={8} />
                {CONDITION_STYLES[c].label}
              </button>
            );
          })}
        </div>
      </div>
      <Table>
        <thead>
          <tr>
            {COLUMNS.map((col) => {
              const active = sort.key === col.key;
              return (
                <Th key={col.key} className={col.numeric ? "text-right" : undefined} aria-sort={active ? (sort.dir === 1 ? "ascending" : "descending") : "none"}>
                  <button
                    type="button"
                    className={cx("inline-flex items-center gap-1 uppercase", active && "text-ink")}
                    onClick={() => setSort((s) => ({ key: col.key, dir: s.key === col.key ? (s.dir === 1 ? -1 : 1) : 1 }))}
                  >
                    {col.label}
                    <span aria-hidden className="text-[10px]">{active ? (sort.dir === 1 ? "▲" : "▼") : "↕"}</span>
                  </button>
                </Th>
              );
            })}
          </tr>
        </thead>
        <tbody>
          {rows.map((a) => (
            <tr key={a.id} className="hover:bg-canvas" data-asset-row={a.id}>
              <Td>
                <Link href={`/assets/${a.id}`} className="font-medium text-ink hover:text-accent hover:underline">
                  {a.name}
                </Link>
              </Td>
              <Td className="text-muted">{KIND_LABELS[a.kind]}</Td>
              <Td className="text-right tabular-nums">{a.mainDimensionM === null ? "—" : `${a.mainDimensionM} m`}</Td>
              <Td>
                <ConditionBadge condition={a.condition} />
              </Td>
              <Td className="text-right tabular-nums">{a.channelCount}</Td>
              <Td className="whitespace-nowrap text-muted tabular-nums">{formatDate(a.updatedAt)}</Td>
            </tr>
          ))}
          {rows.length === 0 ? (
            <tr>
              <Td colSpan={COLUMNS.length} className="py-8 text-center text-muted">
                {loading ? "Loading…" : assets.length === 0 ? "No assets yet." : "No asset matches the filter."}
              </Td>
            </tr>
          ) : null}
        </tbody>
      </Table>
    </section>
  );
}
