/** Input schemas of baselines and history import (issue 5). */
import { z } from "zod";

const date = (name: string) => z.coerce.date({ error: `${name} must be a date.` }).refine((d) => !Number.isNaN(d.getTime()), `${name} must be a date.`);

export const FitBaselineInput = z.object({
  from: date("From"),
  to: date("To"),
  model: z.enum(["auto", "linear", "bilinear"]).default("auto"),
}).refine((v) => v.from < v.to, { path: ["to"], message: "The training window must end after it starts." });
export type FitBaselineInput = z.input<typeof FitBaselineInput>;
