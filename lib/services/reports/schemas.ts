/** Input schemas of the report and export routes (issue 6 part 4). */
import { z } from "zod";

const date = (name: string) => z.coerce.date({ error: `${name} must be a date.` }).refine((d) => !Number.isNaN(d.getTime()), `${name} must be a date.`);
const optionalDate = (name: string) => z.preprocess((v) => (v === "" ? undefined : v), date(name).optional());

/** `from`/`to` as ISO 8601 (`to` exclusive); either may be left out (report default: the last 30 days). */
export const ReportQuery = z.object({
  from: optionalDate("From"),
  to: optionalDate("To"),
  format: z.enum(["pdf", "json"], { error: "Format must be pdf or json." }).default("pdf"),
}).refine((v) => !v.from || !v.to || v.from < v.to, { path: ["to"], message: "The period must end after it starts." });
export type ReportQuery = z.infer<typeof ReportQuery>;

export const ExportRangeQuery = z.object({
  from: optionalDate("From"),
  to: optionalDate("To"),
}).refine((v) => !v.from || !v.to || v.from < v.to, { path: ["to"], message: "The range must end after it starts." });

export const DictionaryQuery = z.object({
  format: z.enum(["md", "csv"], { error: "Format must be md or csv." }).default("md"),
});

/** Payload of a `reports` job: the month to report (YYYY-MM); default the month before the job's time. */
export const MonthlyReportJob = z.strictObject({
  month: z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, "month must be YYYY-MM").optional(),
});
export type MonthlyReportJob = z.infer<typeof MonthlyReportJob>;
