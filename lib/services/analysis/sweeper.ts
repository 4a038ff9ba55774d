/**
 * PostgreSQL is the source of truth for pending work: records left `received`, `queued` or
 * `analysing` without a live job (Redis flushed or lost, a crash between the insert and the
 * enqueue) are queued again. Safe to run from several processes: the job id dedupes.
 */
import { db } from "@/lib/db/knex";
import { findLatestAnalysisSettings } from "@/lib/db/repos/analysis-settings.repo";
import { listRecordsInStatus, updateRecordStatus } from "@/lib/db/repos/record.repo";
import { enqueueAnalysis, hasLiveAnalysisJob } from "@/lib/jobs/analysis";

export interface SweepOutcome { examined: number; requeued: string[] }

/**
 * Re-enqueue pending records whose status is older than `graceS` seconds and that have no
 * waiting, delayed or running job. Processes at most `limit` records per call.
 */
export async function sweepPendingRecords(options: { graceS?: number; limit?: number; now?: Date } = {}): Promise<SweepOutcome> {
  const now = options.now ?? new Date();
  const before = new Date(now.getTime() - (options.graceS ?? 60) * 1000);
  const pending = await listRecordsInStatus(db(), ["received", "queued", "analysing"], before, options.limit ?? 500);
  const requeued: string[] = [];
  const latestVersion = new Map<string, number[]>();
  for (const r of pending) {
    // A reprocess pins its job to the asset's latest version (analyse-<id>-v<n>): count it as live too.
    if (!latestVersion.has(r.assetId)) {
      const latest = await findLatestAnalysisSettings(db(), r.assetId);
      latestVersion.set(r.assetId, latest ? [latest.version] : []);
    }
    if (await hasLiveAnalysisJob(r.id, latestVersion.get(r.assetId))) continue;
    const { added } = await enqueueAnalysis(r.id, { replaceFinished: true });
    if (!added) continue;
    await updateRecordStatus(db(), r.id, { status: "queued" }, ["received", "queued", "analysing"]);
    requeued.push(r.id);
  }
  return { examined: pending.length, requeued };
}
