/**
 * Asset Overview and Portfolio "needs attention" (issue 6 §1, §5) on small constructed
 * datasets whose expected sentences and lists are worked out by hand below.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/lib/db/knex";
import { closeQueues } from "@/lib/jobs/queues";
import { addChannel, createAsset } from "@/lib/services/assets/asset.service";
import { createGateway } from "@/lib/services/assets/gateway.service";
import { fitAndActivateBaseline } from "@/lib/services/drift/baseline.service";
import { getDriftView } from "@/lib/services/drift/drift-view.service";
import { recomputeDrift } from "@/lib/services/drift/drift.service";
import { importModalHistory } from "@/lib/services/drift/history-import.service";
import { describeCondition } from "@/lib/services/overview/condition-reason";
import { getAssetChanges, getAssetOverview, getNeedsAttention } from "@/lib/services/overview/overview.service";
import { AppError } from "@/lib/http/errors";
import { makeTeam, unique, validAsset } from "./support/factories";

const DAY = 86_400_000;
type Team = Awaited<ReturnType<typeof makeTeam>>;
let team: Team;
let foreign: Team;

beforeAll(async () => {
  [team, foreign] = await Promise.all([makeTeam(), makeTeam()]);
});
afterAll(async () => {
  await closeQueues();
  await closeDb();
});

/**
 * 200 days × 4 estimates (every 6 h from UTC midnight) of one mode whose frequency follows a
 * linear temperature law f = 2·(1 − 0.0015·(T − 10)) Hz [practice: a few ‰ per °C, REFERENCES
 * "Environmental compensation"], T = 10 + 12·sin(2πd/200) °C, with ±0.1 % deterministic scatter;
 * from day `damageDay` on every frequency is 2.0 % lower (×0.98).
 */
function historyCsv(t0: number, days: number, damageDay: number | null): string {
  const lines = ["timestamp,mode,frequencyHz,dampingRatio,temperatureC"];
  let seed = 12345;
  const next = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648) * 2 - 1;
  for (let d = 0; d < days; d++) {
    for (let k = 0; k < 4; k++) {
      const t = t0 + d * DAY + k * 6 * 3_600_000;
      const temp = 10 + 12 * Math.sin((2 * Math.PI * (d + k / 4)) / 200);
      let f = 2 * (1 - 0.0015 * (temp - 10)) * (1 + 0.001 * next());
      if (damageDay !== null && d >= damageDay) f *= 0.98;
      lines.push(`${new Date(t).toISOString()},1st vertical bending,${f.toFixed(5)},,${temp.toFixed(2)}`);
    }
  }
  return lines.join("\n");
}

