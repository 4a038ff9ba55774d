/**
 * The asset condition as PRODUCT.md names it: `alert` is "confirmed drift, inspection asked".
 * The drift statistics decide whether drift is confirmed; an alert that is not closed is the
 * inspection asked. Once every alert of the asset is closed (the inspection was done and its
 * outcome recorded), drift still beyond its limits is shown as `watch` (an early warning that
 * remains until the statistics settle or an engineer fits a new baseline after a repair).
 */
import type { AssetCondition } from "@/lib/domain/types";

export function conditionWithAlerts(statistics: AssetCondition, hasAlertNotClosed: boolean): AssetCondition {
  if (statistics === "alert" && !hasAlertNotClosed) return "watch";
  return statistics;
}
