/**
 * Input schemas of tracked modes. A tracked mode is created either from an identified mode of
 * a record ("track this mode": frequency and shape taken from it) or from a design/FE
 * frequency entered by hand; the search band defaults to ±5 % of the nominal frequency
 * [practice: seasonal swings of a few % stay inside it].
 */
import { z } from "zod";
import { booleanField, nullableNumberField, numberField } from "@/lib/services/fields";

const label = z.string({ error: "Label is required." }).trim().min(1, "Label is required.").max(80, "At most 80 characters.");
const positive = (name: string) => numberField(name).refine((v) => v > 0, `${name} must be greater than 0 Hz.`);
const optionalPositive = (name: string) =>
  nullableNumberField(name).refine((v) => v === null || v > 0, `${name} must be greater than 0 Hz.`).optional();
const shape = z.record(z.string().min(1).max(40), z.number().refine(Number.isFinite, "Shape values must be finite."))
  .refine((s) => Object.keys(s).length >= 1, "A reference shape needs at least one channel.");

export const DEFAULT_BAND_FRACTION = 0.05;

export const CreateTrackedModeInput = z.object({
  label,
  nominalFrequencyHz: optionalPositive("Nominal frequency"),
  bandLowHz: optionalPositive("Band low edge"),
  bandHighHz: optionalPositive("Band high edge"),
  referenceShape: shape.nullable().optional(),
  fromRecordId: z.preprocess((v) => (v === "" || v === null ? undefined : v), z.uuid("Unknown record.").optional()),
  fromModeIndex: z.preprocess((v) => (v === "" || v === null || v === undefined ? undefined : typeof v === "string" ? Number(v) : v),
    z.number({ error: "Mode index must be a number." }).int().min(0, "Mode index must be ≥ 0.").optional()),
}).superRefine((v, ctx) => {
  const fromRecord = v.fromRecordId !== undefined || v.fromModeIndex !== undefined;
  if (fromRecord && (v.fromRecordId === undefined || v.fromModeIndex === undefined)) {
    ctx.addIssue({ code: "custom", path: [v.fromRecordId === undefined ? "fromRecordId" : "fromModeIndex"], message: "Give both the record and the mode to track." });
  }
  if (!fromRecord && (v.nominalFrequencyHz === undefined || v.nominalFrequencyHz === null)) {
    ctx.addIssue({ code: "custom", path: ["nominalFrequencyHz"], message: "Nominal frequency is required (or pick a mode of a record)." });
  }
  bandChecks(v, ctx);
});
export type CreateTrackedModeInput = z.infer<typeof CreateTrackedModeInput>;

export const UpdateTrackedModeInput = z.object({
  label: label.optional(),
  nominalFrequencyHz: positive("Nominal frequency").optional(),
  bandLowHz: positive("Band low edge").optional(),
  bandHighHz: positive("Band high edge").optional(),
  referenceShape: shape.nullable().optional(),
  active: booleanField.optional(),
}).superRefine(bandChecks);
export type UpdateTrackedModeInput = z.infer<typeof UpdateTrackedModeInput>;

interface BandLike { nominalFrequencyHz?: number | null; bandLowHz?: number | null; bandHighHz?: number | null }

function bandChecks(v: BandLike, ctx: z.RefinementCtx): void {
  const lo = v.bandLowHz ?? null;
  const hi = v.bandHighHz ?? null;
  const f = v.nominalFrequencyHz ?? null;
  if (lo !== null && hi !== null && lo >= hi) ctx.addIssue({ code: "custom", path: ["bandHighHz"], message: "The band's high edge must be above its low edge." });
  if (f !== null && lo !== null && lo > f) ctx.addIssue({ code: "custom", path: ["bandLowHz"], message: "The band must contain the nominal frequency." });
  if (f !== null && hi !== null && hi < f) ctx.addIssue({ code: "custom", path: ["bandHighHz"], message: "The band must contain the nominal frequency." });
}

const rateDate = (name: string) => z.preprocess(
  (v) => (v === "" ? undefined : v),
  z.coerce.date({ error: `${name} must be a date.` }).refine((d) => !Number.isNaN(d.getTime()), `${name} must be a date.`).optional(),
);

/** Period of `GET …/identification-rates`: ISO 8601 `from`/`to`, either may be left out. */
export const IdentificationRatesQuery = z.object({ from: rateDate("From"), to: rateDate("To") })
  .refine((v) => !v.from || !v.to || v.from < v.to, { path: ["to"], message: "The period must end after it starts." });
