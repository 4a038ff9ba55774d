/**
 * Domain types of the serviceability and design-comparison features (shared by repos,
 * services, pages and components; no I/O).
 */
import type { ModeDirection } from "./footbridge-frequency";

export const MODE_DIRECTIONS = ["vertical", "lateral", "torsional"] as const satisfies readonly ModeDirection[];

/** A design or finite-element mode entered by an engineer. */
export interface DesignMode {
  id: string;
  assetId: string;
  label: string;
  frequencyHz: number;
  direction: ModeDirection | null;
  /** Design shape at the sensor channels, by channel code; null when not given. */
  shape: Record<string, number> | null;
  /** Explicit link to a tracked mode; null → matched by nearest frequency. */
  trackedModeId: string | null;
  sourceNote: string | null;
  createdAt: Date;
  updatedAt: Date;
}

export interface ServiceabilityOverride { key: string; value: number; note: string | null; updatedAt: Date }

/** Per-asset inputs of the checks. */
export interface AssetServiceabilitySettings {
  assetId: string;
  sectionWidthM: number | null;
  dampingGuidanceKey: string | null;
}
