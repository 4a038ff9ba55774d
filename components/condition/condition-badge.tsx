import type { AssetCondition } from "@/lib/domain/types";
import { CONDITION_STYLES } from "./conditions";

/** A small dot + label for an asset condition, coloured from the one condition table. */
export function ConditionBadge({ condition }: { condition: AssetCondition }) {
  const s = CONDITION_STYLES[condition];
  return (
    <span className="inline-flex items-center gap-1.5 text-sm" data-condition={condition}>
      <ConditionDot condition={condition} />
      <span>{s.label}</span>
    </span>
  );
}

export function ConditionDot({ condition, size = 10 }: { condition: AssetCondition; size?: number }) {
  const s = CONDITION_STYLES[condition];
  return (
    <span
      aria-hidden
      className="inline-block shrink-0 rounded-full"
      style={{
        width: size,
        height: size,
        background: `var(--condition-${condition}-fill)`,
        boxShadow: `inset 0 0 0 ${s.outline ? 2 : 1}px var(--condition-${condition}-stroke)`,
      }}
    />
  );
}
