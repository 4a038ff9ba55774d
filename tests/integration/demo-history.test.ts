/**
 * Demo history (issue 4 §8): a year of analysed records per Larkspur asset, idempotent, with
 * the footbridge's late stiffness loss visible at equal temperature and the mast's flat-lined
 * channel left out.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/lib/db/knex";
import { seed } from "@/db/seeds/demo-users";
import { DEMO_ASSETS } from "@/db/seeds/larkspur/data";
import { DEMO_HISTORY_PREFIX, seedDemoHistory } from "@/db/seeds/larkspur/demo-history";

const NOW = new Date("2026-11-30T12:00:00Z");
const DAY_MS = 86_400_000;
const asset = (part: string) => {
  const a = DEMO_ASSETS.find((x) => x.name.includes(part));
  if (!a) throw new Error(part);
  return a;
};

async function counts() {
  const k = db();
  const gatewayIds = DEMO_ASSETS.map((a) => a.gateway.id);
  const recordIds = k("records").select("id").whereIn("gateway_id", gatewayIds).andWhere("gateway_record_id", "like", `${DEMO_HISTORY_PREFIX}%`);
  const resultIds = k("analysis_results").select("id").whereIn("record_id", recordIds.clone());
  const n = async (q: PromiseLike<{ n?: string | number }[]>) => Number((await q)[0].n);
  return {
    records: await n(k("records").count({ n: "*" }).whereIn("id", recordIds.clone())),
    results: await n(k("analysis_results").count({ n: "*" }).whereIn("id", resultIds.clone())),
    modes: await n(k("identified_modes").count({ n: "*" }).whereIn("result_id", resultIds.clone())),
    assignments: await n(k("mode_assignments").count({ n: "*" }).whereIn("result_id", resultIds.clone())),
    tracked: await n(k("tracked_modes").count({ n: "*" }).whereIn("asset_id", DEMO_ASSETS.map((a) => a.id))),
  };
}

beforeAll(async () => {
  await seed(db());
  // Start from no demo history, then build it up to a fixed end (deterministic slots).
  await db()("records").whereIn("gateway_id", DEMO_ASSETS.map((a) => a.gateway.id)).andWhere("gateway_record_id", "like", `${DEMO_HISTORY_PREFIX}%`).delete();
});
afterAll(closeDb);

describe("the demo history", () => {
  it("gives the same rows when seeded twice: one record per 6 h for a year per asset, analysed", async () => {
    const added = await seedDemoHistory(db(), { now: NOW });
    const first = await counts();
    expect(await seedDemoHistory(db(), { now: NOW })).toBe(0);
    expect(await counts()).toEqual(first);
    // 365 days × 4 records a day × 5 assets (the brief's schedule).
    expect(added).toBe(365 * 4 * DEMO_ASSETS.length);
    expect(first.records).toBe(added);
    expect(first.results).toBe(added);
    const statuses = await db()("records").distinct("status").where("gateway_record_id", "like", `${DEMO_HISTORY_PREFIX}%`);
    expect(statuses).toEqual([{ status: "analysed" }]);
    // Every demo record carries a wind speed and its response levels (serviceability views).
    const levels = await db()("record_response_levels as l").join("records as r", "r.id", "l.record_id")
      .where("r.gateway_record_id", "like", `${DEMO_HISTORY_PREFIX}%`).count<{ count: string }[]>("* as count");
    expect(Number(levels[0].count)).toBe(added);
  }, 240_000);

  it("shows the footbridge's ~2 % stiffness loss as ~1 % lower frequency at equal temperature in its last 3 weeks", async () => {
    const heron = asset("Heron Reach");
    const rows: { started_at: Date; temperature_c: number; frequency_hz: number }[] = await db()("records as r")
      .join("analysis_results as ar", "ar.record_id", "r.id")
      .join("mode_assignments as ma", "ma.result_id", "ar.id")
      .join("tracked_modes as tm", "tm.id", "ma.tracked_mode_id")
      .join("identified_modes as im", "im.id", "ma.identified_mode_id")
      .where({ "r.asset_id": heron.id, "tm.label": "1st vertical bending" })
      .andWhere("r.gateway_record_id", "like", `${DEMO_HISTORY_PREFIX}%`)
      .select("r.started_at", "r.temperature_c", "im.frequency_hz");
    const cut = NOW.getTime() - 20 * DAY_MS; // inside the damaged window (21 days), clear of its edge
    const edge = NOW.getTime() - 22 * DAY_MS;
    const late = rows.filter((r) => r.started_at.getTime() >= cut);
    const early = rows.filter((r) => r.started_at.getTime() < edge);
    expect(late.length).toBeGreaterThan(50);
    // Each late record against the mean of earlier records within ±0.5 °C (temperature matched, model-free).
    const ratios = late.flatMap((l) => {
      const peers = early.filter((e) => Math.abs(e.temperature_c - l.temperature_c) <= 0.5);
      return peers.length >= 3 ? [l.frequency_hz / (peers.reduce((s, e) => s + e.frequency_hz, 0) / peers.length)] : [];
    });
    expect(ratios.length).toBeGreaterThan(40);
    const mean = ratios.reduce((s, x) => s + x, 0) / ratios.length;
    // f ∝ √k [pub: Chopra, Dynamics of Structures, SDOF natural frequency ω = √(k/m)]:
    // a 2 % stiffness loss gives f'/f = √0.98 ≈ 0.98995; tolerance covers 0.3 % estimation noise
    // and the ±0.5 °C matching [practice].
    expect(Math.abs(mean - Math.sqrt(0.98))).toBeLessThan(0.0025);
  });

  it("leaves the mast's flat-lined channel out of its last weeks' results (accept_without) and keeps it before", async () => {
    const mast = asset("Carrow Hill");
    const rows: { started_at: Date; verdict: string; channels_used: string[] }[] = await db()("records as r")
      .join("analysis_results as ar", "ar.record_id", "r.id")
      .where({ "r.asset_id": mast.id }).andWhere("r.gateway_record_id", "like", `${DEMO_HISTORY_PREFIX}%`)
      .select("r.started_at", "ar.verdict", "ar.channels_used");
    const recent = rows.filter((r) => r.started_at.getTime() > NOW.getTime() - 14 * DAY_MS);
    const old = rows.filter((r) => r.started_at.getTime() < NOW.getTime() - 60 * DAY_MS);
    expect(recent.length).toBeGreaterThan(0);
    for (const r of recent) {
      expect(r.verdict).toBe("accept_without");
      expect(r.channels_used).not.toContain("A4");
    }
    expect(old.every((r) => r.verdict === "accept" && r.channels_used.includes("A4"))).toBe(true);
  });
});
