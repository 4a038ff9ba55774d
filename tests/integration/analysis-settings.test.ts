/**
 * Analysis screen reads and writes through their services: identification rates of tracked
 * modes over a period (hand-counted on a small set of records and results written straight
 * into the tables), the settings version history, and the range-reprocess preview.
 */
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/lib/db/knex";
import { upsertAnalysisResult, type AssignmentWrite, type ModeWrite } from "@/lib/db/repos/analysis-result.repo";
import { insertRecord, updateRecordStatus } from "@/lib/db/repos/record.repo";
import { insertTrackedMode, updateTrackedModeById } from "@/lib/db/repos/tracked-mode.repo";
import { NO_RAW_SAMPLES_BLOB_KEY, type RecordStatus, type TrackedMode } from "@/lib/domain/records";
import { AppError } from "@/lib/http/errors";
import { closeQueues } from "@/lib/jobs/queues";
import { planReprocessRange } from "@/lib/services/analysis/reprocess.service";
import { UpdateAnalysisSettingsInput } from "@/lib/services/analysis/schemas";
import { listAnalysisSettingsHistory, updateAnalysisSettings } from "@/lib/services/analysis/settings.service";
import { getIdentificationRates } from "@/lib/services/tracking/identification-rate.service";
import { createTrackedMode } from "@/lib/services/tracking/tracked-mode.service";
import * as ratesRoute from "@/app/api/v1/assets/[assetId]/identification-rates/route";
import { call, tokenFor } from "./support/factories";
import { CHANNELS, makeGatewayAsset, type GatewaySetup } from "./support/uploads";

let g: GatewaySetup;
let other: GatewaySetup;
const modes: Record<"A" | "B" | "C" | "D", TrackedMode> = {} as Record<"A" | "B" | "C" | "D", TrackedMode>;
const started: Record<string, Date> = {};

beforeAll(async () => {
  g = await makeGatewayAsset();
  other = await makeGatewayAsset(g.team);
});
afterAll(async () => {
  await closeQueues();
  await closeDb();
});

const shape = Object.fromEntries(CHANNELS.map((c, i) => [c, (i + 1) / CHANNELS.length]));

function modeAt(modeIndex: number, frequencyHz: number): ModeWrite {
  return {
    modeIndex, frequencyHz, dampingRatio: 0.01, dampingMethod: "efdd", dampingReliable: true, mpc: 0.98, shape,
    shapeComplex: { re: shape, im: Object.fromEntries(CHANNELS.map((c) => [c, 0])) }, estimates: {}, possiblyCoupled: false,
  };
}

/** A record of `setup`'s asset with the given status and analysed version (blob-less: no worker involved). */
async function makeRecord(setup: GatewaySetup, name: string, startedAt: string, status: RecordStatus, analysedVersion: number | null, blobKey = `test/${randomUUID()}`) {
  started[name] = new Date(startedAt);
  const r = await insertRecord(db(), {
    organisationId: setup.team.org.id, assetId: setup.asset.id, gatewayId: setup.gatewayId, gatewayRecordId: `${name}-${randomUUID()}`,
    startedAt: started[name], sampleRateHz: 100, channels: CHANNELS, units: "m/s2", temperatureC: 5, environment: {},
    contentHash: randomUUID().replaceAll("-", "").repeat(2), blobKey, dataFormat: "f32le", byteSize: 1600, sampleCount: 100, durationS: 1,
  });
  await updateRecordStatus(db(), r.id, { status, ...(analysedVersion !== null ? { analysedSettingsVersion: analysedVersion } : {}) });
  return r.id;
}

