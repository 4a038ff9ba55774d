/**
 * Consumer of the `analysis` queue: parse the payload, run the analysis service, report
 * progress. Failures retry with backoff (lib/jobs/analysis.ts); the last attempt, or a
 * failure no retry can fix, marks the record `failed` with its reason. The sweeper timer
 * re-enqueues records left pending without a live job.
 */
import { UnrecoverableError, Worker, type Job } from "bullmq";
import type { Redis } from "ioredis";
import { env } from "@/lib/config/env";
import { ANALYSIS_QUEUE, AnalysisJob } from "@/lib/jobs/analysis";
import { analyseRecord, markRecordFailed, PermanentAnalysisError, type AnalyseOutcome } from "@/lib/services/analysis/analysis.service";
import { sweepPendingRecords } from "@/lib/services/analysis/sweeper";

export async function processAnalysisJob(job: Job): Promise<AnalyseOutcome> {
  const parsed = AnalysisJob.safeParse(job.data);
  if (!parsed.success) throw new UnrecoverableError(`invalid analysis payload: ${parsed.error.message}`);
  const { recordId, settingsVersion } = parsed.data;
  try {
    return await analyseRecord(recordId, { settingsVersion, onProgress: (p) => job.updateProgress(Math.round(p * 100)) });
  } catch (e) {
    const message = e instanceof Error ? e.message : String(e);
    const permanent = e instanceof PermanentAnalysisError;
    const lastAttempt = job.attemptsMade + 1 >= (job.opts.attempts ?? 1);
    if (permanent || lastAttempt) await markRecordFailed(recordId, message);
    if (permanent) throw new UnrecoverableError(message);
    throw e;
  }
}

export function createAnalysisWorker(connection: Redis, options: { concurrency?: number } = {}): Worker {
  return new Worker(ANALYSIS_QUEUE, processAnalysisJob, {
    connection,
    concurrency: options.concurrency ?? env().ANALYSIS_CONCURRENCY,
    // A job whose worker was killed keeps its lock until it expires; the stalled check of a
    // live worker then moves it back to waiting (once: maxStalledCount 1, BullMQ's default).
    lockDuration: env().ANALYSIS_STALL_TIMEOUT_S * 1000,
    stalledInterval: env().ANALYSIS_STALL_TIMEOUT_S * 1000,
  });
}

/** Run the sweeper every ANALYSIS_SWEEP_INTERVAL_S seconds (and once now); returns a stop function. */
export function startRecordSweeper(intervalS = env().ANALYSIS_SWEEP_INTERVAL_S): () => void {
  let running = false;
  const tick = async () => {
    if (running) return;
    running = true;
    try {
      const { requeued } = await sweepPendingRecords({ graceS: intervalS });
      if (requeued.length) console.log(`sweeper: re-enqueued ${requeued.length} pending record(s)`);
    } catch (e) {
      console.error(`sweeper failed: ${e instanceof Error ? e.message : String(e)}`);
    } finally {
      running = false;
    }
  };
  void tick();
  const timer = setInterval(() => void tick(), intervalS * 1000);
  timer.unref();
  return () => clearInterval(timer);
}
