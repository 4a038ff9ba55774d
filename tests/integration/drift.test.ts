/**
 * Drift end to end (issue 5 checks): a simulated history with seasonal temperature and a 2 %
 * stiffness loss on a known day is imported, a baseline is fitted on its first year, and the
 * drift replay raises one alert within 30 days of the onset, sets the asset to `alert`, and
 * sends one e-mail with the caution and the alert link to each inspector and engineer.
 * Baseline routes: 401/403/404/422 and versions.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as baselinesRoute from "@/app/api/v1/assets/[assetId]/baselines/route";
import { env } from "@/lib/config/env";
import { db } from "@/lib/db/knex";
import { createRedisConnection } from "@/lib/jobs/connection";
import { enqueueDrift } from "@/lib/jobs/drift";
import { updateAssetById } from "@/lib/db/repos/asset.repo";
import { createDriftWorker } from "@/workers/drift.worker";
import { createAsset, getAsset } from "@/lib/services/assets/asset.service";
import { fitAndActivateBaseline, listBaselines } from "@/lib/services/drift/baseline.service";
import { recomputeDrift } from "@/lib/services/drift/drift.service";
import { importModalHistory } from "@/lib/services/drift/history-import.service";
import { simulateDriftHistory } from "@/lib/stats/drift-simulation";
import { caughtMails, linksIn, waitForMail } from "@/tests/helpers/mail";
import { call, makeTeam, tokenFor, validAsset } from "./support/factories";
import { startMailWorker } from "./support/mail-worker";
import { simulatedHistoryCsv } from "./support/history";

const DAY = 86_400_000;
// Same scenario as tests/unit/stats/drift-detection.test.ts (seed 2026, onset on day 550),
// cut 40 days after the onset to keep the import small.
const ONSET_DAY = 550;
const sim = simulateDriftHistory({ seed: 2026, days: ONSET_DAY + 40, onsetDay: ONSET_DAY, stiffnessLoss: 0.02 });
const t0 = sim.history.timesMs[0];
const onsetMs = sim.onsetMs ?? Number.NaN;

const historyCsv = () => simulatedHistoryCsv(sim.history);

type Team = Awaited<ReturnType<typeof makeTeam>>;
let team: Team;
let foreign: Team;
let mail: ReturnType<typeof startMailWorker>;

beforeAll(async () => {
  [team, foreign] = await Promise.all([makeTeam(), makeTeam()]);
  mail = startMailWorker();
});
afterAll(async () => {
  await mail.stop();
});

describe("recomputeDrift on an imported history", () => {
  it("raises one alert within 30 days of a 2 % stiffness loss and e-mails inspectors and engineers with the caution", async () => {
    const asset = await createAsset(team.engineer.actor, validAsset());
    const imported = await importModalHistory(team.engineer.actor, asset.id, historyCsv());
    expect(imported.imported).toBeGreaterThan(0);
    expect((await recomputeDrift(asset.id)).condition).toBe("commissioning"); // no baseline yet (PRODUCT.md)

    const baseline = await fitAndActivateBaseline(team.engineer.actor, asset.id, { from: new Date(t0), to: new Date(t0 + 366 * DAY) });
    expect(baseline).toMatchObject({ version: 1, active: true, status: "complete" });
    expect(baseline.models).toHaveLength(3);

    const outcome = await recomputeDrift(asset.id);
    expect(outcome.skipped).toBeNull();
    expect(outcome.condition).toBe("alert");
    expect((await getAsset(team.owner.actor, asset.id)).condition).toBe("alert");
    const alerts = await db()("alerts").where({ asset_id: asset.id }).select("id", "raised_at", "state", "evidence");
    expect(alerts).toHaveLength(1);
    const raisedMs = (alerts[0].raised_at as Date).getTime();
    // Issue 5 check: alert within 30 days of the onset, none before it.
    expect(raisedMs).toBeGreaterThanOrEqual(onsetMs);
    expect(raisedMs - onsetMs).toBeLessThanOrEqual(30 * DAY);
    expect(alerts[0]).toMatchObject({ state: "open", evidence: { baselineVersion: 1, modesBeyond: expect.any(Array) } });

    const link = `${env().APP_URL.replace(/\/$/, "")}/alerts/${alerts[0].id}`;
    for (const who of [team.inspector, team.engineer]) {
      const mail = await waitForMail((m) => m.to.includes(who.email.toLowerCase()) && m.subject.startsWith("Alert:"));
      expect(linksIn(mail)).toContain(link);
      expect(mail.text).toMatch(/not an engineering assessment/);
      expect(mail.text).toMatch(/licensed structural engineer/);
      expect(mail.html).toMatch(/not an engineering assessment/);
    }

    // A second replay raises nothing new and sends nothing new (keyed inserts and mail job ids).
    const again = await recomputeDrift(asset.id);
    expect(again.raisedAlertIds).toEqual([]);
    expect(await db()("alerts").where({ asset_id: asset.id }).count<{ c: string }[]>({ c: "*" })).toEqual([{ c: "1" }]);
    const mails = await caughtMails();
    for (const who of [team.inspector, team.engineer]) {
      expect(mails.filter((m) => m.to.includes(who.email.toLowerCase()) && m.subject.startsWith("Alert:"))).toHaveLength(1);
    }
    for (const who of [team.owner, team.admin]) {
      expect(mails.filter((m) => m.to.includes(who.email.toLowerCase()))).toHaveLength(0);
    }
  });
});

describe("drift queue and worker", () => {
  it("replays an asset queued as drift-<assetId>: without a baseline the asset is commissioning", async () => {
    const asset = await createAsset(team.engineer.actor, validAsset());
    await updateAssetById(db(), asset.id, { condition: "steady" });
    const workerConnection = createRedisConnection();
    const driftWorker = createDriftWorker(workerConnection);
    try {
      const job = await enqueueDrift(asset.id);
      expect(job.jobId).toMatch(new RegExp(`^drift-${asset.id}`));
      const deadline = Date.now() + 20_000;
      while ((await getAsset(team.owner.actor, asset.id)).condition !== "commissioning" && Date.now() < deadline) {
        await new Promise((r) => setTimeout(r, 200));
      }
      expect((await getAsset(team.owner.actor, asset.id)).condition).toBe("commissioning");
    } finally {
      await driftWorker.close();
      await workerConnection.quit();
    }
  });
});

describe("baselines routes", () => {
  it("answer 401, 403 for inspectors, 404 across organisations, 422 for a bad window or no data; versions are kept", async () => {
    const asset = await createAsset(team.engineer.actor, validAsset());
    const params = { assetId: asset.id };
    const body = { from: new Date(t0).toISOString(), to: new Date(t0 + 60 * DAY).toISOString() };
    const post = (token: string | undefined, b: unknown, p = params) => call(baselinesRoute.POST, { method: "POST", params: p, token, body: b });
    expect((await post(undefined, body)).status).toBe(401);
    expect((await post(await tokenFor(team.inspector), body)).status).toBe(403);
    expect((await post(await tokenFor(foreign.engineer), body)).status).toBe(404);
    const engineer = await tokenFor(team.engineer);
    expect((await post(engineer, { from: body.to, to: body.from })).status).toBe(422);
    const empty = await post(engineer, body);
    expect(empty.status).toBe(422); // no tracked mode, no data

    const csv = historyCsv().split("\n").slice(0, 1 + 3 * 8 * 60).join("\n"); // the first 60 days
    await importModalHistory(team.engineer.actor, asset.id, csv);
    const first = await post(engineer, body);
    expect(first.status).toBe(201);
    expect(first.body.baseline).toMatchObject({ version: 1, status: "provisional", active: true });
    const second = await post(engineer, { ...body, model: "linear" });
    expect(second.body.baseline).toMatchObject({ version: 2, active: true, requestedModel: "linear" });
    const list = await listBaselines(team.owner.actor, asset.id);
    expect(list.map((b) => [b.version, b.active, b.status])).toEqual([[2, true, "provisional"], [1, false, "superseded"]]);
    const got = await call(baselinesRoute.GET, { params, token: await tokenFor(team.owner) });
    expect(got.status).toBe(200);
    expect((got.body.baselines as unknown[]).length).toBe(2);
  });
});
