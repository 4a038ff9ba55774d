/**
 * Trends read side (issue 5 screens): getDriftView replays the drift statistics without side
 * effects and agrees with recomputeDrift; its series follow the published chart formulas;
 * GET …/trends (JSON) and GET …/trends.csv?chart=… with roles and organisations.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as trendsCsvRoute from "@/app/api/v1/assets/[assetId]/trends.csv/route";
import * as trendsRoute from "@/app/api/v1/assets/[assetId]/trends/route";
import { closeDb, db } from "@/lib/db/knex";
import { closeQueues } from "@/lib/jobs/queues";
import { createAsset, getAsset } from "@/lib/services/assets/asset.service";
import { fitAndActivateBaseline } from "@/lib/services/drift/baseline.service";
import { recomputeDrift } from "@/lib/services/drift/drift.service";
import { dampingAdvisory, getDriftView, type DriftView } from "@/lib/services/drift/drift-view.service";
import { importModalHistory } from "@/lib/services/drift/history-import.service";
import { simulateDriftHistory } from "@/lib/stats/drift-simulation";
import { call, makeTeam, tokenFor, validAsset } from "./support/factories";
import { simulatedHistoryCsv } from "./support/history";

const DAY = 86_400_000;
// Same scenario as tests/integration/drift.test.ts (seed 2026, 2 % stiffness loss on day 550).
const ONSET_DAY = 550;
const sim = simulateDriftHistory({ seed: 2026, days: ONSET_DAY + 40, onsetDay: ONSET_DAY, stiffnessLoss: 0.02 });
const t0 = sim.history.timesMs[0];
const onsetMs = sim.onsetMs ?? Number.NaN;
const DAMPING = ["0.008", "0.009", "0.010", "0.011", "0.012"];

const historyCsv = () => simulatedHistoryCsv(sim.history, (i) => DAMPING[i % DAMPING.length]);

type Team = Awaited<ReturnType<typeof makeTeam>>;
let team: Team;
let foreign: Team;
let assetId: string;
let view: DriftView;

beforeAll(async () => {
  [team, foreign] = await Promise.all([makeTeam(), makeTeam()]);
  const asset = await createAsset(team.engineer.actor, validAsset());
  assetId = asset.id;
  await importModalHistory(team.engineer.actor, assetId, historyCsv());
  await fitAndActivateBaseline(team.engineer.actor, assetId, { from: new Date(t0), to: new Date(t0 + 366 * DAY) });
  view = await getDriftView(team.owner.actor, assetId, {}, { maxPointsPerMode: Number.POSITIVE_INFINITY });
});
afterAll(async () => {
  await closeQueues();
  await closeDb();
});

const alertCount = async (id: string) =>
  Number((await db()("alerts").where({ asset_id: id }).count<{ c: string }[]>({ c: "*" }))[0].c);

describe("getDriftView", () => {
  it("replays without side effects and agrees with recomputeDrift (condition, alert time)", async () => {
    expect(view.skipped).toBeNull();
    expect(view.baseline).toMatchObject({ version: 1, active: true });
    expect(view.modes.map((m) => m.label)).toEqual(["mode-1", "mode-2", "mode-3"]);
    expect(view.condition).toBe("alert");
    // Nothing written by the view: the stored condition is still the new asset's, no alert row.
    expect((await getAsset(team.owner.actor, assetId)).condition).toBe("commissioning");
    expect(await alertCount(assetId)).toBe(0);
    // Issue 5 check: the alert comes within 30 days of the onset, none before it.
    expect(view.raisedAtMs.length).toBe(1);
    expect(view.raisedAtMs[0]).toBeGreaterThanOrEqual(onsetMs);
    expect(view.raisedAtMs[0] - onsetMs).toBeLessThanOrEqual(30 * DAY);

    const outcome = await recomputeDrift(assetId);
    expect(outcome.condition).toBe(view.condition);
    const rows = await db()("alerts").where({ asset_id: assetId }).select("id", "raised_at");
    expect(rows.map((r) => (r.raised_at as Date).getTime())).toEqual(view.raisedAtMs);
    const after = await getDriftView(team.owner.actor, assetId);
    expect(after.alerts).toEqual([{ id: rows[0].id, raisedAtMs: view.raisedAtMs[0], state: "open" }]);
  });

  it("gives per point the baseline prediction, its ±3 s band, the residual and the envelope flag", () => {
    for (const m of view.modes) {
      const model = m.model;
      expect(model).not.toBeNull();
      if (!model) continue;
      const [lo, hi] = model.envelope.temperatureC;
      let outside = 0;
      for (const p of m.points) {
        expect(p.predictedHz).not.toBeNull();
        const pred = p.predictedHz ?? Number.NaN;
        // Band = prediction ± 3 residual standard deviations (Shewhart 3σ, Montgomery ch. 5).
        expect(p.bandHighHz ?? Number.NaN).toBeCloseTo(pred + 3 * model.residualStdHz, 12);
        expect(p.bandLowHz ?? Number.NaN).toBeCloseTo(pred - 3 * model.residualStdHz, 12);
        expect(p.residualHz ?? Number.NaN).toBeCloseTo(p.frequencyHz - pred, 12);
        // Outside the training temperature range the model extrapolates: no decision
        // (Peeters & De Roeck 2001). The demo models use the measured temperature (no lag).
        const t = p.temperatureC ?? Number.NaN;
        expect(p.outOfEnvelope).toBe(t < lo || t > hi);
        if (p.outOfEnvelope) outside++;
      }
      // The last 224 days reach temperatures beyond the first year's now and then, but rarely.
      expect(outside).toBeLessThan(m.points.length / 10);
      expect(m.points.length).toBeGreaterThan(1000);
    }
  });

  it("shows the EWMA minimal shift L·σ·√(λ/(2−λ)) and limits that settle on it", () => {
    for (const m of view.modes) {
      const sigma = m.sigmaHz ?? Number.NaN;
      // (λ, L) = (0.10, 2.814): in-control ARL ≈ 500 (Lucas & Saccucci 1990, REFERENCES.md).
      const expected = 2.814 * sigma * Math.sqrt(0.1 / (2 - 0.1));
      expect(m.minimalShift?.shiftHz ?? Number.NaN).toBeCloseTo(expected, 12);
      // % of the nominal frequency: the training mean is within 3 % of f(20 °C) here [practice].
      const f20 = [2.1, 5.8, 9.4][view.modes.indexOf(m)];
      expect(Math.abs((m.minimalShift?.shiftPct ?? 0) / ((100 * (m.minimalShift?.shiftHz ?? 0)) / f20) - 1)).toBeLessThan(0.03);
      // After hundreds of days the time-varying limits equal the asymptotic ones (Montgomery ch. 9).
      expect(m.latest?.ewmaLimit ?? Number.NaN).toBeCloseTo(expected, 9);
      const lastDay = m.daily[m.daily.length - 1];
      expect(lastDay.ewmaUcl - lastDay.ewmaLcl).toBeCloseTo(2 * expected, 9);
      for (const d of m.daily) expect(d.beyond).toBe(d.ewma < d.ewmaLcl || d.ewma > d.ewmaUcl);
      // The 2 % stiffness loss (≈ 1 % in frequency) is far beyond the EWMA limits at the end.
      expect(lastDay.beyond).toBe(true);
    }
  });

  it("gives T² with a Phase II UCL just above χ²₀.₉₉₇₃(3) and marks the points above it", () => {
    expect(view.t2Ucl).not.toBeNull();
    const ucl = view.t2Ucl ?? Number.NaN;
    // scipy.stats.chi2.ppf(0.9973, 3) = 14.15625; the F-based UCL exceeds it and tends to it
    // for large m (Montgomery ch. 11); m ≈ 360 training days puts it within 5 %.
    expect(ucl).toBeGreaterThan(14.15625);
    expect(ucl).toBeLessThan(14.15625 * 1.05);
    expect(view.t2.length).toBeGreaterThan(500);
    for (const d of view.t2) expect(d.beyond).toBe(d.t2 > d.ucl);
    expect(view.t2.filter((d) => d.dayMs >= onsetMs + 20 * DAY).every((d) => d.beyond)).toBe(true);
  });

  it("gives damping with wide advisory limits from the training window (median ± 4·1.4826·MAD)", () => {
    for (const m of view.modes) {
      // Damping cycles 0.008…0.012: median 0.010, MAD 0.001 (Rousseeuw & Croux 1993).
      expect(m.damping.median).toBeCloseTo(0.01, 12);
      expect(m.damping.upperAdvisory ?? Number.NaN).toBeCloseTo(0.01 + 4 * 1.4826 * 0.001, 12);
      expect(m.damping.lowerAdvisory ?? Number.NaN).toBeCloseTo(0.01 - 4 * 1.4826 * 0.001, 12);
      expect(m.damping.points.length).toBe(m.points.length);
    }
    // Floor of ±40 % of the median: damping scatters ±15–40 % (REFERENCES.md [practice]).
    expect(dampingAdvisory([1, 1, 1, 1, 1, 1, 1, 1].map((v) => v * 0.02))).toEqual({ median: 0.02, lowerAdvisory: 0.02 - 0.008, upperAdvisory: 0.02 + 0.008 });
    expect(dampingAdvisory([0.01, 0.02])).toEqual({ median: null, lowerAdvisory: null, upperAdvisory: null });
  });

  it("filters the series by range and thins long series keeping their extremes", async () => {
    const from = new Date(onsetMs - 20 * DAY);
    const part = await getDriftView(team.owner.actor, assetId, { from });
    expect(part.condition).toBe(view.condition); // statistics from the whole replay
    for (const m of part.modes) {
      expect(m.points.length).toBeGreaterThan(0);
      expect(m.points.every((p) => p.atMs >= from.getTime())).toBe(true);
      expect(m.daily.every((d) => d.dayMs >= from.getTime())).toBe(true);
      expect(m.points.length).toBeLessThan(view.modes[0].points.length / 5);
    }
    expect(part.t2.every((d) => d.dayMs >= from.getTime())).toBe(true);

    const thin = await getDriftView(team.owner.actor, assetId, {}, { maxPointsPerMode: 200 });
    expect(thin.downsampled).toBe(true);
    expect(view.downsampled).toBe(false);
    thin.modes.forEach((m, j) => {
      const full = view.modes[j].points;
      const oe = full.filter((p) => p.outOfEnvelope).length;
      expect(m.points.length).toBeLessThanOrEqual(200 + oe);
      const fs = full.map((p) => p.frequencyHz);
      const ts = m.points.map((p) => p.frequencyHz);
      expect(Math.min(...ts)).toBe(Math.min(...fs));
      expect(Math.max(...ts)).toBe(Math.max(...fs));
      for (let i = 1; i < m.points.length; i++) expect(m.points[i].atMs).toBeGreaterThanOrEqual(m.points[i - 1].atMs);
    });
  });

  it("without a baseline gives the raw points, no statistics and the reason", async () => {
    const asset = await createAsset(team.engineer.actor, validAsset());
    await importModalHistory(team.engineer.actor, asset.id, historyCsv().split("\n").slice(0, 1 + 3 * 40).join("\n"));
    const v = await getDriftView(team.inspector.actor, asset.id);
    expect(v).toMatchObject({ skipped: "no active baseline", baseline: null, condition: "commissioning", t2: [], t2Ucl: null });
    expect(v.modes).toHaveLength(3);
    for (const m of v.modes) {
      expect(m.points).toHaveLength(40);
      expect(m.points.every((p) => p.predictedHz === null && !p.outOfEnvelope)).toBe(true);
      expect(m.daily).toEqual([]);
      expect(m.minimalShift).toBeNull();
    }
  });

  it("is not_found across organisations", async () => {
    await expect(getDriftView(foreign.owner.actor, assetId)).rejects.toMatchObject({ code: "not_found" });
  });
});

describe("trends routes", () => {
  const csvGet = async (token: string | undefined, query: string, id = assetId) => {
    const headers: Record<string, string> = token ? { authorization: `Bearer ${token}` } : {};
    const res = await trendsCsvRoute.GET(new Request(`http://127.0.0.1/api/v1/assets/${id}/trends.csv?${query}`, { headers }), {
      params: Promise.resolve({ assetId: id }),
    });
    return { status: res.status, type: res.headers.get("content-type") ?? "", disposition: res.headers.get("content-disposition") ?? "", text: await res.text() };
  };

  it("GET …/trends answers 401, 404 across organisations, 422 for a bad range, and the view", async () => {
    const params = { assetId };
    expect((await call(trendsRoute.GET, { params })).status).toBe(401);
    expect((await call(trendsRoute.GET, { params, token: await tokenFor(foreign.owner) })).status).toBe(404);
    const owner = await tokenFor(team.owner);
    const bad = await call(trendsRoute.GET, { params, token: owner, path: "/x?from=yesterday" });
    expect(bad.status).toBe(422);
    const from = new Date(onsetMs).toISOString();
    const ok = await call(trendsRoute.GET, { params, token: owner, path: `/x?from=${encodeURIComponent(from)}` });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ assetId, condition: "alert", range: { fromMs: onsetMs, toMs: null } });
    expect((ok.body.modes as unknown[]).length).toBe(3);
  });

  it("GET …/trends.csv gives each chart with a header row and ISO times; 401/404/422", async () => {
    const owner = await tokenFor(team.owner);
    expect((await csvGet(undefined, "chart=ewma")).status).toBe(401);
    expect((await csvGet(await tokenFor(foreign.owner), "chart=ewma")).status).toBe(404);
    expect((await csvGet(owner, "chart=spectrum")).status).toBe(422);
    const iso = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/;
    const expectRows: Record<string, { header: string; rows: number }> = {
      frequency: { header: "time,mode,frequencyHz,temperatureC,predictedHz,bandLowHz,bandHighHz,residualHz,outOfEnvelope", rows: view.modes.reduce((a, m) => a + m.points.length, 0) },
      temperature: { header: "time,mode,temperatureC,frequencyHz,predictedHz,outOfEnvelope", rows: view.modes.reduce((a, m) => a + m.points.length, 0) },
      ewma: { header: "day,mode,residualHz,residualLclHz,residualUclHz,ewmaHz,ewmaLclHz,ewmaUclHz,beyond,outOfEnvelope", rows: view.modes.reduce((a, m) => a + m.daily.length, 0) },
      t2: { header: "day,t2,ucl,beyond", rows: view.t2.length },
      damping: { header: "time,mode,dampingRatio,medianRatio,lowerAdvisoryRatio,upperAdvisoryRatio", rows: view.modes.reduce((a, m) => a + m.damping.points.length, 0) },
    };
    for (const [chart, want] of Object.entries(expectRows)) {
      const res = await csvGet(owner, `chart=${chart}`);
      expect(res.status).toBe(200);
      expect(res.type).toMatch(/^text\/csv/);
      expect(res.disposition).toMatch(new RegExp(`attachment; filename="trends-${chart}-all-all\\.csv"`));
      const lines = res.text.trimEnd().split("\r\n");
      expect(lines[0]).toBe(want.header);
      expect(lines.length - 1).toBe(want.rows);
      for (const line of lines.slice(1, 50)) {
        const cells = line.split(",");
        expect(cells).toHaveLength(want.header.split(",").length);
        expect(cells[0]).toMatch(iso);
      }
    }
    // A range narrows the rows: the t2 rows of the last 10 days.
    const from = new Date(view.t2[view.t2.length - 10].dayMs).toISOString();
    const last = await csvGet(owner, `chart=t2&from=${encodeURIComponent(from)}`);
    expect(last.text.trimEnd().split("\r\n")).toHaveLength(11);
  });
});

describe("condition after the inspection", () => {
  it("shows drift still beyond its limits as watch once every alert is closed (PRODUCT.md: alert = inspection asked)", async () => {
    await db()("alerts").where({ asset_id: assetId }).update({ state: "closed", closed_at: new Date(), outcome: "no_defect_found" });
    const v = await getDriftView(team.owner.actor, assetId);
    expect(v.statisticsCondition).toBe("alert");
    expect(v.condition).toBe("watch");
    expect((await recomputeDrift(assetId)).condition).toBe(v.condition);
  });
});
