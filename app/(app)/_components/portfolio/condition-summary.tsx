import type { AssetSummary } from "@/lib/domain/types";
import { CONDITION_ORDER, CONDITION_STYLES } from "@/components/condition/conditions";
import { ConditionDot } from "@/components/condition/condition-badge";

/** One count per condition, most urgent first. */
export function ConditionSummary({ assets }: { assets: AssetSummary[] }) {
  return (
    <dl className="flex flex-wrap gap-2" data-testid="condition-summary">
      <div className="rounded-md border border-line bg-surface px-3 py-1.5">
        <dt className="text-xs text-muted">Assets</dt>
        <dd className="text-lg font-semibold tabular-nums">{assets.length}</dd>
      </div>
      {CONDITION_ORDER.map((c) => {
        const n = assets.filter((a) => a.condition === c).length;
        return (
          <div key={c} className="rounded-md border border-line bg-surface px-3 py-1.5" data-condition-count={c}>
            <dt className="flex items-center gap-1.5 text-xs text-muted">
              <ConditionDot condition={c} size={8} />
              {CONDITION_STYLES[c].label}
            </dt>
            <dd className={n === 0 ? "text-lg font-semibold tabular-nums text-faint" : "text-lg font-semibold tabular-nums"}>{n}</dd>
          </div>
        );
      })}
    </dl>
  );
}
