/**
 * Analysis settings values (stored as JSON, one version per change) and how they become
 * options of the identification engine.
 */
import { z } from "zod";
import type { AnalysisSettingsValues, TrackedMode } from "@/lib/domain/records";
import type { IdentifyOptions } from "@/lib/modal/identify";

export const AnalysisSettingsSchema = z.strictObject({
  bandHz: z.tuple([z.number().min(0), z.number().positive()]).refine(([lo, hi]) => lo < hi, "The band needs low < high.").nullable(),
  decimationTargetHz: z.number().positive().nullable(),
  nperseg: z.number().int().min(64).max(1 << 16).refine((n) => (n & (n - 1)) === 0, "Use a power of two.").nullable(),
  overlap: z.number().min(0).max(0.9).optional(),
  methods: z.array(z.enum(["fdd", "ssi"])).min(1),
  quality: z.strictObject({
    flatRunS: z.number().positive().optional(),
    spikeSigma: z.number().positive().optional(),
    minRms: z.number().min(0).optional(),
    fullScale: z.number().positive().optional(),
  }),
}) satisfies z.ZodType<AnalysisSettingsValues>;

/** Version 1 of every asset: whole spectrum, no decimation, automatic segment length, FDD/EFDD. */
export const DEFAULT_ANALYSIS_SETTINGS: AnalysisSettingsValues = {
  bandHz: null, decimationTargetHz: null, nperseg: null, methods: ["fdd"], quality: {},
};

/**
 * Engine options for a record: the band of interest bounds the peak search; the lowest
 * tracked mode (lower band edge) drives the automatic segment length.
 */
export function identifyOptionsFor(settings: AnalysisSettingsValues, tracked: TrackedMode[], recordLength: number): IdentifyOptions {
  const lowest = tracked.length ? Math.min(...tracked.map((t) => t.bandLowHz)) : settings.bandHz?.[0] || undefined;
  return {
    methods: settings.methods,
    ...(settings.overlap !== undefined ? { overlap: settings.overlap } : {}),
    ...(settings.nperseg !== null && settings.nperseg <= recordLength ? { nperseg: settings.nperseg } : {}),
    ...(settings.nperseg === null && lowest ? { lowestFrequencyHz: lowest } : {}),
    quality: settings.quality,
    peakPicking: settings.bandHz ? { minFrequencyHz: settings.bandHz[0], maxFrequencyHz: settings.bandHz[1] } : {},
  };
}
