/**
 * The queued analysis on the real stack: a simulated shear-frame record uploaded through
 * the route is analysed (service and in-process BullMQ worker), its modes assigned to the
 * tracked modes, stored once per (record, settings version); failures and the sweeper.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueueEvents } from "bullmq";
import * as recordsRoute from "@/app/api/v1/records/route";
import * as recordRoute from "@/app/api/v1/records/[recordId]/route";
import { closeDb, db } from "@/lib/db/knex";
import { updateRecordStatus } from "@/lib/db/repos/record.repo";
import type { TrackedMode } from "@/lib/domain/records";
import { createRedisConnection } from "@/lib/jobs/connection";
import { ANALYSIS_QUEUE, analysisJobId, getAnalysisQueue, hasLiveAnalysisJob } from "@/lib/jobs/analysis";
import { insertAnalysisSettingsVersion } from "@/lib/db/repos/analysis-settings.repo";
import { analyseRecord } from "@/lib/services/analysis/analysis.service";
import { getRecordDetail } from "@/lib/services/analysis/records.service";
import { DEFAULT_ANALYSIS_SETTINGS } from "@/lib/services/analysis/settings";
import { sweepPendingRecords } from "@/lib/services/analysis/sweeper";
import { closeRateLimiter } from "@/lib/services/ingest/rate-limit";
import { shearFrameModes, simulateAmbientRecord } from "@/lib/simulate";
import { blobStore } from "@/lib/storage";
import { createAnalysisWorker, processAnalysisJob } from "@/workers/analysis.worker";
import type { Job } from "bullmq";
import { tokenFor } from "./support/factories";
import { closeQueues } from "@/lib/jobs/queues";
import {
  CHANNELS, addTrackedMode, csvOf, f32Of, makeGatewayAsset, metaOf, noiseRecord, send, uploadRequest, type GatewaySetup,
} from "./support/uploads";

// Uniform 4-storey shear frame, k = 2.4e7 N/m, m = 1.0e4 kg per storey: closed-form
// ω_j = 2√(k/m)·sin((2j−1)π/(2(2N+1))) [pub: Chopra, Dynamics of Structures, MDOF chapters],
// i.e. 2.708, 7.797, 11.94, 14.65 Hz. ζ = 0.5 %, 100 Hz, 300 s: the frequency estimate's
// random error is ≈ √(ζ/(2πfT)) ≈ 0.1 % at the first mode [pub: Bendat & Piersol §8.5
// scaling], so 0.5 % leaves a wide margin.
const FRAME = shearFrameModes(4, 2.4e7, 1.0e4);
const FS = 100;
const DURATION_S = 300;

function frameRecord(seed: number): Float64Array[] {
  return simulateAmbientRecord({
    modes: FRAME.map((m) => ({ frequencyHz: m.frequencyHz, dampingRatio: 0.005, shape: m.shape })),
    sampleRateHz: FS, durationS: DURATION_S, seed,
  }).data;
}

let g: GatewaySetup;
let tracked: TrackedMode[];
const LABELS = ["first sway", "second sway", "third sway", "fourth sway"];

beforeAll(async () => {
  await getAnalysisQueue().obliterate({ force: true });
  g = await makeGatewayAsset();
  // Nominal values as a design model would give them: 3 % above the closed form, bands ±12 %.
  tracked = [];
  for (const [j, m] of FRAME.entries()) tracked.push(await addTrackedMode(g.asset.id, LABELS[j], m.frequencyHz * 1.03, 0.12, m.shape));
});
afterAll(async () => {
  await closeQueues();
  await closeRateLimiter();
  await closeDb();
});

async function uploadFrame(seed: number, format: "csv" | "f32" = "f32"): Promise<string> {
  const data = frameRecord(seed);
  const r = await send(recordsRoute.POST, uploadRequest(format === "csv"
    ? { key: g.key, meta: metaOf(), data: csvOf(CHANNELS, data) }
    : { key: g.key, meta: metaOf(), data: f32Of(data), type: "application/octet-stream", filename: "r.f32" }));
  expect(r.status).toBe(202);
  return r.body.record!.id;
}

describe("analysis of an uploaded shear-frame record", () => {
  it("identifies every storey mode within 0.5 % of the closed form and assigns each to its tracked mode", async () => {
    const id = await uploadFrame(3);
    const out = await analyseRecord(id);
    expect(out.status).toBe("analysed");
    expect(out.identifiedTracked).toBe(4);
    const view = await send(recordRoute.GET, new Request(`http://127.0.0.1/api/v1/records/${id}`, {
      headers: { authorization: `Bearer ${await tokenFor(g.team.owner)}` },
    }), { recordId: id });
    expect(view.status).toBe(200);
    expect(view.body.record).toMatchObject({ status: "analysed", progress: 1, analysedSettingsVersion: 1 });
    const a = view.body.analysis!;
    expect(a.verdict).toBe("accept");
    expect(a.trackedModes.map((t) => t.label)).toEqual(LABELS);
    a.trackedModes.forEach((t, j) => {
      expect(t.identified).toBe(true);
      // Closed form [Chopra]; tolerance 0.5 % (issue 4 check).
      expect(Math.abs(t.frequencyHz! / FRAME[j].frequencyHz - 1)).toBeLessThan(0.005);
      // Simulated shapes are the closed-form ones: MAC near 1 [Allemang & Brown 1982].
      expect(t.mac!).toBeGreaterThan(0.95);
    });
    expect(a.singularValues!.s1.length).toBe(a.spectral.nperseg / 2 + 1);
  });

  it("stores one result per (record, settings version): analysing again replaces it in place", async () => {
    const id = await uploadFrame(5, "csv");
    const first = await analyseRecord(id);
    const second = await analyseRecord(id);
    expect(second.resultId).toBe(first.resultId);
    const results = await db()("analysis_results").where({ record_id: id }).count<{ n: string }[]>({ n: "*" });
    expect(Number(results[0].n)).toBe(1);
    const modes = await db()("identified_modes").where({ result_id: first.resultId }).count<{ n: string }[]>({ n: "*" });
    expect(Number(modes[0].n)).toBe(second.modeCount);
    const assignments = await db()("mode_assignments").where({ result_id: first.resultId }).count<{ n: string }[]>({ n: "*" });
    expect(Number(assignments[0].n)).toBe(tracked.length);
  });

  it("rejects a record whose channels are all flat-lined and records every tracked mode as not identified", async () => {
    const flat = [new Float64Array(30000).fill(0.01), new Float64Array(30000).fill(0.02), new Float64Array(30000).fill(0.0), new Float64Array(30000).fill(0.03)];
    const r = await send(recordsRoute.POST, uploadRequest({ key: g.key, meta: metaOf(), data: f32Of(flat), type: "application/octet-stream" }));
    const out = await analyseRecord(r.body.record!.id);
    expect(out.status).toBe("rejected");
    expect(out.modeCount).toBe(0);
    const row = await db()("records").where({ id: out.recordId }).first("status", "failure_reason");
    expect(row.status).toBe("rejected");
    expect(row.failure_reason).toMatch(/^quality: /);
    const assignments = await db()("mode_assignments").where({ result_id: out.resultId }).select("identified_mode_id");
    expect(assignments).toHaveLength(tracked.length);
    expect(assignments.every((x: { identified_mode_id: string | null }) => x.identified_mode_id === null)).toBe(true);
  });
});

describe("stabilisation diagram data", () => {
  it("stores SSI-COV's poles as [order, frequency, damping, label] tuples and the record detail returns them", async () => {
    const s = await makeGatewayAsset();
    await insertAnalysisSettingsVersion(db(), s.asset.id, { ...DEFAULT_ANALYSIS_SETTINGS, methods: ["fdd", "ssi"] }, null);
    const r = await send(recordsRoute.POST, uploadRequest({ key: s.key, meta: metaOf(), data: f32Of(frameRecord(21)), type: "application/octet-stream", filename: "r.f32" }));
    expect(r.status).toBe(202);
    const out = await analyseRecord(r.body.record!.id);
    expect(out.status).toBe("analysed");
    const row = await db()("analysis_results").where({ id: out.resultId }).first("extras");
    const stab = row.extras.stabilisation as unknown[];
    expect(Array.isArray(stab)).toBe(true);
    expect(stab.length).toBeGreaterThan(0);
    for (const p of stab) {
      expect(p).toEqual([expect.any(Number), expect.any(Number), expect.any(Number), expect.stringMatching(/^(new|f|fd|fv|fdv)$/)]);
    }
    const tuples = stab as [number, number, number, string][];
    // Every closed-form storey mode [Chopra] appears as a column of poles stable in frequency
    // and shape (labels fv/fdv) within 1 % (the labelling tolerance between orders).
    for (const m of FRAME) {
      const column = tuples.filter(([, f, , l]) => Math.abs(f / m.frequencyHz - 1) < 0.01 && (l === "fv" || l === "fdv"));
      expect(column.length).toBeGreaterThanOrEqual(5);
    }
    // The Record page reads the same tuples through getRecordDetail (records.service).
    const detail = await getRecordDetail(s.team.owner.actor, s.asset.id, out.recordId);
    expect(detail.analysis!.stabilisation).toEqual(stab);
  });

  it("stores no stabilisation data when SSI-COV did not run", async () => {
    const id = await uploadFrame(23);
    const out = await analyseRecord(id);
    const row = await db()("analysis_results").where({ id: out.resultId }).first("extras");
    expect(row.extras?.stabilisation ?? null).toBeNull();
  });
});

describe("analysis worker", () => {
  it("processes the upload's analyse-<id> job in-process and reports progress", async () => {
    await getAnalysisQueue().obliterate({ force: true }); // earlier tests' jobs were run by hand
    const connection = createRedisConnection();
    const events = new QueueEvents(ANALYSIS_QUEUE, { connection: createRedisConnection() });
    await events.waitUntilReady();
    const worker = createAnalysisWorker(connection, { concurrency: 1 });
    const progress: number[] = [];
    worker.on("progress", (_job, p) => progress.push(Number(p)));
    try {
      const id = await uploadFrame(11);
      const job = await getAnalysisQueue().getJob(analysisJobId(id));
      expect(job).toBeDefined();
      const result = await job!.waitUntilFinished(events, 60_000);
      expect(result).toMatchObject({ recordId: id, status: "analysed", identifiedTracked: 4 });
      expect(progress.at(-1)).toBe(100);
      expect(progress).toEqual([...progress].sort((x, y) => x - y));
      const row = await db()("records").where({ id }).first("status");
      expect(row.status).toBe("analysed");
    } finally {
      await worker.close();
      await events.close();
      await connection.quit();
    }
  });

  it("marks the record failed with the reason when its samples are gone (no retry can help)", async () => {
    const s = await makeGatewayAsset();
    const r = await send(recordsRoute.POST, uploadRequest({ key: s.key, meta: metaOf(), data: csvOf(CHANNELS, noiseRecord(2000, Math.random() * 6)) }));
    const id = r.body.record!.id;
    const row = await db()("records").where({ id }).first("blob_key");
    await blobStore().delete(row.blob_key);
    const job = { data: { recordId: id }, attemptsMade: 0, opts: { attempts: 4 }, updateProgress: async () => undefined } as unknown as Job;
    await expect(processAnalysisJob(job)).rejects.toThrow(/raw samples .* missing/);
    const after = await db()("records").where({ id }).first("status", "failure_reason");
    expect(after.status).toBe("failed");
    expect(after.failure_reason).toMatch(/missing/);
  });

  it("leaves a transient failure to the retry until the last attempt, then marks the record failed", async () => {
    const s = await makeGatewayAsset();
    const r = await send(recordsRoute.POST, uploadRequest({ key: s.key, meta: metaOf(), data: csvOf(CHANNELS, noiseRecord(2000, Math.random() * 6)) }));
    const id = r.body.record!.id;
    const boom = async () => { throw new Error("worker lost its database connection"); };
    const job = (attemptsMade: number) => ({ data: { recordId: id }, attemptsMade, opts: { attempts: 4 }, updateProgress: boom }) as unknown as Job;
    await expect(processAnalysisJob(job(0))).rejects.toThrow(/database connection/);
    expect((await db()("records").where({ id }).first("status")).status).not.toBe("failed");
    await expect(processAnalysisJob(job(3))).rejects.toThrow(/database connection/);
    const after = await db()("records").where({ id }).first("status", "failure_reason");
    expect(after).toEqual({ status: "failed", failure_reason: "worker lost its database connection" });
  });
});

describe("sweeper", () => {
  it("re-enqueues pending records that lost their job (Redis flushed) and leaves live ones alone", async () => {
    const s = await makeGatewayAsset();
    const up = async () => (await send(recordsRoute.POST, uploadRequest({ key: s.key, meta: metaOf(), data: csvOf(CHANNELS, noiseRecord(2000, Math.random() * 6)) }))).body.record!.id;
    const a = await up();
    const b = await up();
    const c = await up();
    await getAnalysisQueue().obliterate({ force: true }); // as after a Redis loss
    await updateRecordStatus(db(), b, { status: "received" });
    const live = await up(); // still has its job
    const out = await sweepPendingRecords({ graceS: 0, now: new Date(Date.now() + 1000) });
    expect(out.requeued).toEqual(expect.arrayContaining([a, b, c]));
    expect(out.requeued).not.toContain(live);
    for (const id of [a, b, c, live]) expect(await hasLiveAnalysisJob(id)).toBe(true);
    const statuses = await db()("records").whereIn("id", [a, b, c]).pluck("status");
    expect(statuses).toEqual(["queued", "queued", "queued"]);
    // A second sweep finds every job live and queues nothing twice.
    const again = await sweepPendingRecords({ graceS: 0, now: new Date(Date.now() + 1000) });
    expect(again.requeued.filter((id) => [a, b, c, live].includes(id))).toEqual([]);
    await getAnalysisQueue().obliterate({ force: true });
  });
});
