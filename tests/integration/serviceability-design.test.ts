/**
 * Serviceability and design comparison on a real database (issue 6): design modes (roles,
 * organisation boundary, label conflict, foreign link), the comparison's measured/design
 * ratios and MAC, organisation overrides of the recommended values, response levels stored by
 * the analysis worker, and the serviceability view of a footbridge and of a mast.
 */
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as recordsUpload from "@/app/api/v1/records/route";
import { closeDb, db } from "@/lib/db/knex";
import { upsertResponseLevels } from "@/lib/db/repos/serviceability.repo";
import { NO_RAW_SAMPLES_BLOB_KEY, type TrackedMode } from "@/lib/domain/records";
import { AppError } from "@/lib/http/errors";
import { closeQueues } from "@/lib/jobs/queues";
import { analyseRecord } from "@/lib/services/analysis/analysis.service";
import { createDesignMode, getDesignComparison, updateDesignMode } from "@/lib/services/design/design.service";
import { DesignModeInput } from "@/lib/services/design/schemas";
import { closeRateLimiter } from "@/lib/services/ingest/rate-limit";
import { getServiceabilityValues, setServiceabilityOverride } from "@/lib/services/serviceability/overrides.service";
import { SetOverrideInput } from "@/lib/services/serviceability/schemas";
import { getServiceabilityView, updateAssetServiceabilitySettings } from "@/lib/services/serviceability/serviceability.service";
import { computeChannelResponseLevels } from "@/lib/signal/response-levels";
import { makeTeam } from "./support/factories";
import { addTrackedMode, CHANNELS, f32Of, makeGatewayAsset, metaOf, send, uploadRequest, type GatewaySetup } from "./support/uploads";

const DAY = 86_400_000;
const NOW = new Date("2026-03-31T12:00:00Z");

let g: GatewaySetup;
let other: GatewaySetup;
beforeAll(async () => {
  g = await makeGatewayAsset();
  other = await makeGatewayAsset(await makeTeam());
});
afterAll(async () => {
  await closeQueues();
  await closeRateLimiter();
  await closeDb();
});

/** An analysed record (no raw samples) with identified modes assigned to tracked modes, as the seed writes them. */
async function analysedRecord(setup: GatewaySetup, at: Date, modes: { tracked: TrackedMode; f: number; zeta?: number; shape?: Record<string, number> }[], windSpeedMps?: number): Promise<string> {
  const id = randomUUID();
  await db()("records").insert({
    id, organisation_id: setup.asset.organisationId, asset_id: setup.asset.id, gateway_id: setup.gatewayId, gateway_record_id: id,
    started_at: at, sample_rate_hz: 100, channels: CHANNELS, units: "m/s2", temperature_c: 10,
    environment: JSON.stringify(windSpeedMps === undefined ? {} : { windSpeedMps }), content_hash: id.replace(/-/g, "").padEnd(64, "0"),
    blob_key: NO_RAW_SAMPLES_BLOB_KEY, data_format: "f32le", byte_size: 16, sample_count: 1, duration_s: 600, status: "analysed", progress: 1,
    analysed_settings_version: 1,
  });
  const [result] = await db()("analysis_results").insert({
    record_id: id, settings_version: 1, verdict: "accept", quality: JSON.stringify({ channels: [], verdict: { kind: "accept" } }), channels_used: CHANNELS,
    spectral: JSON.stringify({ nperseg: 1024, noverlap: 512, lineSpacingHz: 0.1, averages: 10 }), singular_values: JSON.stringify({ frequencyHz: [], s1: [], s2: null, s3: null }),
    engine_version: "test",
  }).returning(["id"]);
  for (const [i, m] of modes.entries()) {
    const shape = m.shape ?? { F1: 1, F2: 0.5 };
    const [im] = await db()("identified_modes").insert({
      result_id: result.id, mode_index: i, frequency_hz: m.f, damping_ratio: m.zeta ?? 0.01, damping_method: "efdd", damping_reliable: true, mpc: 0.99,
      shape: JSON.stringify(shape), shape_complex: JSON.stringify({ re: shape, im: {} }), estimates: JSON.stringify({}),
    }).returning(["id"]);
    await db()("mode_assignments").insert({ result_id: result.id, tracked_mode_id: m.tracked.id, identified_mode_id: im.id, mac: 0.99, frequency_deviation: 0, cost: 0 });
  }
  return id;
}

