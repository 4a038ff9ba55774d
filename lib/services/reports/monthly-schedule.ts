/**
 * Scheduling of the monthly reports: the `reports` queue holds one job scheduler that adds a
 * job at 06:00 UTC on the 1st of every month; the reports worker (workers/reports.worker.ts)
 * sends the previous month's reports. Upserting the scheduler is idempotent (same id).
 */
import type { Queue } from "bullmq";
import { QUEUE_NAMES } from "@/lib/jobs/queues";

/** Queue name (one list of queues: lib/jobs/queues.ts). */
export const REPORTS_QUEUE = QUEUE_NAMES.reports;
export const MONTHLY_SCHEDULER_ID = "monthly-reports";
/** Cron: minute 0, hour 6, day 1, every month (UTC). */
export const MONTHLY_CRON = "0 6 1 * *";

/** Create or update the monthly job scheduler on `queue` (the producer of REPORTS_QUEUE). */
export async function scheduleMonthlyReports(queue: Queue): Promise<void> {
  if (queue.name !== REPORTS_QUEUE) throw new RangeError(`monthly reports go on the ${REPORTS_QUEUE} queue (got ${queue.name})`);
  await queue.upsertJobScheduler(MONTHLY_SCHEDULER_ID, { pattern: MONTHLY_CRON, tz: "UTC" }, {
    name: "monthly",
    data: {},
    opts: { attempts: 3, backoff: { type: "exponential", delay: 60_000 }, removeOnComplete: { count: 100 }, removeOnFail: { count: 100 } },
  });
}
