/** Input schemas of design (FE) modes. Form posts give `shape_<code>` fields, folded into `shape`. */
import { z } from "zod";
import { MODE_DIRECTIONS } from "@/lib/serviceability/types";
import { nullableTextField, numberField } from "@/lib/services/fields";

const label = z.string({ error: "Label is required." }).trim().min(1, "Label is required.").max(80, "At most 80 characters.");
const frequency = numberField("Design frequency").refine((v) => v > 0, "Design frequency must be greater than 0 Hz.");
const direction = z.preprocess((v) => (v === "" || v === undefined ? null : v), z.enum(MODE_DIRECTIONS, { error: "Pick vertical, lateral or torsional." }).nullable());
const trackedModeId = z.preprocess((v) => (v === "" || v === undefined ? null : v), z.uuid("Unknown tracked mode.").nullable());
const shape = z.record(z.string().min(1).max(40), z.number().refine(Number.isFinite, "Shape values must be finite.")).nullable();

/** Folds `shape_<code>` form fields (empty ones skipped) into `shape` (null when none is given). */
export function foldShapeFields(v: unknown): unknown {
  if (typeof v !== "object" || v === null) return v;
  const rest: Record<string, unknown> = {};
  const s: Record<string, number> = {};
  for (const [k, val] of Object.entries(v as Record<string, unknown>)) {
    if (!k.startsWith("shape_")) { rest[k] = val; continue; }
    if (typeof val === "string" && val.trim() !== "") s[k.slice(6)] = Number(val);
    else if (typeof val === "number") s[k.slice(6)] = val;
  }
  if (!("shape" in rest)) rest.shape = Object.keys(s).length ? s : null;
  return rest;
}

export const DesignModeInput = z.object({
  label, frequencyHz: frequency, direction: direction.optional().default(null), shape: shape.optional().default(null),
  trackedModeId: trackedModeId.optional().default(null), sourceNote: nullableTextField(300).optional().default(null),
});
export type DesignModeInput = z.infer<typeof DesignModeInput>;
