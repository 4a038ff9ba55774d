/** Input schemas of baselines and history import (issue 5). */
import { z } from "zod";

const date = (name: string) => z.coerce.date({ error: `${name} must be a date.` }).refine((d) => !Number.isNaN(d.getTime()), `${name} must be a date.`);

export const FitBaselineInput = z.object({
  from: date("From"),
  to: date("To"),
  model: z.enum(["auto", "linear", "bilinear"]).default("auto"),
}).refine((v) => v.from < v.to, { path: ["to"], message: "The training window must end after it starts." });
export type FitBaselineInput = z.input<typeof FitBaselineInput>;

const optionalDate = (name: string) => z.preprocess((v) => (v === "" ? undefined : v), date(name).optional());

/** Range of the trends read API: `from`/`to` as ISO 8601 (either may be left out). */
export const TrendsRangeQuery = z.object({
  from: optionalDate("From"),
  to: optionalDate("To"),
}).refine((v) => !v.from || !v.to || v.from < v.to, { path: ["to"], message: "The range must end after it starts." });

export const TREND_CHARTS = ["frequency", "ewma", "t2", "damping", "temperature"] as const;
export type TrendChart = (typeof TREND_CHARTS)[number];

export const TrendsCsvQuery = z.object({
  chart: z.enum(TREND_CHARTS, { error: "Chart must be one of frequency, ewma, t2, damping, temperature." }),
  from: optionalDate("From"),
  to: optionalDate("To"),
}).refine((v) => !v.from || !v.to || v.from < v.to, { path: ["to"], message: "The range must end after it starts." });
