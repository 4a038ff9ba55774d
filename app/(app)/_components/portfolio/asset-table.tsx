"use client";

import Link from "next/link";
import { useMemo, useState } from "react";
import type { AssetSummary } from "@/lib/domain/types";
import { CONDITION_ORDER } from "@/components/condition/conditions";
import { ConditionBadge } from "@/components/condition/condition-badge";
import { cx } from "@/components/ui/cx";
import { formatDate, KIND_LABELS } from "@/components/ui/format";
import { Table, Td, Th } from "@/components/ui/table";

type SortKey = "name" | "kind" | "condition" | "openAlertCount" | "mainDimensionM" | "channelCount" | "updatedAt";

const COLUMNS: Array<{ key: SortKey; label: string; numeric?: boolean }> = [
  { key: "name", label: "Asset" },
  { key: "kind", label: "Kind" },
  { key: "mainDimensionM", label: "Size", numeric: true },
  { key: "condition", label: "Condition" },
  { key: "openAlertCount", label: "Open alerts", numeric: true },
  { key: "channelCount", label: "Channels", numeric: true },
  { key: "updatedAt", label: "Updated" },
];

function compare(a: AssetSummary, b: AssetSummary, key: SortKey): number {
  switch (key) {
    case "condition":
      return CONDITION_ORDER.indexOf(a.condition) - CONDITION_ORDER.indexOf(b.condition);
    case "mainDimensionM":
      return (a.mainDimensionM ?? -Infinity) - (b.mainDimensionM ?? -Infinity);
    case "openAlertCount":
      return a.openAlertCount - b.openAlertCount;
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

/** The Portfolio's asset table (the assets that pass the Portfolio's filters), sortable by any column. */
export function AssetTable({ assets, loading, total }: { assets: AssetSummary[]; loading: boolean; total: number }) {
  const [sort, setSort] = useState<{ key: SortKey; dir: 1 | -1 }>({ key: "condition", dir: 1 });
  const rows = useMemo(
    () => [...assets].sort((a, b) => compare(a, b, sort.key) * sort.dir || a.name.localeCompare(b.name)),
    [assets, sort],
  );

  return (
    <section className="flex min-w-0 flex-col rounded-lg border border-line bg-surface" data-testid="asset-table">
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
              <Td className={cx("text-right tabular-nums", a.openAlertCount === 0 && "text-faint")}>{a.openAlertCount}</Td>
              <Td className="text-right tabular-nums">{a.channelCount}</Td>
              <Td className="whitespace-nowrap text-muted tabular-nums">{formatDate(a.updatedAt)}</Td>
            </tr>
          ))}
          {rows.length === 0 ? (
            <tr>
              <Td colSpan={COLUMNS.length} className="py-8 text-center text-muted">
                {loading ? "Loading…" : total === 0 ? "No assets yet." : "No asset matches the filter."}
              </Td>
            </tr>
          ) : null}
        </tbody>
      </Table>
    </section>
  );
}