describe("the condition reason in plain words", () => {
  // History from 2026-03-01 (UTC midnight); baseline on its first 150 days.
  const t0 = Date.UTC(2026, 2, 1);
  const fit = { from: new Date(t0), to: new Date(t0 + 150 * DAY) };

  it("names the mode, its compensated shift (2.0 % below) and its duration (12 days), and the open alert", async () => {
    const asset = await createAsset(team.engineer.actor, validAsset(unique("Reason drift")));
    // Damage on days 188–199: 12 whole UTC days at the end of the history.
    await importModalHistory(team.engineer.actor, asset.id, historyCsv(t0, 200, 188));
    await fitAndActivateBaseline(team.engineer.actor, asset.id, fit);
    const nowMs = t0 + 200 * DAY;
    const outcome = await recomputeDrift(asset.id, { nowMs });
    expect(outcome.condition).toBe("alert");

    const overview = await getAssetOverview(team.owner.actor, asset.id, { now: new Date(nowMs) });
    expect(overview.openAlerts).toHaveLength(1);
    const view = await getDriftView(team.owner.actor, asset.id, {}, { nowMs });
    const reason = describeCondition(view, {
      condition: overview.asset.condition, openAlerts: overview.openAlerts, lastAcceptedAt: overview.lastAcceptedAt,
      expectedIntervalMin: overview.asset.expectedIntervalMin, now: new Date(nowMs),
    });
    // By construction: residual = −2 % of the prediction; the prediction over days 188–199
    // (T ≈ 5.6–10 °C) is within 0.7 % of the nominal 2 Hz, so −2.0 % to one decimal. The
    // shift is 40× the 0.05 % daily scatter, so the EWMA is beyond from the first damaged day.
    expect(reason.shifts).toHaveLength(1);
    expect(reason.shifts[0]).toMatchObject({ number: 1, label: "1st vertical bending", days: 12 });
    expect(reason.shifts[0].shiftPct).toBeCloseTo(-2.0, 1);
    expect(reason.sentences[0]).toBe(
      "Mode 1 (1st vertical bending) is 2.0 % below its temperature-compensated baseline for 12 days; an alert is open.",
    );
  });

  it("says every mode is within its range before the damage, and that a new asset has no baseline", async () => {
    const steady = await createAsset(team.engineer.actor, validAsset(unique("Reason steady")));
    await importModalHistory(team.engineer.actor, steady.id, historyCsv(t0, 188, null));
    await fitAndActivateBaseline(team.engineer.actor, steady.id, fit);
    const nowMs = t0 + 188 * DAY;
    expect((await recomputeDrift(steady.id, { nowMs })).condition).toBe("steady");
    const view = await getDriftView(team.owner.actor, steady.id, {}, { nowMs });
    const ctx = { condition: "steady" as const, openAlerts: [], lastAcceptedAt: null, expectedIntervalMin: 30, now: new Date(nowMs) };
    expect(describeCondition(view, ctx).sentences[0]).toBe("Every tracked mode is within its temperature-compensated range on its latest day.");

    const fresh = await createAsset(team.engineer.actor, validAsset(unique("Reason new")));
    const freshView = await getDriftView(team.owner.actor, fresh.id);
    expect(describeCondition(freshView, { ...ctx, condition: "commissioning" }).sentences[0]).toMatch(/^No baseline yet/);
  });

  it("names the most shifted mode in full and the others briefly, a mode shifted the other way in its own clause", () => {
    // Hand-built view: daily residuals (Hz) over the last days; nominal 2 Hz, 4 Hz and 8 Hz.
    const day = (i: number, r: number, beyond: boolean) => ({ dayMs: Date.UTC(2026, 10, 1 + i), residualHz: r, beyond });
    const view = {
      condition: "alert" as const, skipped: null, baseline: { version: 2, status: "complete" as const }, t2: [],
      modes: [
        // −0.02 Hz of 2 Hz = −1.0 % on days 3–5 (3 days).
        { label: "first", nominalHz: 2, daily: [day(0, 0, false), day(1, 0, false), day(2, 0, false), day(3, -0.02, true), day(4, -0.02, true), day(5, -0.02, true)] },
        // mean of −0.06 and −0.10 = −0.08 Hz of 4 Hz = −2.0 % on days 4–5 (2 days).
        { label: "second", nominalHz: 4, daily: [day(3, 0, false), day(4, -0.06, true), day(5, -0.1, true)] },
        // +0.04 Hz of 8 Hz = +0.5 % on day 5 only.
        { label: "third", nominalHz: 8, daily: [day(4, 0, false), day(5, 0.04, true)] },
      ],
    };
    const r = describeCondition(view, { condition: "alert", openAlerts: [], lastAcceptedAt: null, expectedIntervalMin: 60, now: new Date() });
    expect(r.sentences).toEqual([
      "Mode 2 (second) is 2.0 % below its temperature-compensated baseline for 2 days, as is Mode 1 (first, 1.0 % for 3 days); "
        + "Mode 3 (third) is 0.5 % above its temperature-compensated baseline for 1 day.",
    ]);
  });

  it("lists the baseline version and the import among the changes since a date, and nothing since tomorrow", async () => {
    const asset = await createAsset(team.engineer.actor, validAsset(unique("Changes")));
    await importModalHistory(team.engineer.actor, asset.id, historyCsv(t0, 160, null));
    await fitAndActivateBaseline(team.engineer.actor, asset.id, fit);
    const since = new Date(Date.now() - DAY);
    const changes = await getAssetChanges(team.owner.actor, asset.id, since);
    expect(changes.map((c) => c.category)).toEqual(expect.arrayContaining(["baseline", "data", "mode"]));
    expect(changes.find((c) => c.category === "baseline")?.text).toMatch(/^Baseline version 1 fitted \((complete|provisional), active; training 2026-03-01 to 2026-07-29, 1 mode\)\.$/);
    expect(await getAssetChanges(team.owner.actor, asset.id, new Date(Date.now() + DAY))).toEqual([]);
    await expect(getAssetChanges(foreign.owner.actor, asset.id, since)).rejects.toThrow(AppError);
    await expect(getAssetOverview(foreign.engineer.actor, asset.id)).rejects.toMatchObject({ code: "not_found" });
  });
});

