import { cx } from "@/components/ui/cx";
import { STATE_LABELS, stateTone } from "./labels";

/** The alert's lifecycle state as a small bordered label. */
export function AlertStateBadge({ state }: { state: string }) {
  return (
    <span data-alert-state={state} className={cx("inline-flex items-center rounded-full border px-2 py-0.5 text-xs font-medium", stateTone(state))}>
      {STATE_LABELS[state] ?? state}
    </span>
  );
}
