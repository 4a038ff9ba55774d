/**
 * The `drift` queue: one job per asset, id `drift-<assetId>`, which replays the asset's drift
 * statistics from scratch (lib/services/drift/drift.service.ts). A second enqueue while a job
 * of the asset waits is ignored (the waiting job will read the newest data); the replay is
 * idempotent, so a retry is harmless.
 */
import { Queue, type JobsOptions } from "bullmq";
import type { Redis } from "ioredis";
import { z } from "zod";
import { createRedisConnection } from "./connection";

export const DRIFT_QUEUE = "drift";

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

interface DriftQueueState { connection: Redis | null; queue: Queue | null }
const globalForDrift = globalThis as unknown as { __modewardenDriftQueue?: DriftQueueState };

function state(): DriftQueueState {
  globalForDrift.__modewardenDriftQueue ??= { connection: null, queue: null };
  return globalForDrift.__modewardenDriftQueue;
}

/** The process-wide producer of the drift queue. */
export function getDriftQueue(): Queue {
  const s = state();
  if (!s.queue) {
    s.connection ??= createRedisConnection();
    s.queue = new Queue(DRIFT_QUEUE, { connection: s.connection, defaultJobOptions: DRIFT_JOB_OPTIONS });
  }
  return s.queue;
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

/** Close the producer and its connection (scripts, tests, worker shutdown). */
export async function closeDriftQueue(): Promise<void> {
  const s = state();
  const q = s.queue;
  const conn = s.connection;
  s.queue = null;
  s.connection = null;
  if (q) await q.close();
  if (conn) await conn.quit().catch(() => conn.disconnect());
}
