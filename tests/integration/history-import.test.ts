/**
 * Modal history import (issue 5 §1 and its checks): all or nothing with every bad row named;
 * the same file twice imports once; tracked modes created by label; preview writes nothing;
 * roles and the route's 401/404/415/422.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as historyRoute from "@/app/api/v1/assets/[assetId]/history/route";
import { closeDb, db } from "@/lib/db/knex";
import { createAsset } from "@/lib/services/assets/asset.service";
import { importModalHistory } from "@/lib/services/drift/history-import.service";
import { listTrackedModes } from "@/lib/services/tracking/tracked-mode.service";
import { call, makeTeam, tokenFor, validAsset } from "./support/factories";
import { closeQueues } from "@/lib/jobs/queues";

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

const HEADER = "timestamp,mode,frequencyHz,dampingRatio,temperatureC";
const GOOD = [
  HEADER,
  "2025-01-01T00:00:00Z,Vertical 1,2.101,0.012,3.5",
  "2025-01-01T00:00:00Z,Lateral 1,3.402,,3.5",
  "2025-01-01T06:00:00Z,Vertical 1,2.097,0.011,",
  "2025-01-01T06:00:00Z,Lateral 1,3.398,0.020,5.0",
].join("\n");

const estimates = async (assetId: string) =>
  Number((await db()("modal_estimates").where({ asset_id: assetId }).count<{ c: string }[]>({ c: "*" }))[0].c);

describe("importModalHistory", () => {
  it("imports nothing from a file with one bad row and names that row with its reason", async () => {
    const asset = await createAsset(team.engineer.actor, validAsset());
    const bad = GOOD.split("\n");
    bad.splice(3, 0, "2025-01-01T03:00:00Z,Vertical 1,-2.1,0.01,4"); // line 4: negative frequency
    await expect(importModalHistory(team.engineer.actor, asset.id, bad.join("\n"))).rejects.toMatchObject({
      code: "unprocessable", details: { rows: [{ line: 4, reason: expect.stringContaining("frequencyHz") }] },
    });
    expect(await estimates(asset.id)).toBe(0);
    expect(await listTrackedModes(team.engineer.actor, asset.id)).toEqual([]);
  });

  it("reports every bad row (time zone, damping as a percent, duplicate, field count)", async () => {
    const asset = await createAsset(team.engineer.actor, validAsset());
    const text = [
      HEADER,
      "2025-01-01T00:00:00+02:00,Vertical 1,2.1,,", // not UTC
      "2025-01-01T00:00:00Z,Vertical 1,2.1,1.2,", // damping 120 % is not a fraction
      "2025-01-01T01:00:00Z,Vertical 1,2.1,,",
      "2025-01-01T01:00:00Z,Vertical 1,2.2,,", // repeats line 4
      "2025-01-01T02:00:00Z,Vertical 1,2.1", // 3 fields
    ].join("\r\n");
    const err = await importModalHistory(team.admin.actor, asset.id, text).catch((e: unknown) => e);
    expect(err).toMatchObject({ code: "unprocessable" });
    const rows = (err as { details: { rows: { line: number }[] } }).details.rows;
    expect(rows.map((r) => r.line)).toEqual([2, 3, 5, 6]);
  });

  it("imports a file once: the same file again changes nothing; modes are created on first use", async () => {
    const asset = await createAsset(team.engineer.actor, validAsset());
    const first = await importModalHistory(team.engineer.actor, asset.id, GOOD);
    expect(first).toMatchObject({ rows: 4, imported: 4, preview: false });
    expect(first.source).toMatch(/^import:[0-9a-f]{64}$/);
    expect(first.modes).toEqual(expect.arrayContaining([{ label: "Vertical 1", rows: 2, created: true }, { label: "Lateral 1", rows: 2, created: true }]));
    const modes = await listTrackedModes(team.owner.actor, asset.id);
    expect(modes.map((m) => m.label).sort()).toEqual(["Lateral 1", "Vertical 1"]);
    // Nominal frequency = median of the imported values: (2.101 + 2.097) / 2.
    expect(modes.find((m) => m.label === "Vertical 1")?.nominalFrequencyHz).toBeCloseTo(2.099, 9);

    const again = await importModalHistory(team.engineer.actor, asset.id, GOOD);
    expect(again).toMatchObject({ rows: 4, imported: 0 });
    expect(again.modes.every((m) => !m.created)).toBe(true);
    expect(await estimates(asset.id)).toBe(4);
    expect((await listTrackedModes(team.owner.actor, asset.id))).toHaveLength(2);
    const audits = await db()("audit_log").where({ subject_id: asset.id, action: "history.import" }).count<{ c: string }[]>({ c: "*" });
    expect(Number(audits[0].c)).toBe(1);
  });

  it("lets only engineers and admins import; another organisation's asset is not found", async () => {
    const asset = await createAsset(team.engineer.actor, validAsset());
    for (const role of ["inspector", "owner"] as const) {
      await expect(importModalHistory(team[role].actor, asset.id, GOOD)).rejects.toMatchObject({ code: "forbidden" });
    }
    await expect(importModalHistory(foreign.engineer.actor, asset.id, GOOD)).rejects.toMatchObject({ code: "not_found" });
    expect(await estimates(asset.id)).toBe(0);
  });
});

describe("POST /api/v1/assets/:assetId/history", () => {
  it("previews without writing, imports text/csv and multipart, answers 401/404/415/422", async () => {
    const asset = await createAsset(team.engineer.actor, validAsset());
    const token = await tokenFor(team.engineer);
    const params = { assetId: asset.id };
    const post = (opts: { token?: string; rawBody?: string; contentType?: string; path?: string; params?: Record<string, string> }) =>
      call(historyRoute.POST, { method: "POST", path: opts.path ?? `/assets/${asset.id}/history`, params: opts.params ?? params, ...opts });

    expect((await post({ rawBody: GOOD, contentType: "text/csv" })).status).toBe(401);
    const preview = await post({ token, rawBody: GOOD, contentType: "text/csv", path: `/assets/${asset.id}/history?preview=1` });
    expect(preview.status).toBe(200);
    expect(preview.body.import).toMatchObject({ rows: 4, imported: 0, preview: true });
    expect(await estimates(asset.id)).toBe(0);

    const bad = await post({ token, rawBody: `${HEADER}\nyesterday,Vertical 1,2.1,,`, contentType: "text/csv" });
    expect(bad.status).toBe(422);
    expect(bad.body).toMatchObject({ error: { code: "unprocessable", details: { rows: [{ line: 2 }] } } });
    expect((await post({ token, rawBody: GOOD, contentType: "application/json" })).status).toBe(415);
    const other = await tokenFor(foreign.engineer);
    expect((await post({ token: other, rawBody: GOOD, contentType: "text/csv" })).status).toBe(404);
    expect((await post({ token, rawBody: GOOD, contentType: "text/csv", params: { assetId: "not-a-uuid" } })).status).toBe(404);

    const form = new FormData();
    form.set("file", new Blob([GOOD], { type: "text/csv" }), "history.csv");
    const req = new Request(`http://127.0.0.1/api/v1/assets/${asset.id}/history`, { method: "POST", headers: { authorization: `Bearer ${token}` }, body: form });
    const res = await historyRoute.POST(req, { params: Promise.resolve(params) });
    expect(res.status).toBe(201);
    expect(await estimates(asset.id)).toBe(4);
    expect((await post({ token, rawBody: GOOD, contentType: "text/csv" })).status).toBe(200);
    expect(await estimates(asset.id)).toBe(4);
  });
});
