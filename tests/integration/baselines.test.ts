/**
 * Baselines screen data (issue 5 §2): versions newest first with who fitted each; fitting
 * queues the drift replay (drift-<assetId> job).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/lib/db/knex";
import { driftJobId, getDriftQueue } from "@/lib/jobs/drift";
import { closeQueues } from "@/lib/jobs/queues";
import { createAsset } from "@/lib/services/assets/asset.service";
import { fitAndActivateBaseline, listBaselineVersions } from "@/lib/services/drift/baseline.service";
import { importModalHistory } from "@/lib/services/drift/history-import.service";
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

/** 30 days × 4 rows of one mode with a linear temperature relation f = 2.1 − 0.003·T. */
function csv(): string {
  const lines = ["timestamp,mode,frequencyHz,dampingRatio,temperatureC"];
  const t0 = Date.UTC(2025, 0, 1);
  for (let i = 0; i < 120; i++) {
    const temp = 5 + 10 * Math.sin(i / 7) + (i % 3);
    lines.push(`${new Date(t0 + i * 6 * 3_600_000).toISOString()},Vertical 1,${(2.1 - 0.003 * temp + 0.0005 * Math.sin(i * 1.7)).toFixed(5)},,${temp.toFixed(2)}`);
  }
  return lines.join("\n");
}

describe("listBaselineVersions", () => {
  it("lists versions newest first with the fitter's name, and fitting queues the drift replay", async () => {
    const asset = await createAsset(team.engineer.actor, validAsset());
    await importModalHistory(team.engineer.actor, asset.id, csv());
    const window = { from: new Date(Date.UTC(2025, 0, 1)), to: new Date(Date.UTC(2025, 0, 31)) };
    await fitAndActivateBaseline(team.engineer.actor, asset.id, { ...window, model: "linear" });
    await fitAndActivateBaseline(team.admin.actor, asset.id, { ...window, model: "auto" });
    const versions = await listBaselineVersions(team.owner.actor, asset.id);
    expect(versions.map((v) => [v.version, v.active, v.status, v.requestedModel])).toEqual([
      [2, true, "provisional", "auto"], [1, false, "superseded", "linear"],
    ]);
    const users = await db()("users").whereIn("id", [team.admin.userId, team.engineer.userId]).select("id", "display_name");
    const nameOf = (id: string) => users.find((u) => u.id === id)?.display_name;
    expect(versions.map((v) => v.createdByName)).toEqual([nameOf(team.admin.userId), nameOf(team.engineer.userId)]);
    // The linear fit recovers the slope of the generating relation (least squares).
    expect(versions[1].models[0].model.slopeHzPerC).toBeCloseTo(-0.003, 3);

    // No drift worker runs here: the job the fit queued waits under drift-<assetId>.
    const job = await getDriftQueue().getJob(driftJobId(asset.id));
    expect(job?.data).toEqual({ assetId: asset.id });
    await expect(listBaselineVersions(foreign.owner.actor, asset.id)).rejects.toMatchObject({ code: "not_found" });
  });
});