/** A result of `version` with the given modes; `assigned` maps tracked mode → mode index (null: sought, not found). */
async function addResult(recordId: string, version: number, freqs: number[], assigned: [TrackedMode, number | null][]) {
  const assignments: AssignmentWrite[] = assigned.map(([t, i]) => ({ trackedModeId: t.id, modeIndex: i, mac: i === null ? null : 0.95, frequencyDeviation: null, cost: null }));
  await upsertAnalysisResult(db(), {
    recordId, settingsVersion: version, verdict: "accept", quality: { channels: [], verdict: { kind: "accept" } }, channelsUsed: CHANNELS,
    spectral: { nperseg: 1024, noverlap: 512, lineSpacingHz: 0.1, averages: 10 },
    singularValues: { frequencyHz: [0, 1], s1: [1, 1], s2: null, s3: null }, warnings: [], timingsMs: {}, engineVersion: "test", extras: null,
  }, freqs.map((f, i) => modeAt(i, f)), assignments);
}

describe("identification rates of tracked modes", () => {
  const MARCH = { from: new Date("2026-03-01T00:00:00Z"), to: new Date("2026-03-31T00:00:00Z") };

  beforeAll(async () => {
    const add = (label: string, f: number) => insertTrackedMode(db(), g.asset.id, {
      label, nominalFrequencyHz: f, bandLowHz: f * 0.95, bandHighHz: f * 1.05, referenceShape: null,
    });
    modes.A = await add("A first bending", 2);
    modes.B = await add("B first torsion", 5);
    modes.C = await add("C second bending", 8);
    modes.D = await add("D retired", 11);
    await updateTrackedModeById(db(), modes.D.id, { active: false });
    const { A, B, C } = modes;

    // R1: A and B found, nothing unassigned; C not yet tracked when analysed (no row for it).
    const r1 = await makeRecord(g, "R1", "2026-03-02T10:00:00Z", "analysed", 1);
    await addResult(r1, 1, [2.01, 4.9], [[A, 0], [B, 1]]);
    // R2: A found, B sought but not found; two unassigned modes.
    const r2 = await makeRecord(g, "R2", "2026-03-05T10:00:00Z", "analysed", 1);
    await addResult(r2, 1, [2.02, 9.9, 11.4], [[A, 0], [B, null]]);
    // R3: reprocessed; v1 found A and B, the current v2 finds A and C, not B; one unassigned in v2.
    const r3 = await makeRecord(g, "R3", "2026-03-10T10:00:00Z", "analysed", 2);
    await addResult(r3, 1, [2.03, 5.1, 14], [[A, 0], [B, 1]]);
    await addResult(r3, 2, [2.03, 8.1, 5.4], [[A, 0], [B, null], [C, 1]]);
    // R4: rejected record (not analysed): ignored although its result found A.
    const r4 = await makeRecord(g, "R4", "2026-03-12T10:00:00Z", "rejected", 1);
    await addResult(r4, 1, [2.0, 3.3], [[A, 0]]);
    // R5: before the period. R6: starts exactly at the period's (exclusive) end.
    const r5 = await makeRecord(g, "R5", "2026-02-27T10:00:00Z", "analysed", 1);
    await addResult(r5, 1, [2.0, 6.6], [[A, 0], [B, null]]);
    const r6 = await makeRecord(g, "R6", "2026-03-31T00:00:00Z", "analysed", 1);
    await addResult(r6, 1, [2.0], [[A, 0], [B, null]]);
    // Another asset of the same organisation, in the period, with an unassigned mode.
    const x1 = await makeRecord(other, "X1", "2026-03-03T10:00:00Z", "analysed", 1);
    await addResult(x1, 1, [3.3, 7.7], []);
  });

  it("counts, per mode, the analysed records of the period that sought it and found it (current result only)", async () => {
    const rates = await getIdentificationRates(g.team.owner.actor, g.asset.id, MARCH);
    // Hand count over R1, R2, R3 (v2): R4 is rejected, R5 and R6 fall outside [1 Mar, 31 Mar).
    expect(rates.analysedRecords).toBe(3);
    const byLabel = Object.fromEntries(rates.modes.map((m) => [m.label, m]));
    expect(rates.modes.map((m) => m.label)).toEqual(["A first bending", "B first torsion", "C second bending", "D retired"]);
    expect(byLabel["A first bending"]).toMatchObject({ sought: 3, identified: 3, rate: 1, notSought: 0, active: true });
    expect(byLabel["A first bending"].lastIdentifiedAt?.toISOString()).toBe(started.R3.toISOString());
    // B: found in R1 only (R2 missed it; R3's v1 find is superseded by v2).
    expect(byLabel["B first torsion"]).toMatchObject({ sought: 3, identified: 1, notSought: 0 });
    expect(byLabel["B first torsion"].rate).toBeCloseTo(1 / 3, 12);
    expect(byLabel["B first torsion"].lastIdentifiedAt?.toISOString()).toBe(started.R1.toISOString());
    // C: sought in R3 v2 only.
    expect(byLabel["C second bending"]).toMatchObject({ sought: 1, identified: 1, rate: 1, notSought: 2 });
    expect(byLabel["D retired"]).toMatchObject({ sought: 0, identified: 0, rate: null, notSought: 3, active: false, lastIdentifiedAt: null });
  });

  it("counts identified modes assigned to no tracked mode, and the records holding them", async () => {
    const rates = await getIdentificationRates(g.team.engineer.actor, g.asset.id, MARCH);
    // R1: 0; R2: 9.9 and 11.4 Hz; R3 v2: 5.4 Hz. R3 v1's 14 Hz and the other asset's modes do not count.
    expect(rates.unassignedModes).toBe(3);
    expect(rates.recordsWithUnassigned).toBe(2);
  });

  it("moves with the period: February holds only R5", async () => {
    const rates = await getIdentificationRates(g.team.inspector.actor, g.asset.id, { from: new Date("2026-02-01T00:00:00Z"), to: MARCH.from });
    expect(rates.analysedRecords).toBe(1);
    const [a, b] = rates.modes;
    expect(a).toMatchObject({ sought: 1, identified: 1, rate: 1 });
    expect(b).toMatchObject({ sought: 1, identified: 0, rate: 0 });
    expect(rates.unassignedModes).toBe(1);
  });

  it("GET …/identification-rates gives the same rates for a period, 401 without a token, 404 across organisations, 422 for a reversed period", async () => {
    const params = { assetId: g.asset.id };
    const q = `?from=${encodeURIComponent(MARCH.from.toISOString())}&to=${encodeURIComponent(MARCH.to.toISOString())}`;
    expect((await call(ratesRoute.GET, { params, path: `/x${q}` })).status).toBe(401);
    const token = await tokenFor(g.team.inspector);
    const ok = await call(ratesRoute.GET, { params, token, path: `/x${q}` });
    expect(ok.status).toBe(200);
    const body = ok.body.identificationRates as { from: string; to: string; analysedRecords: number; unassignedModes: number; modes: { label: string; sought: number; identified: number }[] };
    expect(body).toMatchObject({ from: MARCH.from.toISOString(), to: MARCH.to.toISOString(), analysedRecords: 3, unassignedModes: 3 });
    expect(body.modes.find((m) => m.label === "B first torsion")).toMatchObject({ sought: 3, identified: 1 });
    // Without a period: the 30 days before now.
    const recent = await call(ratesRoute.GET, { params, token });
    const period = recent.body.identificationRates as { from: string; to: string };
    expect(Date.parse(period.to) - Date.parse(period.from)).toBe(30 * 86_400_000);
    const reversed = `?from=${encodeURIComponent(MARCH.to.toISOString())}&to=${encodeURIComponent(MARCH.from.toISOString())}`;
    expect((await call(ratesRoute.GET, { params, token, path: `/x${reversed}` })).status).toBe(422);
    const stranger = await makeGatewayAsset();
    expect((await call(ratesRoute.GET, { params, token: await tokenFor(stranger.team.owner), path: `/x${q}` })).status).toBe(404);
  });

  it("refuses an empty period and hides the asset from another organisation", async () => {
    await expect(getIdentificationRates(g.team.owner.actor, g.asset.id, { from: MARCH.to, to: MARCH.from })).rejects.toThrow(AppError);
    const stranger = await makeGatewayAsset();
    await expect(getIdentificationRates(stranger.team.engineer.actor, g.asset.id, MARCH)).rejects.toMatchObject({ code: "not_found" });
  });
});

