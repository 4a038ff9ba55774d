/**
 * The `drift` queue: one job per asset, id `drift-<assetId>`, which replays the asset's drift
 * statistics from scratch (lib/services/drift/drift.service.ts). A second enqueue while a job
 * of the asset waits is ignored (the waiting job will read the newest data); the replay is
 * idempotent, so a retry is harmless.
 */
import { type Queue, type JobsOptions } from "bullmq";
import { z } from "zod";
import { getQueue, QUEUE_NAMES } from "./queues";

export const DRIFT_QUEUE = QUEUE_NAMES.drift;

export const DriftJob = z.strictObject({ assetId: z.uuid() });
export type DriftJob = z.infer<typeof DriftJob>;

/** Three attempts, 5 s then 10 s apart. */
export const DRIFT_JOB_OPTIONS: JobsOptions = {
  attempts: 3,
  backoff: { type: "exponential", delay: 5000 },
  removeOnComplete: true,
  removeOnFail: { count: 1000 },
};

export const driftJobId = (assetId: string): string => `drift-${assetId}`;

const WAITING_STATES = new Set(["waiting", "delayed", "prioritized", "waiting-children"]);

/** The process-wide producer of the drift queue. */
export function getDriftQueue(): Queue {
  return getQueue(DRIFT_QUEUE, DRIFT_JOB_OPTIONS);
}

/**
 * Queue a drift replay of the asset. A waiting job of the same asset absorbs this call; a
 * finished (failed) or running one is replaced by a new job a moment later, so the newest
 * data are always replayed.
 */
export async function enqueueDrift(assetId: string): Promise<{ jobId: string; added: boolean }> {
  const payload = DriftJob.parse({ assetId });
  const jobId = driftJobId(payload.assetId);
  const queue = getDriftQueue();
  const existing = await queue.getJob(jobId);
  if (existing) {
    const st = await existing.getState();
    if (WAITING_STATES.has(st)) return { jobId, added: false };
    // A running job keeps its id until it completes: queue the follow-up under a second id.
    if (st === "active") {
      const next = `${jobId}-next`;
      const pending = await queue.getJob(next);
      if (pending && WAITING_STATES.has(await pending.getState())) return { jobId: next, added: false };
      if (pending) await pending.remove().catch(() => undefined);
      await queue.add("replay", payload, { jobId: next, delay: 1000 });
      return { jobId: next, added: true };
    }
    await existing.remove().catch(() => undefined);
  }
  await queue.add("replay", payload, { jobId });
  return { jobId, added: true };
}
