import type { AssetCondition, AssetSummary } from "@/lib/domain/types";
import { CONDITION_ORDER, CONDITION_STYLES } from "@/components/condition/conditions";
import { ConditionDot } from "@/components/condition/condition-badge";
import { cx } from "@/components/ui/cx";

/**
 * One count per condition, most urgent first. Each count is a toggle: pressing it filters
 * the table and the map to that condition (several may be pressed); "All" clears them.
 */
export function ConditionSummary({
  assets, selected, onToggle, onClear,
}: { assets: AssetSummary[]; selected: ReadonlySet<AssetCondition>; onToggle: (c: AssetCondition) => void; onClear: () => void }) {
  const tile = "rounded-md border px-3 py-1.5 text-left transition-colors";
  return (
    <div className="flex flex-wrap gap-2" data-testid="condition-summary" role="group" aria-label="Assets by condition (press to filter)">
      <button
        type="button"
        onClick={onClear}
        aria-pressed={selected.size === 0}
        className={cx(tile, selected.size === 0 ? "border-ink bg-surface ring-1 ring-ink" : "border-line bg-surface hover:bg-sunken")}
      >
        <span className="block text-xs text-muted">All assets</span>
        <span className="block text-lg font-semibold tabular-nums">{assets.length}</span>
      </button>
      {CONDITION_ORDER.map((c) => {
        const n = assets.filter((a) => a.condition === c).length;
        const on = selected.has(c);
        return (
          <button
            key={c}
            type="button"
            data-condition-count={c}
            aria-pressed={on}
            disabled={n === 0 && !on}
            onClick={() => onToggle(c)}
            title={CONDITION_STYLES[c].description}
            className={cx(tile, on ? "border-ink bg-surface ring-1 ring-ink" : "border-line bg-surface hover:bg-sunken", n === 0 && !on && "opacity-60")}
          >
            <span className="flex items-center gap-1.5 text-xs text-muted">
              <ConditionDot condition={c} size={8} />
              {CONDITION_STYLES[c].label}
            </span>
            <span className={cx("block text-lg font-semibold tabular-nums", n === 0 && "text-faint")}>{n}</span>
          </button>
        );
      })}
    </div>
  );
}
