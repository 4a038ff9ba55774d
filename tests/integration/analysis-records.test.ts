/**
 * Analysis settings, reprocessing, tracked modes and the records reads through their routes:
 * 401 / 404 / 422, role boundaries (owner and inspector read but change nothing; engineer
 * changes), version-pinned reprocessing that keeps earlier results, "track this mode" from an
 * identified mode, identification rates and keyset pagination.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as recordsUpload from "@/app/api/v1/records/route";
import * as settingsRoute from "@/app/api/v1/assets/[assetId]/settings/route";
import * as recordsRoute from "@/app/api/v1/assets/[assetId]/records/route";
import * as recordRoute from "@/app/api/v1/assets/[assetId]/records/[recordId]/route";
import * as reprocessRoute from "@/app/api/v1/assets/[assetId]/records/[recordId]/reprocess/route";
import * as retryRoute from "@/app/api/v1/assets/[assetId]/records/[recordId]/retry/route";
import * as rangeRoute from "@/app/api/v1/assets/[assetId]/records/reprocess/route";
import * as modesRoute from "@/app/api/v1/assets/[assetId]/tracked-modes/route";
import * as modeRoute from "@/app/api/v1/assets/[assetId]/tracked-modes/[trackedModeId]/route";
import { closeDb, db } from "@/lib/db/knex";
import { updateRecordStatus } from "@/lib/db/repos/record.repo";
import { NO_RAW_SAMPLES_BLOB_KEY } from "@/lib/domain/records";
import { analysisJobId, getAnalysisQueue } from "@/lib/jobs/analysis";
import { analyseRecord } from "@/lib/services/analysis/analysis.service";
import { listRecords, type RecordDetail } from "@/lib/services/analysis/records.service";
import type { TrackedModeView } from "@/lib/services/tracking/tracked-mode.service";
import { closeRateLimiter } from "@/lib/services/ingest/rate-limit";
import { addChannel } from "@/lib/services/assets/asset.service";
import { shearFrameModes, simulateAmbientRecord, simulateForcedTest } from "@/lib/simulate";
import { processAnalysisJob } from "@/workers/analysis.worker";
import { call, makeTeam, tokenFor, unique } from "./support/factories";
import { CHANNELS, f32Of, makeGatewayAsset, metaOf, noiseRecord, send, uploadRequest, type GatewaySetup } from "./support/uploads";
import { closeQueues } from "@/lib/jobs/queues";

// 4-storey shear frame, closed form 2.708, 7.797, 11.94, 14.65 Hz [pub: Chopra, Dynamics of
// Structures, MDOF chapters]; 100 Hz, 200 s, ζ = 0.5 %.
const FRAME = shearFrameModes(4, 2.4e7, 1.0e4);

let g: GatewaySetup;
let other: GatewaySetup;
const tok: Record<string, string> = {};
let otherEngineer: string;

beforeAll(async () => {
  await getAnalysisQueue().obliterate({ force: true });
  g = await makeGatewayAsset();
  other = await makeGatewayAsset(await makeTeam());
  for (const r of ["admin", "engineer", "inspector", "owner"] as const) tok[r] = await tokenFor(g.team[r]);
  otherEngineer = await tokenFor(other.team.engineer);
});
afterAll(async () => {
  await closeQueues();
  await closeRateLimiter();
  await closeDb();
});

async function uploadFrame(seed: number, startedAt: string): Promise<string> {
  const data = simulateAmbientRecord({
    modes: FRAME.map((m) => ({ frequencyHz: m.frequencyHz, dampingRatio: 0.005, shape: m.shape })), sampleRateHz: 100, durationS: 200, seed,
  }).data;
  const r = await send(recordsUpload.POST, uploadRequest({ key: g.key, meta: metaOf({ startedAt }), data: f32Of(data), type: "application/octet-stream" }));
  expect(r.status).toBe(202);
  return r.body.record!.id;
}

interface ListPage { records: { id: string }[]; nextCursor: string | null }

const p = (extra: Record<string, string> = {}) => ({ assetId: g.asset.id, ...extra });

describe("analysis settings routes", () => {
  it("gives every role version 1 with the defaults, and 401 without credentials", async () => {
    for (const r of ["owner", "inspector"]) {
      const res = await call(settingsRoute.GET, { token: tok[r], params: p() });
      expect(res.status).toBe(200);
      expect(res.body.settings).toMatchObject({ version: 1, settings: { bandHz: null, nperseg: null, methods: ["fdd"] }, form: { segmentLength: "auto" } });
    }
    expect((await call(settingsRoute.GET, { params: p() })).status).toBe(401);
  });

  it("lets an engineer save a new version and refuses owner and inspector (403)", async () => {
    const body = { bandLowHz: "1", bandHighHz: "20", decimationTargetHz: "", segmentLength: "1024", overlap: 0.5, methods: ["fdd", "ssi"], flatRunS: 2 };
    for (const r of ["owner", "inspector"]) expect((await call(settingsRoute.PUT, { method: "PUT", token: tok[r], params: p(), body })).status).toBe(403);
    const res = await call(settingsRoute.PUT, { method: "PUT", token: tok.engineer, params: p(), body });
    expect(res.status).toBe(200);
    expect(res.body.settings).toMatchObject({ version: 2, settings: { bandHz: [1, 20], nperseg: 1024, overlap: 0.5, methods: ["fdd", "ssi"], quality: { flatRunS: 2 } } });
    const audit = await db()("audit_log").where({ subject_id: g.asset.id, action: "analysis_settings.update" }).first("details");
    expect(audit.details).toMatchObject({ fromVersion: 1, version: 2 });
  });

  it("answers 422 with every field error, and 404 for an asset of another organisation", async () => {
    const res = await call(settingsRoute.PUT, { method: "PUT", token: tok.engineer, params: p(), body: { segmentLength: 1000, overlap: 0.95, methods: [], minRms: "abc" } });
    expect(res.status).toBe(422);
    const fe = (res.body.error as { details: { fieldErrors: Record<string, string[]> } }).details.fieldErrors;
    expect(Object.keys(fe).sort()).toEqual(["methods", "minRms", "overlap", "segmentLength"]);
    const band = await call(settingsRoute.PUT, { method: "PUT", token: tok.engineer, params: p(), body: { bandLowHz: 5, bandHighHz: 2, methods: "fdd" } });
    expect(band.status).toBe(422);
    expect(Object.keys((band.body.error as { details: { fieldErrors: Record<string, string[]> } }).details.fieldErrors)).toEqual(["bandHighHz"]);
    expect((await call(settingsRoute.PUT, { method: "PUT", token: otherEngineer, params: p(), body: { methods: ["fdd"] } })).status).toBe(404);
    expect((await call(settingsRoute.GET, { token: otherEngineer, params: p() })).status).toBe(404);
  });
});

describe("tracked mode routes", () => {
  it("creates a mode from a design frequency with a ±5 % band, refuses owner and inspector, 409 on a used label", async () => {
    const body = { label: unique("first sway"), nominalFrequencyHz: "2.8" };
    for (const r of ["owner", "inspector"]) expect((await call(modesRoute.POST, { method: "POST", token: tok[r], params: p(), body })).status).toBe(403);
    const res = await call(modesRoute.POST, { method: "POST", token: tok.engineer, params: p(), body });
    expect(res.status).toBe(201);
    const m = res.body.trackedMode as { bandLowHz: number; bandHighHz: number; active: boolean; referenceShape: unknown };
    expect(m.bandLowHz).toBeCloseTo(2.8 * 0.95, 12);
    expect(m.bandHighHz).toBeCloseTo(2.8 * 1.05, 12);
    expect(m).toMatchObject({ active: true, referenceShape: null });
    expect((await call(modesRoute.POST, { method: "POST", token: tok.engineer, params: p(), body })).status).toBe(409);
  });

  it("answers 422 for a missing frequency or a band that misses it, 404 across organisations, 401 without a token", async () => {
    const a = await call(modesRoute.POST, { method: "POST", token: tok.engineer, params: p(), body: { label: "x" } });
    expect(a.status).toBe(422);
    const b = await call(modesRoute.POST, { method: "POST", token: tok.engineer, params: p(), body: { label: "y", nominalFrequencyHz: 3, bandLowHz: 3.1, bandHighHz: 4 } });
    expect(b.status).toBe(422);
    expect((b.body.error as { details: { fieldErrors: Record<string, string[]> } }).details.fieldErrors).toHaveProperty("bandLowHz");
    expect((await call(modesRoute.POST, { method: "POST", token: otherEngineer, params: p(), body: { label: "z", nominalFrequencyHz: 3 } })).status).toBe(404);
    expect((await call(modesRoute.GET, { params: p() })).status).toBe(401);
  });

  it("edits and deactivates a mode; the list hides it unless asked", async () => {
    const created = await call(modesRoute.POST, { method: "POST", token: tok.admin, params: p(), body: { label: unique("torsion"), nominalFrequencyHz: 9 } });
    const id = (created.body.trackedMode as { id: string }).id;
    const owner = await call(modeRoute.PATCH, { method: "PATCH", token: tok.owner, params: p({ trackedModeId: id }), body: { label: "nope" } });
    expect(owner.status).toBe(403);
    const patched = await call(modeRoute.PATCH, { method: "PATCH", token: tok.engineer, params: p({ trackedModeId: id }), body: { nominalFrequencyHz: 9.2, bandLowHz: 8.5, bandHighHz: 9.9 } });
    expect(patched.status).toBe(200);
    expect(patched.body.trackedMode).toMatchObject({ nominalFrequencyHz: 9.2, bandLowHz: 8.5, bandHighHz: 9.9 });
    expect((await call(modeRoute.PATCH, { method: "PATCH", token: tok.engineer, params: p({ trackedModeId: id }), body: { bandHighHz: 9.1 } })).status).toBe(422);
    expect((await call(modeRoute.DELETE, { method: "DELETE", token: tok.inspector, params: p({ trackedModeId: id }) })).status).toBe(403);
    const del = await call(modeRoute.DELETE, { method: "DELETE", token: tok.engineer, params: p({ trackedModeId: id }) });
    expect(del.body.trackedMode).toMatchObject({ active: false });
    const listed = (await call(modesRoute.GET, { token: tok.owner, params: p() })).body.trackedModes as TrackedModeView[];
    expect(listed.some((m) => m.id === id)).toBe(false);
    const all = (await call(modesRoute.GET, { token: tok.owner, params: p(), path: "/x?includeInactive=true" }));
    expect(all.status).toBe(200);
    expect((await call(modeRoute.DELETE, { method: "DELETE", token: otherEngineer, params: { assetId: other.asset.id, trackedModeId: id } })).status).toBe(404);
  });
});

describe("record reads, tracking a record's mode and reprocessing", () => {
  let recordId: string;

  beforeAll(async () => {
    recordId = await uploadFrame(11, "2026-03-02T10:00:00Z");
    await analyseRecord(recordId);
  });

  it("shows the record with its modes, per-channel quality and spectra to an owner", async () => {
    const res = await call(recordRoute.GET, { token: tok.owner, params: p({ recordId }) });
    expect(res.status).toBe(200);
    const d = res.body as unknown as RecordDetail;
    expect(d.record.status).toBe("analysed");
    expect(d.analysis!.channelQuality.map((c) => c.channel)).toEqual(CHANNELS);
    // With nperseg 1024 (version 2 settings) the spectra have nperseg/2 + 1 lines ≤ 1024: not downsampled.
    expect(d.analysis!.singularValues.s1.length).toBe(d.analysis!.spectral.nperseg / 2 + 1);
    const f1 = d.analysis!.modes.map((m) => m.frequencyHz).find((f) => Math.abs(f / FRAME[0].frequencyHz - 1) < 0.005);
    expect(f1).toBeDefined();
    expect((await call(recordRoute.GET, { token: otherEngineer, params: p({ recordId }) })).status).toBe(404);
    expect((await call(recordRoute.GET, { token: tok.owner, params: { assetId: other.asset.id, recordId } })).status).toBe(404);
  });

  it("tracks the record's first mode with its frequency and shape, then counts it identified on reprocessing", async () => {
    const d = (await call(recordRoute.GET, { token: tok.engineer, params: p({ recordId }) })).body as unknown as RecordDetail;
    const first = d.analysis!.modes.find((m) => Math.abs(m.frequencyHz / FRAME[0].frequencyHz - 1) < 0.005)!;
    const made = await call(modesRoute.POST, { method: "POST", token: tok.engineer, params: p(), body: { label: unique("first bending"), fromRecordId: recordId, fromModeIndex: first.modeIndex } });
    expect(made.status).toBe(201);
    expect(made.body.trackedMode).toMatchObject({ nominalFrequencyHz: first.frequencyHz, referenceShape: first.shape, sourceRecordId: recordId, sourceModeIndex: first.modeIndex });

    for (const r of ["owner", "inspector"]) expect((await call(reprocessRoute.POST, { method: "POST", token: tok[r], params: p({ recordId }) })).status).toBe(403);
    await call(settingsRoute.PUT, { method: "PUT", token: tok.engineer, params: p(), body: { methods: ["fdd"], segmentLength: "2048" } });
    const current = ((await call(settingsRoute.GET, { token: tok.engineer, params: p() })).body.settings as { version: number }).version;
    const rp = await call(reprocessRoute.POST, { method: "POST", token: tok.engineer, params: p({ recordId }) });
    expect(rp.status).toBe(202);
    expect(rp.body).toMatchObject({ settingsVersion: current, jobId: analysisJobId(recordId, current), added: true });
    const job = await getAnalysisQueue().getJob(analysisJobId(recordId, current));
    expect(job?.data).toEqual({ recordId, settingsVersion: current });
    await processAnalysisJob(job!);

    const after = (await call(recordRoute.GET, { token: tok.owner, params: p({ recordId }) })).body as unknown as RecordDetail;
    expect(after.resultVersions[0]).toBe(current);
    expect(after.resultVersions).toContain(d.analysis!.settingsVersion);
    expect(after.analysis!.spectral.nperseg).toBe(2048);
    const outcome = after.analysis!.trackedModes.find((t) => t.trackedModeId === (made.body.trackedMode as { id: string }).id)!;
    expect(outcome).toMatchObject({ sought: true, identified: true });
    // The earlier result is still there, unchanged in its version.
    const older = await call(recordRoute.GET, { token: tok.owner, params: p({ recordId }), path: `/x?version=${d.analysis!.settingsVersion}` });
    expect((older.body as unknown as RecordDetail).analysis!.settingsVersion).toBe(d.analysis!.settingsVersion);

    const list = (await call(modesRoute.GET, { token: tok.inspector, params: p() })).body.trackedModes as TrackedModeView[];
    const rate = list.find((m) => m.id === (made.body.trackedMode as { id: string }).id)!.identification;
    expect(rate).toMatchObject({ analysed: 1, identified: 1, rate: 1 });
  });

  it("retries only a failed record (409 otherwise), for engineers only", async () => {
    expect((await call(retryRoute.POST, { method: "POST", token: tok.engineer, params: p({ recordId }) })).status).toBe(409);
    await updateRecordStatus(db(), recordId, { status: "failed", failureReason: "test: worker lost" });
    expect((await call(retryRoute.POST, { method: "POST", token: tok.owner, params: p({ recordId }) })).status).toBe(403);
    const res = await call(retryRoute.POST, { method: "POST", token: tok.engineer, params: p({ recordId }) });
    expect(res.status).toBe(202);
    const row = await db()("records").where({ id: recordId }).first("status", "failure_reason");
    expect(row).toEqual({ status: "queued", failure_reason: null });
  });

  it("refuses to reprocess a record whose raw samples are not kept (409), leaving its status alone", async () => {
    const other = await uploadFrame(12, "2026-03-02T11:00:00Z");
    await analyseRecord(other);
    await db()("records").where({ id: other }).update({ blob_key: NO_RAW_SAMPLES_BLOB_KEY });
    const res = await call(reprocessRoute.POST, { method: "POST", token: tok.engineer, params: p({ recordId: other }) });
    expect(res.status).toBe(409);
    expect(await db()("records").where({ id: other }).first("status")).toEqual({ status: "analysed" });
  });
});

describe("records list and range reprocessing", () => {
  let h: GatewaySetup;
  const ids: string[] = [];
  beforeAll(async () => {
    h = await makeGatewayAsset();
    for (let i = 0; i < 5; i++) {
      const r = await send(recordsUpload.POST, uploadRequest({
        key: h.key, meta: metaOf({ startedAt: `2026-04-0${i + 1}T08:00:00Z` }), data: f32Of(noiseRecord(3000, i)), type: "application/octet-stream",
      }));
      ids.push(r.body.record!.id);
    }
  });

  it("pages newest first with a cursor, every record once", async () => {
    const t = await tokenFor(h.team.owner);
    const seen: string[] = [];
    let cursor: string | null = null;
    do {
      const res = await call(recordsRoute.GET, { token: t, params: { assetId: h.asset.id }, path: `/x?limit=2${cursor ? `&cursor=${cursor}` : ""}` });
      expect(res.status).toBe(200);
      // The route sends the Records screen's row view (app/(app)/assets/[assetId]/records/_lib/views.ts).
      const page = res.body as unknown as ListPage;
      expect(page.records.length).toBeLessThanOrEqual(2);
      seen.push(...page.records.map((r) => r.id));
      cursor = page.nextCursor;
    } while (cursor);
    expect(seen).toEqual([...ids].reverse());
    const filtered = await call(recordsRoute.GET, { token: t, params: { assetId: h.asset.id }, path: "/x?from=2026-04-02T00:00:00Z&to=2026-04-04T00:00:00Z" });
    expect((filtered.body as unknown as ListPage).records.map((r) => r.id)).toEqual([ids[2], ids[1]]);
    // The service itself pages the same way (server components call it directly).
    const direct = await listRecords(h.team.owner.actor, h.asset.id, { limit: 3 });
    expect(direct.records.map((r) => r.record.id)).toEqual([ids[4], ids[3], ids[2]]);
    const rest = await listRecords(h.team.owner.actor, h.asset.id, { limit: 3, cursor: direct.nextCursor! });
    expect(rest.records.map((r) => r.record.id)).toEqual([ids[1], ids[0]]);
    expect(rest.nextCursor).toBeNull();
    expect((await call(recordsRoute.GET, { token: t, params: { assetId: h.asset.id }, path: "/x?limit=0&status=done" })).status).toBe(422);
    expect((await call(recordsRoute.GET, { token: t, params: { assetId: h.asset.id }, path: "/x?cursor=bm9wZQ" })).status).toBe(422);
    expect((await call(recordsRoute.GET, { params: { assetId: h.asset.id } })).status).toBe(401);
    expect((await call(recordsRoute.GET, { token: otherEngineer, params: { assetId: h.asset.id } })).status).toBe(404);
  });

  it("reprocesses a date range (records past their first analysis), engineers only, 422 for a reversed range", async () => {
    const eng = await tokenFor(h.team.engineer);
    await db()("records").whereIn("id", ids).update({ status: "analysed" });
    const body = { from: "2026-04-02T00:00:00Z", to: "2026-04-04T00:00:00Z" };
    expect((await call(rangeRoute.POST, { method: "POST", token: await tokenFor(h.team.inspector), params: { assetId: h.asset.id }, body })).status).toBe(403);
    expect((await call(rangeRoute.POST, { method: "POST", token: eng, params: { assetId: h.asset.id }, body: { from: body.to, to: body.from } })).status).toBe(422);
    const res = await call(rangeRoute.POST, { method: "POST", token: eng, params: { assetId: h.asset.id }, body });
    expect(res.status).toBe(202);
    expect(res.body).toMatchObject({ settingsVersion: 1, queued: 2, skipped: 0 });
    const statuses = await db()("records").whereIn("id", ids).orderBy("started_at").pluck("status");
    expect(statuses).toEqual(["analysed", "queued", "queued", "analysed", "analysed"]);
    for (const id of [ids[1], ids[2]]) expect(await getAnalysisQueue().getJob(analysisJobId(id, 1))).toBeDefined();
  });
});

describe("a forced-test record with a force channel", () => {
  it("leaves the force channel out of the identification and stores FRFs peaking at the closed-form frequencies", async () => {
    const h = await makeGatewayAsset();
    await addChannel(h.team.engineer.actor, h.asset.id, { code: "P1", positionM: { x: 0, y: 0, z: 12 }, direction: "x", quantity: "force", units: "N" });
    const sim = simulateForcedTest({
      // ζ = 3 %: the half-power bandwidth 2ζf ≥ 0.16 Hz spans ≥ 3 lines of 0.049 Hz, so the
      // resolution bias that lowers γ² at a sharp resonance stays small [pub: Bendat & Piersol §9.1.4].
      modes: FRAME.map((m) => ({ frequencyHz: m.frequencyHz, dampingRatio: 0.03, shape: m.shape })), driveChannel: 3,
      sampleRateHz: 100, durationS: 200, seed: 5, excitation: { kind: "random", forceRmsN: 200 },
    });
    const r = await send(recordsUpload.POST, uploadRequest({
      key: h.key, meta: metaOf({ channels: [...CHANNELS, "P1"] }), data: f32Of([...sim.data, sim.force]), type: "application/octet-stream",
    }));
    expect(r.status).toBe(202);
    const id = r.body.record!.id;
    await analyseRecord(id);
    const d = (await call(recordRoute.GET, { token: await tokenFor(h.team.owner), params: { assetId: h.asset.id, recordId: id } })).body as unknown as RecordDetail;
    expect(d.analysis!.channelsUsed).toEqual(CHANNELS);
    const frf = d.analysis!.frf!;
    expect(frf.forceChannel).toBe("P1");
    expect(frf.channels.map((c) => c.channel)).toEqual(CHANNELS);
    const drive = frf.channels[3];
    const df = frf.frequencyHz[1] - frf.frequencyHz[0];
    for (const m of FRAME) {
      // |H| peaks at each natural frequency (closed form [Chopra]) within two kept lines.
      let best = -1;
      frf.frequencyHz.forEach((f, i) => {
        if (f > 0.9 * m.frequencyHz && f < 1.1 * m.frequencyHz && (best < 0 || drive.magnitude[i] > drive.magnitude[best])) best = i;
      });
      expect(Math.abs(frf.frequencyHz[best] - m.frequencyHz)).toBeLessThanOrEqual(2 * df);
      // Noise-free force and response: γ² ≈ 1 at resonance [pub: Bendat & Piersol §6.1.3]; 0.9 allows leakage.
      expect(drive.coherence[best]).toBeGreaterThan(0.9);
    }
  });
});