describe("design modes", () => {
  it("lets engineers add them; inspectors and owners are refused; another organisation sees not_found", async () => {
    const input = DesignModeInput.parse({ label: "FE 1", frequencyHz: "2.5" });
    const mode = await createDesignMode(g.team.engineer.actor, g.asset.id, input);
    expect(mode).toMatchObject({ label: "FE 1", frequencyHz: 2.5, direction: null, shape: null, trackedModeId: null });
    await expect(createDesignMode(g.team.owner.actor, g.asset.id, input)).rejects.toThrow(AppError);
    await expect(createDesignMode(g.team.inspector.actor, g.asset.id, input)).rejects.toMatchObject({ code: "forbidden" });
    await expect(createDesignMode(other.team.engineer.actor, g.asset.id, input)).rejects.toMatchObject({ code: "not_found" });
    await expect(getDesignComparison(other.team.owner.actor, g.asset.id)).rejects.toMatchObject({ code: "not_found" });
    // The same label again: a conflict named on the label field.
    await expect(createDesignMode(g.team.engineer.actor, g.asset.id, input)).rejects.toMatchObject({ code: "conflict", fieldErrors: { label: expect.any(Array) } });
  });

  it("refuses a link to another asset's tracked mode", async () => {
    const foreign = await addTrackedMode(other.asset.id, "foreign", 3, 0.05, null);
    await expect(createDesignMode(g.team.engineer.actor, g.asset.id, DesignModeInput.parse({ label: "FE x", frequencyHz: 3, trackedModeId: foreign.id })))
      .rejects.toMatchObject({ code: "unprocessable" });
  });

  it("compares design with the median of the last 30 days (ratio), gives MAC, and flags unmatched modes", async () => {
    const s = await makeGatewayAsset();
    const t1 = await addTrackedMode(s.asset.id, "1st vertical bending", 2.0, 0.1, [1, 0.5, 0, 0]);
    const t2 = await addTrackedMode(s.asset.id, "1st lateral", 5.0, 0.1, null);
    // Three identifications in the window (median 2.04 Hz) and one 40 days old (left out).
    for (const [days, f] of [[40, 3.0], [20, 2.06], [10, 2.02], [1, 2.04]] as const) {
      await analysedRecord(s, new Date(NOW.getTime() - days * DAY), [{ tracked: t1, f, shape: { F1: 0.98, F2: 0.49, F3: 0.01 } }]);
    }
    const eng = s.team.engineer.actor;
    const d1 = await createDesignMode(eng, s.asset.id, DesignModeInput.parse({ label: "FE 1", frequencyHz: 1.9, shape: { F1: 2, F2: 1, F3: 0 } }));
    await createDesignMode(eng, s.asset.id, DesignModeInput.parse({ label: "FE 3", frequencyHz: 8.0 }));
    const cmp = await getDesignComparison(s.team.owner.actor, s.asset.id, { now: NOW });
    const row1 = cmp.rows.find((r) => r.design?.id === d1.id);
    expect(row1).toMatchObject({ tracked: { id: t1.id }, matchedBy: "frequency", identifications: 3, measuredLatestHz: 2.04, flag: null });
    expect(row1?.measuredMedianHz).toBeCloseTo(2.04, 12);
    expect(row1?.ratio).toBeCloseTo(2.04 / 1.9, 12); // measured / design = 1.0737
    expect(row1?.mac).toBeGreaterThan(0.999); // shapes nearly proportional [Allemang & Brown 1982]
    expect(cmp.rows.find((r) => r.design?.label === "FE 3")).toMatchObject({ flag: "no_measured_mode", ratio: null });
    expect(cmp.rows.find((r) => r.tracked?.id === t2.id)).toMatchObject({ flag: "no_design_mode" });
    // An explicit link wins: FE 3 linked to the lateral mode, which has no identification in the window.
    const fe3 = cmp.designModes.find((d) => d.label === "FE 3");
    await updateDesignMode(eng, s.asset.id, fe3?.id ?? "", DesignModeInput.parse({ label: "FE 3", frequencyHz: 8.0, trackedModeId: t2.id }));
    const again = await getDesignComparison(s.team.owner.actor, s.asset.id, { now: NOW });
    expect(again.rows.find((r) => r.design?.label === "FE 3")).toMatchObject({ matchedBy: "link", tracked: { id: t2.id }, flag: "not_identified_in_period" });
  });
});

