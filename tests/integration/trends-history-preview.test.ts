/**
 * History import preview (issue 5 §1 screen): the dry run names every bad row, counts rows and
 * modes (found or to be created), gives the date range and the first rows, writes nothing, and
 * reports a file already imported; roles and organisations as the import.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/lib/db/knex";
import { closeQueues } from "@/lib/jobs/queues";
import { createAsset } from "@/lib/services/assets/asset.service";
import { importModalHistory, previewModalHistory } from "@/lib/services/drift/history-import.service";
import { makeTeam, validAsset } from "./support/factories";

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
  "2025-01-02T06:00:00Z,Lateral 1,3.398,0.020,5.0",
].join("\n");

const counts = async (assetId: string) => ({
  estimates: Number((await db()("modal_estimates").where({ asset_id: assetId }).count<{ c: string }[]>({ c: "*" }))[0].c),
  modes: Number((await db()("tracked_modes").where({ asset_id: assetId }).count<{ c: string }[]>({ c: "*" }))[0].c),
});

describe("previewModalHistory", () => {
  it("summarises a good file without writing anything", async () => {
    const asset = await createAsset(team.engineer.actor, validAsset());
    const p = await previewModalHistory(team.engineer.actor, asset.id, GOOD, { firstRows: 3 });
    expect(p).toMatchObject({ rows: 4, errors: [], alreadyImported: 0 });
    expect(p.from?.toISOString()).toBe("2025-01-01T00:00:00.000Z");
    expect(p.to?.toISOString()).toBe("2025-01-02T06:00:00.000Z");
    expect(p.modes).toEqual([{ label: "Vertical 1", rows: 2, created: true }, { label: "Lateral 1", rows: 2, created: true }]);
    expect(p.firstRows.map((r) => [r.line, r.mode, r.frequencyHz, r.dampingRatio, r.temperatureC])).toEqual([
      [2, "Vertical 1", 2.101, 0.012, 3.5], [3, "Lateral 1", 3.402, null, 3.5], [4, "Vertical 1", 2.097, 0.011, null],
    ]);
    expect(await counts(asset.id)).toEqual({ estimates: 0, modes: 0 });
  });

  it("lists every bad row with its line instead of throwing, and still writes nothing", async () => {
    const asset = await createAsset(team.engineer.actor, validAsset());
    const lines = GOOD.split("\n");
    lines.splice(2, 0, "2025-01-01T03:00:00Z,Vertical 1,-2.1,0.01,4"); // line 3
    lines.push("2025-01-03T00:00:00+02:00,Vertical 1,2.1,,"); // line 7: not UTC
    const p = await previewModalHistory(team.engineer.actor, asset.id, lines.join("\n"));
    expect(p.errors.map((e) => e.line)).toEqual([3, 7]);
    expect(p.errors[0].reason).toContain("frequencyHz");
    expect(p.rows).toBe(4);
    expect(await counts(asset.id)).toEqual({ estimates: 0, modes: 0 });
  });

  it("tells a file imported before and modes that exist", async () => {
    const asset = await createAsset(team.engineer.actor, validAsset());
    await importModalHistory(team.engineer.actor, asset.id, GOOD);
    const p = await previewModalHistory(team.admin.actor, asset.id, GOOD);
    expect(p.alreadyImported).toBe(4);
    expect(p.modes.every((m) => !m.created)).toBe(true);
    const other = await previewModalHistory(team.admin.actor, asset.id, `${GOOD}\n2025-01-03T00:00:00Z,Torsion 1,4.2,,2`);
    expect(other.alreadyImported).toBe(0);
    expect(other.modes.find((m) => m.label === "Torsion 1")).toEqual({ label: "Torsion 1", rows: 1, created: true });
  });

  it("is for engineers and admins of the asset's organisation", async () => {
    const asset = await createAsset(team.engineer.actor, validAsset());
    await expect(previewModalHistory(team.inspector.actor, asset.id, GOOD)).rejects.toMatchObject({ code: "forbidden" });
    await expect(previewModalHistory(team.owner.actor, asset.id, GOOD)).rejects.toMatchObject({ code: "forbidden" });
    await expect(previewModalHistory(foreign.engineer.actor, asset.id, GOOD)).rejects.toMatchObject({ code: "not_found" });
  });
});
