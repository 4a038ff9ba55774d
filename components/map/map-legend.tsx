import { CONDITION_ORDER, CONDITION_STYLES } from "@/components/condition/conditions";
import { ConditionDot } from "@/components/condition/condition-badge";
import { cx } from "@/components/ui/cx";

/** Condition legend for the map, in order of urgency. */
export function MapLegend({ className }: { className?: string }) {
  return (
    <div
      className={cx("rounded-md border border-line bg-surface/95 px-3 py-2 text-xs shadow-sm backdrop-blur", className)}
      data-testid="map-legend"
    >
      <div className="mb-1 font-medium uppercase tracking-wide text-muted">Condition</div>
      <ul className="space-y-0.5">
        {CONDITION_ORDER.map((c) => (
          <li key={c} className="flex items-center gap-2" title={CONDITION_STYLES[c].description}>
            <ConditionDot condition={c} size={9} />
            <span>{CONDITION_STYLES[c].label}</span>
          </li>
        ))}
      </ul>
    </div>
  );
}
