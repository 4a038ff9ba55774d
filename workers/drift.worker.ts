/**
 * Consumer of the `drift` queue: parse the payload and replay the asset's drift statistics
 * (lib/services/drift/drift.service.ts). The replay is idempotent, so retries are harmless.
 */
import { UnrecoverableError, Worker, type Job } from "bullmq";
import type { Redis } from "ioredis";
import { DRIFT_QUEUE, DriftJob } from "@/lib/jobs/drift";
import { recomputeDrift, type DriftOutcome } from "@/lib/services/drift/drift.service";

export async function processDriftJob(job: Job): Promise<DriftOutcome> {
  const parsed = DriftJob.safeParse(job.data);
  if (!parsed.success) throw new UnrecoverableError(`invalid drift payload: ${parsed.error.message}`);
  return recomputeDrift(parsed.data.assetId);
}

/** One replay at a time per process: a replay reads the whole history of an asset. */
export function createDriftWorker(connection: Redis): Worker {
  return new Worker(DRIFT_QUEUE, processDriftJob, { connection, concurrency: 1 });
}
