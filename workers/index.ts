/**
 * The worker process (`node --import tsx workers/index.ts`): one process for every queue so
 * SIGTERM reaches it directly. On SIGTERM/SIGINT it closes the workers (letting running jobs
 * finish), then the producers, Redis, the SMTP transport and Knex.
 */
import type { Worker } from "bullmq";
import { createRedisConnection } from "@/lib/jobs/connection";
import { closeQueues, getQueue, QUEUE_NAMES } from "@/lib/jobs/queues";
import { scheduleMonthlyReports } from "@/lib/services/reports/monthly-schedule";
import { closeMailTransport } from "@/lib/email/transport";
import { closeDb } from "@/lib/db/knex";
import { createMailWorker } from "./mail.worker";
import { createAnalysisWorker, startRecordSweeper } from "./analysis.worker";
import { createDriftWorker } from "./drift.worker";
import { createReportsWorker } from "./reports.worker";

const connection = createRedisConnection();
const workers: Worker[] = [createMailWorker(connection), createAnalysisWorker(connection), createDriftWorker(connection), createReportsWorker(connection)];
const stopSweeper = startRecordSweeper();
// The monthly owners' report: one repeatable job (06:00 UTC on the 1st); re-registering is idempotent.
void scheduleMonthlyReports(getQueue(QUEUE_NAMES.reports)).catch((err: unknown) =>
  console.error(`monthly report schedule failed: ${err instanceof Error ? err.message : String(err)}`));

for (const w of workers) {
  w.on("failed", (job, err) => console.error(`${w.name} job ${job?.id ?? "?"} failed (attempt ${job?.attemptsMade ?? "?"}): ${err.message}`));
  w.on("error", (err) => console.error(`${w.name} worker error: ${err.message}`));
  w.on("completed", (job) => console.log(`${w.name} job ${job.id ?? "?"} completed`));
}
void Promise.all(workers.map((w) => w.waitUntilReady())).then(
  () => console.log(`worker ready: ${workers.map((w) => w.name).join(", ")} (pid ${process.pid})`),
  (err: unknown) => console.error(`worker start failed: ${err instanceof Error ? err.message : String(err)}`),
);

let closing = false;
async function shutdown(signal: string): Promise<void> {
  if (closing) return;
  closing = true;
  console.log(`${signal}: closing workers`);
  const force = setTimeout(() => process.exit(1), 15_000);
  force.unref();
  try {
    stopSweeper();
    await Promise.all(workers.map((w) => w.close()));
    await closeQueues();
    await connection.quit().catch(() => connection.disconnect());
    closeMailTransport();
    await closeDb();
  } finally {
    process.exit(0);
  }
}
process.on("SIGTERM", () => void shutdown("SIGTERM"));
process.on("SIGINT", () => void shutdown("SIGINT"));