describe("analysis settings history", () => {
  it("lists every saved version newest first with who saved it; version 1 is the system's", async () => {
    const s = await makeGatewayAsset();
    const first = await listAnalysisSettingsHistory(s.team.owner.actor, s.asset.id);
    expect(first.map((v) => [v.version, v.createdByName])).toEqual([[1, null]]);
    const input = UpdateAnalysisSettingsInput.parse({ bandLowHz: "0.5", bandHighHz: "12", segmentLength: "auto", methods: "fdd" });
    await updateAnalysisSettings(s.team.engineer.actor, s.asset.id, input);
    await updateAnalysisSettings(s.team.admin.actor, s.asset.id, { ...input, methods: ["fdd", "ssi"] });
    const history = await listAnalysisSettingsHistory(s.team.inspector.actor, s.asset.id);
    expect(history.map((v) => [v.version, v.createdByName])).toEqual([[3, "Test admin"], [2, "Test engineer"], [1, null]]);
    expect(history[0].form).toMatchObject({ bandLowHz: 0.5, bandHighHz: 12, methods: ["fdd", "ssi"], segmentLength: "auto" });
    await expect(updateAnalysisSettings(s.team.owner.actor, s.asset.id, input)).rejects.toMatchObject({ code: "forbidden" });
  });
});