describe("serviceability overrides", () => {
  it("replaces a recommended value for the organisation only; owners may not; an empty value removes it", async () => {
    const t = await makeTeam();
    const before = await getServiceabilityValues(t.owner.actor);
    expect(before.frequency.comfortCheckVerticalHz).toBe(5); // EN 1990 A2.4.3.2 [pub]
    const input = SetOverrideInput.parse({ key: "footbridge.comfort_check_vertical_hz", value: "4.5", note: "national annex" });
    await expect(setServiceabilityOverride(t.owner.actor, input)).rejects.toMatchObject({ code: "forbidden" });
    const after = await setServiceabilityOverride(t.engineer.actor, input);
    expect(after.frequency.comfortCheckVerticalHz).toBe(4.5);
    expect(after.table.find((r) => r.spec.key === input.key)).toMatchObject({ overridden: true, note: "national annex" });
    expect((await getServiceabilityValues(g.team.owner.actor)).frequency.comfortCheckVerticalHz).toBe(5); // other organisation unchanged
    expect(SetOverrideInput.safeParse({ key: "made.up", value: "1" }).success).toBe(false);
    const removed = await setServiceabilityOverride(t.admin.actor, SetOverrideInput.parse({ key: input.key, value: "" }));
    expect(removed.frequency.comfortCheckVerticalHz).toBe(5);
  });
});

describe("response levels", () => {
  it("are stored per channel by the analysis: peak A and 1-s RMS A/√2 of a sine [analytic]", async () => {
    const fs = 100;
    const amps = [0.02, 0.04, 0.06, 0.08];
    // 2 Hz cosines: whole periods per 1-s window; float32 storage keeps ~7 digits.
    const data = amps.map((a, c) => Float64Array.from({ length: fs * 60 }, (_, k) => a * Math.cos((2 * Math.PI * 2 * k) / fs + 0.3 * c)));
    const r = await send(recordsUpload.POST, uploadRequest({ key: g.key, meta: metaOf(), data: f32Of(data), type: "application/octet-stream" }));
    expect(r.status).toBe(202);
    const id = r.body.record?.id ?? "";
    await analyseRecord(id);
    const row = await db()("record_response_levels").where({ record_id: id }).first() as { levels: ReturnType<typeof computeChannelResponseLevels> };
    expect(row.levels.map((l) => l.code)).toEqual(CHANNELS);
    row.levels.forEach((l, c) => {
      expect(l.axis).toBe("x");
      expect(l.peakMps2).toBeLessThanOrEqual(amps[c] * (1 + 1e-6));
      expect(l.peakMps2).toBeGreaterThan(amps[c] * Math.cos(Math.PI * 2 * 2 / fs / 2)); // sampled peak within half a sample of the crest
      expect(l.maxRms1sMps2).toBeCloseTo(amps[c] / Math.SQRT2, 6);
    });
  });
});

