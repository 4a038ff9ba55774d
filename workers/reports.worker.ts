/**
 * Consumer of the `reports` queue: the monthly job (lib/services/reports/monthly-schedule.ts)
 * sends the previous month's asset reports to the owners. Mail jobs are keyed per asset,
 * month and owner, so a retry after a partial run sends only what is missing.
 */
import { UnrecoverableError, Worker, type Job } from "bullmq";
import type { Redis } from "ioredis";
import { REPORTS_QUEUE } from "@/lib/services/reports/monthly-schedule";
import { sendMonthlyReports, type MonthlyRunOutcome } from "@/lib/services/reports/monthly.service";
import { MonthlyReportJob } from "@/lib/services/reports/schemas";

export async function processReportsJob(job: Job): Promise<MonthlyRunOutcome> {
  const parsed = MonthlyReportJob.safeParse(job.data ?? {});
  if (!parsed.success) throw new UnrecoverableError(`invalid reports payload: ${parsed.error.message}`);
  // A scheduled job carries no month: the month before the job was created (its fire time).
  const outcome = await sendMonthlyReports({ month: parsed.data.month, nowMs: job.timestamp });
  // A failed asset fails the job so BullMQ retries it; the keyed mail jobs of the assets that
  // worked are not sent again.
  if (outcome.failures.length > 0) {
    throw new Error(`monthly reports ${outcome.month}: ${outcome.failures.length} asset(s) failed: ${outcome.failures.map((f) => `${f.assetId} (${f.message})`).join("; ")}`);
  }
  return outcome;
}

/** One run at a time: a run renders every asset's report. */
export function createReportsWorker(connection: Redis): Worker {
  return new Worker(REPORTS_QUEUE, processReportsJob, { connection, concurrency: 1 });
}
