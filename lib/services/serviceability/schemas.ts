/** Input schemas of serviceability overrides and per-asset serviceability settings. */
import { z } from "zod";
import { FOOTBRIDGE_DAMPING_MATERIALS, TOWER_DAMPING_TYPES } from "@/lib/serviceability/damping-guidance";
import { SERVICEABILITY_KEYS } from "@/lib/serviceability/values";
import { nullableNumberField, nullableTextField } from "@/lib/services/fields";

/** Set (value given) or remove (value empty) one organisation override. */
export const SetOverrideInput = z.object({
  key: z.string().refine((k) => SERVICEABILITY_KEYS.has(k), "Unknown serviceability value."),
  value: nullableNumberField("Value").refine((v) => v === null || v > 0, "Value must be greater than 0."),
  note: nullableTextField(300).optional().default(null),
});
export type SetOverrideInput = z.infer<typeof SetOverrideInput>;

const GUIDANCE_KEYS = new Set([...TOWER_DAMPING_TYPES.map((t) => t.key), ...FOOTBRIDGE_DAMPING_MATERIALS.map((m) => m.key)]);

export const AssetServiceabilityInput = z.object({
  sectionWidthM: nullableNumberField("Section width").refine((v) => v === null || (v > 0 && v <= 100), "Section width must be between 0 and 100 m."),
  dampingGuidanceKey: z.preprocess((v) => (v === "" || v === undefined ? null : v),
    z.string().refine((k) => GUIDANCE_KEYS.has(k), "Unknown damping guidance row.").nullable()),
});
export type AssetServiceabilityInput = z.infer<typeof AssetServiceabilityInput>;

export const PERIOD_DAYS = [7, 30, 90, 365] as const;