describe("range reprocess preview", () => {
  it("counts the records a range reprocess would queue, with the current settings version, and changes nothing", async () => {
    const s = await makeGatewayAsset();
    // Two analysed and one failed record are queued; a queued one and a demo-history one are skipped; one is outside.
    const ids = [
      await makeRecord(s, "P1", "2026-04-02T00:00:00Z", "analysed", 1),
      await makeRecord(s, "P2", "2026-04-03T00:00:00Z", "analysed", 1),
      await makeRecord(s, "P3", "2026-04-04T00:00:00Z", "failed", null),
      await makeRecord(s, "P4", "2026-04-05T00:00:00Z", "queued", null),
      await makeRecord(s, "P5", "2026-04-06T00:00:00Z", "analysed", 1, NO_RAW_SAMPLES_BLOB_KEY),
      await makeRecord(s, "P6", "2026-05-01T00:00:00Z", "analysed", 1),
    ];
    const range = { from: new Date("2026-04-01T00:00:00Z"), to: new Date("2026-05-01T00:00:00Z") };
    const plan = await planReprocessRange(s.team.engineer.actor, s.asset.id, range);
    expect(plan).toEqual({ settingsVersion: 1, total: 5, toQueue: 3, skipped: 2 });
    const statuses = await db()("records").whereIn("id", ids).orderBy("started_at").pluck("status");
    expect(statuses).toEqual(["analysed", "analysed", "failed", "queued", "analysed", "analysed"]);
    await expect(planReprocessRange(s.team.owner.actor, s.asset.id, range)).rejects.toMatchObject({ code: "forbidden" });
  });
});

describe("tracked mode labels", () => {
  it("keeps the label of a tracked mode unique per asset as a field error", async () => {
    const s = await makeGatewayAsset();
    await createTrackedMode(s.team.engineer.actor, s.asset.id, { label: "sway", nominalFrequencyHz: 1.2 });
    await expect(createTrackedMode(s.team.engineer.actor, s.asset.id, { label: "sway", nominalFrequencyHz: 1.4 }))
      .rejects.toMatchObject({ code: "conflict", fieldErrors: { label: ["Another tracked mode of this asset has this label."] } });
  });
});