describe("the Portfolio's needs-attention list", () => {
  // An organisation of its own: the assets of the tests above would be listed too.
  let team: Team;
  beforeAll(async () => {
    team = await makeTeam();
  });
  // A fixed "now" (11:00 in the test organisation's America/Denver) keeps every record on one local day.
  const now = new Date("2026-11-20T18:00:00Z");

  async function insertRecord(assetId: string, gatewayId: string, at: Date, flat: string[], channels: string[]) {
    const [rec] = await db()("records").insert({
      organisation_id: team.org.id, asset_id: assetId, gateway_id: gatewayId, gateway_record_id: unique("rec"), started_at: at,
      sample_rate_hz: 100, channels, units: "m/s2", content_hash: "a".repeat(64), blob_key: "test/none", data_format: "f32le",
      byte_size: 4000, sample_count: 1000, duration_s: 10, status: "analysed", progress: 1, analysed_settings_version: 1,
    }).returning("id");
    const quality = {
      channels: channels.map((c) => ({ channel: c, flags: flat.includes(c) ? ["flat_line"] : [], rms: flat.includes(c) ? 0 : 0.002, notes: [] })),
      verdict: flat.length ? { kind: "accept_without", channels: flat } : { kind: "accept" },
    };
    await db()("analysis_results").insert({
      record_id: rec.id, settings_version: 1, verdict: flat.length ? "accept_without" : "accept", quality: JSON.stringify(quality),
      channels_used: channels.filter((c) => !flat.includes(c)), spectral: JSON.stringify({}), singular_values: JSON.stringify({}), engine_version: "test",
    });
  }

  async function insertBaseline(assetId: string, status: "provisional" | "complete") {
    await db()("baselines").insert({
      asset_id: assetId, version: 1, training_from: new Date("2026-01-01Z"), training_to: new Date("2026-06-01Z"), status, models: JSON.stringify([]), active: true,
    });
  }

  it("lists the open alert, the silent asset, the flat-lined sensor, the asset without baseline and the provisional baseline, in that order", async () => {
    const e = team.engineer.actor;
    const make = (name: string, expectedIntervalMin = 30) => createAsset(e, { ...validAsset(unique(name)), expectedIntervalMin });
    const [a, b, c, d, f, s] = await Promise.all([make("A alert"), make("B silent"), make("C provisional"), make("D new"), make("E flat", 1440), make("F steady", 1440)]);
    await db()("assets").whereIn("id", [a.id]).update({ condition: "alert" });
    await db()("assets").whereIn("id", [b.id]).update({ condition: "silent" });
    await db()("assets").whereIn("id", [f.id, s.id]).update({ condition: "steady" });
    const [alert] = await db()("alerts").insert({ asset_id: a.id, raised_at: new Date("2026-11-15T12:00:00Z"), evidence: JSON.stringify({}), state: "open" }).returning("id");
    await insertBaseline(c.id, "provisional");
    await insertBaseline(f.id, "complete");
    await insertBaseline(s.id, "complete");
    for (const code of ["A1", "A2"]) await addChannel(e, f.id, { code, positionM: { x: 0, y: 0, z: 0 }, direction: "z" });
    const gwF = (await createGateway(team.admin.actor, f.id, { name: "gw F" })).gateway;
    const gwS = (await createGateway(team.admin.actor, s.id, { name: "gw S" })).gateway;
    // E: A2 usable 3 days ago, flat in the two records of today; F: one clean record today.
    await insertRecord(f.id, gwF.id, new Date("2026-11-17T18:00:00Z"), [], ["A1", "A2"]);
    await insertRecord(f.id, gwF.id, new Date("2026-11-20T16:00:00Z"), ["A2"], ["A1", "A2"]);
    await insertRecord(f.id, gwF.id, new Date("2026-11-20T17:00:00Z"), ["A2"], ["A1", "A2"]);
    await insertRecord(s.id, gwS.id, new Date("2026-11-20T17:00:00Z"), [], ["A1", "A2"]);

    const items = await getNeedsAttention(team.owner.actor, { now });
    expect(items.map((i) => [i.kind, i.assetName])).toEqual([
      ["alert", a.name], ["silent", b.name], ["data", f.name], ["no_baseline", d.name], ["provisional_baseline", c.name],
    ]);
    expect(items[0]).toMatchObject({ href: `/alerts/${alert.id}`, title: "Alert open", detail: "Raised 5 days ago." });
    expect(items[1]).toMatchObject({ href: `/assets/${b.id}`, detail: "No accepted record yet." });
    expect(items[2]).toMatchObject({
      href: `/assets/${f.id}#availability`, title: "Sensor A2 flat-lined",
      detail: "Excluded from the latest record and from 2 of 3 records in the last 7 days.",
    });
    // Another organisation sees none of it.
    expect((await getNeedsAttention(foreign.owner.actor, { now })).filter((i) => [a.id, b.id, c.id, d.id, f.id].includes(i.assetId))).toEqual([]);

    // The Overview of E: A2 usable on the 17th, excluded in both records of the 20th (Denver days).
    const ov = await getAssetOverview(team.owner.actor, f.id, { now });
    const a2 = ov.availability.channels.find((r) => r.channel === "A2");
    const cell = (day: string) => a2?.cells.find((x) => x.day === day);
    expect(cell("2026-11-17")).toMatchObject({ state: "ok", records: 1, excluded: 0 });
    expect(cell("2026-11-20")).toMatchObject({ state: "dead", records: 2, excluded: 2, flags: ["flat_line"] });
    expect(cell("2026-11-18")).toMatchObject({ state: "no_data", records: 0 });
    expect(ov.availability.recordsPerDay.find((r) => r.day === "2026-11-20")).toMatchObject({ total: 2, analysed: 2 });
    expect(ov.availability.days).toHaveLength(30);
    expect(ov.availability.days[29]).toBe("2026-11-20");
  });
});
