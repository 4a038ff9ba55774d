/**
 * Input schemas of the analysis use cases (settings, reprocessing, the records list). Flat,
 * form-friendly fields (numbers as text, empty = none) so actions and routes parse with the
 * same schema; field names are the keys of `fieldErrors`.
 */
import { z } from "zod";
import { RECORD_STATUSES, type AnalysisSettingsValues } from "@/lib/domain/records";
import { nullableNumberField } from "@/lib/services/fields";

const METHODS = ["fdd", "ssi"] as const;

const methodsField = z.preprocess(
  (v) => (typeof v === "string" ? v.split(",").map((s) => s.trim()).filter(Boolean) : v),
  z.array(z.enum(METHODS, { error: "Choose fdd and/or ssi." }), { error: "Choose at least one method." })
    .min(1, "Choose at least one method.")
    .transform((a) => [...new Set(a)]),
);

/** "auto" (or empty) = automatic segment length; else a power of two 64…65536 samples. */
const segmentLengthField = z.preprocess(
  (v) => {
    if (v === null || v === undefined || v === "auto" || (typeof v === "string" && v.trim() === "")) return "auto";
    return typeof v === "string" ? Number(v.trim()) : v;
  },
  z.union([
    z.literal("auto"),
    z.number({ error: "Segment length must be 'auto' or a number of samples." }).int("Segment length must be a whole number of samples.")
      .min(64, "Segment length must be at least 64 samples.").max(65536, "Segment length must be at most 65536 samples.")
      .refine((n) => (n & (n - 1)) === 0, "Segment length must be a power of two (e.g. 1024, 2048, 4096)."),
  ]),
);

/** A number that may be left out, empty or null (→ null: no limit / automatic). */
const optionalNumber = (label: string) => z.preprocess((v) => (v === undefined ? null : v), nullableNumberField(label));

const positiveOrNull = (label: string) =>
  optionalNumber(label).refine((v) => v === null || v > 0, `${label} must be greater than 0.`);

/**
 * New analysis settings of an asset (saved as a new version): band of interest, decimation
 * target, segment length and overlap, methods and data-quality limits.
 */
export const UpdateAnalysisSettingsInput = z.object({
  bandLowHz: optionalNumber("Band low edge").refine((v) => v === null || v >= 0, "Band low edge must be ≥ 0 Hz."),
  bandHighHz: positiveOrNull("Band high edge"),
  decimationTargetHz: positiveOrNull("Decimation target"),
  segmentLength: segmentLengthField,
  overlap: optionalNumber("Overlap").refine((v) => v === null || (v >= 0 && v <= 0.9), "Overlap must be between 0 and 0.9."),
  methods: methodsField,
  flatRunS: positiveOrNull("Flat-line limit"),
  spikeSigma: positiveOrNull("Spike threshold"),
  minRms: optionalNumber("Minimum RMS").refine((v) => v === null || v >= 0, "Minimum RMS must be ≥ 0."),
  fullScale: positiveOrNull("Sensor full scale"),
}).superRefine((v, ctx) => {
  if ((v.bandLowHz === null) !== (v.bandHighHz === null)) {
    ctx.addIssue({ code: "custom", path: [v.bandLowHz === null ? "bandLowHz" : "bandHighHz"], message: "Give both band edges, or neither for the whole spectrum." });
  } else if (v.bandLowHz !== null && v.bandHighHz !== null && v.bandLowHz >= v.bandHighHz) {
    ctx.addIssue({ code: "custom", path: ["bandHighHz"], message: "The band's high edge must be above its low edge." });
  }
});
export type UpdateAnalysisSettingsInput = z.infer<typeof UpdateAnalysisSettingsInput>;

/** The stored settings value of a parsed input. */
export function settingsValuesOf(i: UpdateAnalysisSettingsInput): AnalysisSettingsValues {
  const quality: AnalysisSettingsValues["quality"] = {};
  if (i.flatRunS !== null) quality.flatRunS = i.flatRunS;
  if (i.spikeSigma !== null) quality.spikeSigma = i.spikeSigma;
  if (i.minRms !== null) quality.minRms = i.minRms;
  if (i.fullScale !== null) quality.fullScale = i.fullScale;
  return {
    bandHz: i.bandLowHz !== null && i.bandHighHz !== null ? [i.bandLowHz, i.bandHighHz] : null,
    decimationTargetHz: i.decimationTargetHz,
    nperseg: i.segmentLength === "auto" ? null : i.segmentLength,
    ...(i.overlap !== null ? { overlap: i.overlap } : {}),
    methods: i.methods,
    quality,
  };
}

const isoDate = (label: string) =>
  z.preprocess(
    (v) => (typeof v === "string" && v.trim() !== "" ? new Date(v) : v instanceof Date ? v : undefined),
    z.date({ error: `${label} must be a date (ISO 8601).` }).refine((d) => !Number.isNaN(d.getTime()), `${label} must be a valid date.`),
  );

/** Reprocess the records of an asset that started in [from, to). */
export const ReprocessRangeInput = z.object({ from: isoDate("From"), to: isoDate("To") })
  .refine((v) => v.from < v.to, { path: ["to"], message: "'To' must be after 'From'." });
export type ReprocessRangeInput = z.infer<typeof ReprocessRangeInput>;

const optionalIsoDate = (label: string) =>
  z.preprocess((v) => (v === "" || v === null ? undefined : v), isoDate(label).optional());

/** Query of the asset's records list (keyset pagination, newest first). */
export const ListRecordsQuery = z.object({
  status: z.preprocess((v) => (v === "" || v === null ? undefined : v), z.enum(RECORD_STATUSES, { error: "Unknown status." }).optional()),
  from: optionalIsoDate("From"),
  to: optionalIsoDate("To"),
  cursor: z.preprocess((v) => (v === "" || v === null ? undefined : v), z.string().max(200).optional()),
  limit: z.preprocess((v) => (v === "" || v === null || v === undefined ? 50 : typeof v === "string" ? Number(v) : v),
    z.number({ error: "Limit must be a number." }).int("Limit must be a whole number.").min(1, "Limit must be at least 1.").max(200, "Limit must be at most 200.")),
});
export type ListRecordsQuery = z.infer<typeof ListRecordsQuery>;

/** The flat form values of stored settings (the inverse of {@link settingsValuesOf}), for pre-filled forms. */
export function formValuesOf(s: AnalysisSettingsValues): UpdateAnalysisSettingsInput {
  return {
    bandLowHz: s.bandHz?.[0] ?? null, bandHighHz: s.bandHz?.[1] ?? null, decimationTargetHz: s.decimationTargetHz,
    segmentLength: s.nperseg ?? "auto", overlap: s.overlap ?? null, methods: [...s.methods],
    flatRunS: s.quality.flatRunS ?? null, spikeSigma: s.quality.spikeSigma ?? null, minRms: s.quality.minRms ?? null,
    fullScale: s.quality.fullScale ?? null,
  };
}
