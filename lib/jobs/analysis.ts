/**
 * The `analysis` queue: payload schema, job id and enqueue helpers. One job per record,
 * id `analyse-<recordId>` (upload, sweeper: the asset's latest settings at run time), or
 * `analyse-<recordId>-v<version>` for a reprocess pinned to a settings version, so a second
 * enqueue of a waiting or running job is ignored by BullMQ; the work itself is an upsert
 * keyed by (record, settings version), so a retry is harmless. Completed jobs are removed at once, which frees the id for a later reprocess
 * or sweep; failed ones are kept for inspection until replaced.
 */
import { type Queue, type Job, type JobsOptions } from "bullmq";
import { z } from "zod";
import { getQueue, QUEUE_NAMES } from "./queues";

export const ANALYSIS_QUEUE = QUEUE_NAMES.analysis;

export const AnalysisJob = z.strictObject({
  recordId: z.uuid(),
  /** Analyse with this settings version; absent = the asset's latest at run time. */
  settingsVersion: z.number().int().positive().optional(),
});
export type AnalysisJob = z.infer<typeof AnalysisJob>;

/** Four attempts, 5 s then 10 s then 20 s apart (exponential backoff). */
export const ANALYSIS_JOB_OPTIONS: JobsOptions = {
  attempts: 4,
  backoff: { type: "exponential", delay: 5000 },
  removeOnComplete: true,
  removeOnFail: { count: 5000 },
};

/** BullMQ job ids are strings without ':'; uuids qualify. A pinned version gets its own id. */
export const analysisJobId = (recordId: string, settingsVersion?: number): string =>
  settingsVersion === undefined ? `analyse-${recordId}` : `analyse-${recordId}-v${settingsVersion}`;

const LIVE_STATES = new Set(["active", "waiting", "waiting-children", "delayed", "prioritized"]);

/** The process-wide producer of the analysis queue. */
export function getAnalysisQueue(): Queue {
  return getQueue(ANALYSIS_QUEUE, ANALYSIS_JOB_OPTIONS);
}

/**
 * Queue the analysis of a record. With `replaceFinished`, a failed (or kept completed) job
 * of the same id is removed first so the record runs again (sweeper, retry button).
 * @returns the job id and whether a new job was added (false: one is already live).
 */
export async function enqueueAnalysis(
  recordId: string, options: { replaceFinished?: boolean; settingsVersion?: number } = {},
): Promise<{ jobId: string; added: boolean }> {
  const payload = AnalysisJob.parse({ recordId, settingsVersion: options.settingsVersion });
  const jobId = analysisJobId(payload.recordId, payload.settingsVersion);
  const queue = getAnalysisQueue();
  const existing = await queue.getJob(jobId);
  if (existing) {
    const st = await existing.getState();
    if (LIVE_STATES.has(st)) return { jobId, added: false };
    if (!options.replaceFinished) return { jobId, added: false };
    await existing.remove();
  }
  const data: AnalysisJob = payload.settingsVersion === undefined ? { recordId: payload.recordId } : payload;
  await queue.add("analyse", data, { jobId });
  return { jobId, added: true };
}

/**
 * Queue the analysis of a record just inserted. It cannot have a job yet, so none is looked up
 * first (one Redis round trip less per upload); BullMQ keeps an existing job with the same id
 * as it is anyway.
 */
export async function enqueueNewRecordAnalysis(recordId: string): Promise<void> {
  const payload = AnalysisJob.parse({ recordId });
  await getAnalysisQueue().add("analyse", { recordId: payload.recordId }, { jobId: analysisJobId(payload.recordId) });
}

/**
 * Whether the record has a job waiting, delayed or running: the unpinned one, or one pinned
 * to any of `versions` (e.g. the asset's latest settings version).
 */
export async function hasLiveAnalysisJob(recordId: string, versions: readonly number[] = []): Promise<boolean> {
  for (const id of [analysisJobId(recordId), ...versions.map((v) => analysisJobId(recordId, v))]) {
    const job: Job | undefined = await getAnalysisQueue().getJob(id);
    if (job && LIVE_STATES.has(await job.getState())) return true;
  }
  return false;
}
