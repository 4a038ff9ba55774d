import type { DesignMode } from "@/lib/serviceability/types";

/** A design mode as it crosses to the browser. */
export type DesignModeJson = Omit<DesignMode, "createdAt" | "updatedAt">;

export function toDesignModeJson(m: DesignMode): DesignModeJson {
  return { id: m.id, assetId: m.assetId, label: m.label, frequencyHz: m.frequencyHz, direction: m.direction, shape: m.shape, trackedModeId: m.trackedModeId, sourceNote: m.sourceNote };
}
