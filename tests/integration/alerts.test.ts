/**
 * Alert lifecycle (PRODUCT.md roles and states): owners read only; inspectors and engineers
 * acknowledge, schedule, assign an inspector, comment and close with an outcome; every step
 * leaves an alert event and an audit entry; other organisations get 404; routes answer
 * 401/403/404/409/422.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as listRoute from "@/app/api/v1/alerts/route";
import * as alertRoute from "@/app/api/v1/alerts/[alertId]/route";
import * as ackRoute from "@/app/api/v1/alerts/[alertId]/acknowledge/route";
import * as scheduleRoute from "@/app/api/v1/alerts/[alertId]/schedule/route";
import * as assignRoute from "@/app/api/v1/alerts/[alertId]/assign/route";
import * as commentsRoute from "@/app/api/v1/alerts/[alertId]/comments/route";
import * as closeRoute from "@/app/api/v1/alerts/[alertId]/close/route";
import { db } from "@/lib/db/knex";
import { insertAlertIfNew } from "@/lib/db/repos/alert.repo";
import type { Alert } from "@/lib/domain/drift";
import { env } from "@/lib/config/env";
import { linksIn, waitForMail } from "@/tests/helpers/mail";
import {
  acknowledgeAlert, assignAlert, closeAlert, commentOnAlert, getAlert, listAlerts, scheduleInspection,
} from "@/lib/services/alerts/alert.service";
import { createAsset, listAssets } from "@/lib/services/assets/asset.service";
import { call, makeTeam, tokenFor, validAsset } from "./support/factories";
import { startMailWorker } from "./support/mail-worker";

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

async function raise(raisedAt = new Date(Date.UTC(2025, 5, 1))): Promise<Alert> {
  const asset = await createAsset(team.engineer.actor, validAsset());
  const alert = await insertAlertIfNew(db(), { assetId: asset.id, raisedAt, evidence: { rule: "test", modesBeyond: ["m1"] } });
  if (!alert) throw new Error("alert not inserted");
  return alert;
}

describe("alert lifecycle", () => {
  it("lets an owner read but not acknowledge, schedule, assign, comment or close", async () => {
    const a = await raise();
    expect((await getAlert(team.owner.actor, a.id)).alert).toMatchObject({ id: a.id, state: "open" });
    await expect(acknowledgeAlert(team.owner.actor, a.id)).rejects.toMatchObject({ code: "forbidden" });
    await expect(scheduleInspection(team.owner.actor, a.id, { at: new Date() })).rejects.toMatchObject({ code: "forbidden" });
    await expect(assignAlert(team.owner.actor, a.id, { userId: team.inspector.userId })).rejects.toMatchObject({ code: "forbidden" });
    await expect(commentOnAlert(team.owner.actor, a.id, { text: "x" })).rejects.toMatchObject({ code: "forbidden" });
    await expect(closeAlert(team.owner.actor, a.id, { outcome: "no_defect_found", findings: "x" })).rejects.toMatchObject({ code: "forbidden" });
    expect((await getAlert(team.owner.actor, a.id)).alert.state).toBe("open");
  });

  it("lets an inspector acknowledge, schedule, take the assignment, comment and close; each step is recorded", async () => {
    const a = await raise();
    expect((await acknowledgeAlert(team.inspector.actor, a.id)).state).toBe("acknowledged");
    await expect(acknowledgeAlert(team.inspector.actor, a.id)).rejects.toMatchObject({ code: "conflict" });
    const at = new Date(Date.UTC(2026, 11, 10, 9));
    expect(await scheduleInspection(team.inspector.actor, a.id, { at, note: "Bring the ladder" })).toMatchObject({ state: "inspection_scheduled", inspectionAt: at });
    expect((await assignAlert(team.engineer.actor, a.id, { userId: team.inspector.userId })).assigneeUserId).toBe(team.inspector.userId);
    await expect(assignAlert(team.engineer.actor, a.id, { userId: team.owner.userId })).rejects.toMatchObject({ code: "unprocessable" });
    await expect(assignAlert(team.engineer.actor, a.id, { userId: foreign.inspector.userId })).rejects.toMatchObject({ code: "unprocessable" });
    await commentOnAlert(team.inspector.actor, a.id, { text: "Bearing at the east abutment looks displaced." });
    const closed = await closeAlert(team.inspector.actor, a.id, { outcome: "defect_found", findings: "Displaced bearing; engineer informed." });
    expect(closed).toMatchObject({ state: "closed", outcome: "defect_found", findings: "Displaced bearing; engineer informed." });
    expect(closed.closedAt).toBeInstanceOf(Date);
    await expect(closeAlert(team.engineer.actor, a.id, { outcome: "repaired", findings: "again" })).rejects.toMatchObject({ code: "conflict" });
    await expect(scheduleInspection(team.inspector.actor, a.id, { at })).rejects.toMatchObject({ code: "conflict" });

    // E-mails (issue 5 §6): the assignee on assignment, inspectors and engineers on closure, each with the link and the caution.
    const link = `${env().APP_URL.replace(/\/$/, "")}/alerts/${a.id}`;
    const assignedMail = await waitForMail((m) => m.to.includes(team.inspector.email.toLowerCase()) && m.subject.startsWith("Alert assigned"));
    expect(linksIn(assignedMail)).toContain(link);
    expect(assignedMail.text).toMatch(/not an engineering assessment/);
    const closedMail = await waitForMail((m) => m.to.includes(team.engineer.email.toLowerCase()) && m.subject.startsWith("Alert closed"));
    expect(closedMail.text).toMatch(/defect found/);
    expect(closedMail.text).toMatch(/Displaced bearing/);
    expect(closedMail.html).toMatch(/not an engineering assessment/);

    const { events } = await getAlert(team.owner.actor, a.id);
    expect(events.map((e) => e.kind)).toEqual(["acknowledged", "inspection_scheduled", "assigned", "comment", "closed"]);
    const audits = await db()("audit_log").where({ subject_id: a.id }).orderBy("at").select("action");
    expect(audits.map((r: { action: string }) => r.action)).toEqual(
      ["alert.acknowledged", "alert.inspection_scheduled", "alert.assigned", "alert.comment", "alert.closed"],
    );
  });

  it("answers not_found to another organisation and to ids that are not uuids", async () => {
    const a = await raise();
    await expect(getAlert(foreign.owner.actor, a.id)).rejects.toMatchObject({ code: "not_found" });
    await expect(acknowledgeAlert(foreign.inspector.actor, a.id)).rejects.toMatchObject({ code: "not_found" });
    await expect(getAlert(team.owner.actor, "nope")).rejects.toMatchObject({ code: "not_found" });
    expect((await listAlerts(foreign.owner.actor)).map((x) => x.id)).not.toContain(a.id);
  });

  it("lists alerts that are not closed first, with filters by asset, state and assignee", async () => {
    const older = await raise(new Date(Date.UTC(2025, 0, 1)));
    const newer = await raise(new Date(Date.UTC(2025, 2, 1)));
    const closed = await raise(new Date(Date.UTC(2025, 4, 1)));
    await closeAlert(team.engineer.actor, closed.id, { outcome: "sensor_fault", findings: "Loose cable on A3." });
    await assignAlert(team.inspector.actor, older.id, { userId: team.inspector.userId });
    const ids = (await listAlerts(team.owner.actor)).map((x) => x.id);
    const pos = (id: string) => ids.indexOf(id);
    expect(pos(newer.id)).toBeLessThan(pos(older.id));
    expect(pos(older.id)).toBeLessThan(pos(closed.id));
    expect((await listAlerts(team.owner.actor, { assetId: older.assetId })).map((x) => x.id)).toEqual([older.id]);
    expect((await listAlerts(team.owner.actor, { state: "closed" })).map((x) => x.id)).toContain(closed.id);
    expect((await listAlerts(team.owner.actor, { state: "closed" })).every((x) => x.state === "closed")).toBe(true);
    const assigned = await listAlerts(team.owner.actor, { assigneeUserId: team.inspector.userId });
    expect(assigned.map((x) => x.id)).toContain(older.id);
    expect(assigned.every((x) => x.assigneeUserId === team.inspector.userId)).toBe(true);
    expect((await listAlerts(team.owner.actor, { assigneeUserId: team.owner.userId }))).toEqual([]);
    // The portfolio counts alerts that are not closed.
    const assets = await listAssets(team.owner.actor);
    expect(assets.find((x) => x.id === older.assetId)?.openAlertCount).toBe(1);
    expect(assets.find((x) => x.id === closed.assetId)?.openAlertCount).toBe(0);
  });
});

describe("alert routes", () => {
  it("answer 401 without credentials, 403 to an owner, 404 across organisations, 422 for bad input, 409 on a closed alert", async () => {
    const a = await raise();
    const params = { alertId: a.id };
    const [owner, inspector, other] = await Promise.all([tokenFor(team.owner), tokenFor(team.inspector), tokenFor(foreign.engineer)]);
    expect((await call(listRoute.GET, {})).status).toBe(401);
    expect((await call(alertRoute.GET, { params })).status).toBe(401);
    const list = await call(listRoute.GET, { token: owner, path: "/alerts?state=open" });
    expect(list.status).toBe(200);
    expect((list.body.alerts as { id: string }[]).map((x) => x.id)).toContain(a.id);
    expect((await call(listRoute.GET, { token: owner, path: "/alerts?state=bogus" })).status).toBe(422);
    expect((await call(alertRoute.GET, { token: other, params })).status).toBe(404);
    expect((await call(alertRoute.GET, { token: owner, params: { alertId: "x" } })).status).toBe(404);

    const post = (h: typeof ackRoute.POST, token: string | undefined, body?: unknown) => call(h, { method: "POST", params, token, body });
    expect((await post(ackRoute.POST, undefined)).status).toBe(401);
    expect((await post(ackRoute.POST, owner)).status).toBe(403);
    expect((await post(ackRoute.POST, other)).status).toBe(404);
    expect((await post(ackRoute.POST, inspector)).status).toBe(200);
    expect((await post(scheduleRoute.POST, inspector, { at: "not a date" })).status).toBe(422);
    expect((await post(scheduleRoute.POST, inspector, { at: "2026-12-10T09:00:00Z" })).body.alert).toMatchObject({ state: "inspection_scheduled" });
    expect((await post(assignRoute.POST, inspector, { userId: "x" })).status).toBe(422);
    expect((await post(assignRoute.POST, inspector, { userId: team.inspector.userId })).status).toBe(200);
    expect((await post(commentsRoute.POST, inspector, { text: "" })).status).toBe(422);
    expect((await post(commentsRoute.POST, inspector, { text: "On site Tuesday." })).status).toBe(201);
    const bad = await post(closeRoute.POST, inspector, { outcome: "fine", findings: "" });
    expect(bad.status).toBe(422);
    expect(Object.keys((bad.body.error as { details: { fieldErrors: Record<string, string[]> } }).details.fieldErrors).sort()).toEqual(["findings", "outcome"]);
    const closed = await post(closeRoute.POST, inspector, { outcome: "no_defect_found", findings: "Nothing found on site." });
    expect(closed.status).toBe(200);
    expect(closed.body.alert).toMatchObject({ state: "closed", outcome: "no_defect_found" });
    expect((await post(closeRoute.POST, inspector, { outcome: "repaired", findings: "x" })).status).toBe(409);
    const detail = await call(alertRoute.GET, { token: owner, params });
    expect((detail.body.events as { kind: string }[]).map((e) => e.kind)).toEqual(["acknowledged", "inspection_scheduled", "assigned", "comment", "closed"]);
  });
});