describe("serviceability view", () => {
  it("checks a footbridge's modes against the ranges and its accelerations against the maxima", async () => {
    const s = await makeGatewayAsset();
    await db()("assets").where({ id: s.asset.id }).update({ kind: "footbridge", material: "Steel truss" });
    await db()("sensor_channels").where({ asset_id: s.asset.id, code: "F2" }).update({ direction: "z" });
    const v = await addTrackedMode(s.asset.id, "1st vertical bending", 1.9, 0.1, null);
    const n = await addTrackedMode(s.asset.id, "2nd vertical bending", 6.0, 0.1, null);
    const levels = (vertical: number, horizontal: number) => [
      { code: "F1", axis: "x" as const, peakMps2: horizontal, maxRms1sMps2: horizontal / 2, rmsMps2: horizontal / 4 },
      { code: "F2", axis: "z" as const, peakMps2: vertical, maxRms1sMps2: vertical / 2, rmsMps2: vertical / 4 },
    ];
    for (const [days, pv, ph] of [[3, 0.2, 0.05], [2, 0.9, 0.1], [1, 0.3, 0.3]] as const) {
      const id = await analysedRecord(s, new Date(NOW.getTime() - days * DAY), [{ tracked: v, f: 1.9, zeta: 0.001 }, { tracked: n, f: 6.0 }]);
      await upsertResponseLevels(db(), id, levels(pv, ph));
    }
    const view = await getServiceabilityView(s.team.owner.actor, s.asset.id, { now: NOW });
    expect(view.family).toBe("footbridge");
    const m1 = view.modes.find((m) => m.trackedModeId === v.id);
    expect(m1?.frequencyCheck).toMatchObject({ risk: "high", comfortCheckNeeded: true }); // 1.9 Hz in 1.25–2.3 Hz
    expect(m1?.damping.verdict).toBe("below_guidance"); // 0.1 % < steel minimum 0.2 % [HiVoSS, from memory]
    expect(view.modes.find((m) => m.trackedModeId === n.id)?.frequencyCheck).toMatchObject({ risk: "outside", comfortCheckNeeded: false }); // 6 Hz ≥ 5 Hz
    const vert = view.acceleration?.axes.find((a) => a.axis === "vertical");
    expect(vert).toMatchObject({ limitMps2: 0.7, peak: { count: 3, max: 0.9, exceedCount: 1, median: 0.3 } }); // 0.9 > 0.7 m/s² (EN 1990 A2)
    const hor = view.acceleration?.axes.find((a) => a.axis === "horizontal");
    expect(hor).toMatchObject({ limitMps2: 0.2, peak: { exceedCount: 1 } }); // 0.3 > 0.2 m/s²
  });

  it("gives a mast's v_crit = b·n/St and lists records with wind near it as possible lock-in", async () => {
    const s = await makeGatewayAsset(); // kind tower, channels in x
    const t = await addTrackedMode(s.asset.id, "1st bending (x)", 0.85, 0.1, null);
    const crest = (c: number) => [{ code: "F1", axis: "x" as const, peakMps2: 0.01 * c, maxRms1sMps2: 0.01, rmsMps2: 0.01 }];
    for (const [days, wind, c] of [[4, 3.9, Math.SQRT2], [3, 3.7, 3.8], [2, 8.0, Math.SQRT2], [1, 1.0, 1.5]] as const) {
      const id = await analysedRecord(s, new Date(NOW.getTime() - days * DAY), [{ tracked: t, f: 0.85, zeta: 0.002 }], wind);
      await upsertResponseLevels(db(), id, crest(c));
    }
    await expect(updateAssetServiceabilitySettings(s.team.inspector.actor, s.asset.id, { sectionWidthM: 0.8, dampingGuidanceKey: null })).rejects.toMatchObject({ code: "forbidden" });
    await updateAssetServiceabilitySettings(s.team.engineer.actor, s.asset.id, { sectionWidthM: 0.8, dampingGuidanceKey: "lattice_welded" });
    const view = await getServiceabilityView(s.team.owner.actor, s.asset.id, { now: NOW });
    expect(view.vortex?.modes[0].vCritMps).toBeCloseTo(3.78, 2); // 0.8 × 0.85 / 0.18 [EN 1991-1-4 Annex E]
    expect(view.vortex?.recordsWithWind).toBe(4);
    expect(view.vortex?.episodes.map((e) => [e.windSpeedMps, e.classification])).toEqual([[3.9, "lock_in_candidate"], [3.7, "in_band_broadband"]]);
    // ζ = 0.2 % → δ ≈ 0.0126 < δs = 0.02 (Table F.2, welded lattice).
    expect(view.dampingGuidance).toMatchObject({ key: "lattice_welded", logDecrement: 0.02, guessed: false });
    expect(view.modes[0].damping.verdict).toBe("below_guidance");
  });
});
