/**
 * Alert e-mails and the per-asset opt-out of the Account page (issue 5 §6): a member who muted
 * an asset gets no e-mail about it (raise, assignment, closure) while the others do, each
 * e-mail with the evidence summary, the alert link and the caution (PRODUCT.md) in text and
 * HTML. Closing the alert turns the asset's `alert` condition into `watch` (PRODUCT.md:
 * `alert` = confirmed drift, inspection asked). Settings: 422 for a foreign asset, audited.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { env } from "@/lib/config/env";
import { db } from "@/lib/db/knex";
import { QUEUE_NAMES, getQueue } from "@/lib/jobs/queues";
import { listNotificationPrefs, updateNotificationPrefs } from "@/lib/services/accounts/notification.service";
import { assignAlert, closeAlert } from "@/lib/services/alerts/alert.service";
import { createAsset, getAsset } from "@/lib/services/assets/asset.service";
import { fitAndActivateBaseline } from "@/lib/services/drift/baseline.service";
import { recomputeDrift } from "@/lib/services/drift/drift.service";
import { importModalHistory } from "@/lib/services/drift/history-import.service";
import { simulateDriftHistory } from "@/lib/stats/drift-simulation";
import { caughtMails, linksIn, waitForMail, type CaughtMail } from "@/tests/helpers/mail";
import { makeMember, makeTeam, validAsset, type TestMember } from "./support/factories";
import { startMailWorker } from "./support/mail-worker";
import { simulatedHistoryCsv } from "./support/history";

const DAY = 86_400_000;
// The scenario of tests/integration/drift.test.ts: seed 2026, 2 % stiffness loss on day 550.
const sim = simulateDriftHistory({ seed: 2026, days: 590, onsetDay: 550, stiffnessLoss: 0.02 });
const t0 = sim.history.timesMs[0];

const historyCsv = () => simulatedHistoryCsv(sim.history);

type Team = Awaited<ReturnType<typeof makeTeam>>;
let team: Team;
let foreign: Team;
let quietInspector: TestMember;
let mail: ReturnType<typeof startMailWorker>;

beforeAll(async () => {
  [team, foreign] = await Promise.all([makeTeam(), makeTeam()]);
  quietInspector = await makeMember(team.org, "inspector");
  mail = startMailWorker();
});
afterAll(async () => {
  await mail.stop();
});

const to = (who: TestMember, subject: string) => (m: CaughtMail) => m.to.includes(who.email.toLowerCase()) && m.subject.startsWith(subject);

function expectEvidenceLinkCaution(mail: CaughtMail, link: string) {
  expect(linksIn(mail)).toContain(link);
  expect(mail.text).toMatch(/daily residual [+−]\d\.\d{4} Hz/);
  expect(mail.html).toMatch(/daily residual [+−]\d\.\d{4} Hz/);
  expect(mail.text).toMatch(/not an engineering assessment/);
  expect(mail.html).toMatch(/not an engineering assessment/);
}

describe("alert e-mails with a muted asset", () => {
  it("skips the member who muted the asset on raise, assignment and closure, and reaches the others", async () => {
    const asset = await createAsset(team.engineer.actor, validAsset());
    await importModalHistory(team.engineer.actor, asset.id, historyCsv());
    await fitAndActivateBaseline(team.engineer.actor, asset.id, { from: new Date(t0), to: new Date(t0 + 366 * DAY) });
    await updateNotificationPrefs(quietInspector.actor, { muted: [asset.id] });
    expect((await listNotificationPrefs(quietInspector.actor)).find((p) => p.assetId === asset.id)?.muted).toBe(true);
    expect((await listNotificationPrefs(team.inspector.actor)).find((p) => p.assetId === asset.id)?.muted).toBe(false);

    const outcome = await recomputeDrift(asset.id);
    expect(outcome.raisedAlertIds).toHaveLength(1);
    const alertId = outcome.raisedAlertIds[0];
    const link = `${env().APP_URL.replace(/\/$/, "")}/alerts/${alertId}`;
    await waitForMail(to(team.inspector, "Alert:"));
    await waitForMail(to(team.engineer, "Alert:"));

    // Assignment: to the muted inspector nothing is sent; to the other, one e-mail with evidence, link, caution.
    await assignAlert(team.engineer.actor, alertId, { userId: quietInspector.userId });
    await assignAlert(team.engineer.actor, alertId, { userId: team.inspector.userId });
    expectEvidenceLinkCaution(await waitForMail(to(team.inspector, "Alert assigned")), link);

    // Closure: e-mailed to inspectors and engineers except the closer and the muted inspector.
    await closeAlert(team.inspector.actor, alertId, { outcome: "no_defect_found", findings: "Cables and anchorages intact." });
    const closed = await waitForMail(to(team.engineer, "Alert closed"));
    expectEvidenceLinkCaution(closed, link);
    expect(closed.text).toMatch(/no defect found/);

    const mails = await caughtMails();
    expect(mails.filter((m) => m.to.includes(quietInspector.email.toLowerCase()))).toEqual([]);
    // Not merely late: no mail job was ever queued for the muted member (the queue keeps finished jobs).
    const jobs = await getQueue(QUEUE_NAMES.mail).getJobs(["completed", "waiting", "active", "delayed", "failed", "prioritized"]);
    const queuedTo = jobs.map((j) => String((j?.data as { to?: string } | undefined)?.to ?? "").toLowerCase());
    expect(queuedTo).toContain(team.engineer.email.toLowerCase());
    expect(queuedTo).not.toContain(quietInspector.email.toLowerCase());
    expect(mails.filter(to(team.inspector, "Alert closed"))).toEqual([]); // the closer is not told what they did

    // PRODUCT.md: `alert` is "confirmed drift, inspection asked"; once closed, the drift still
    // beyond its limits leaves the asset in `watch`.
    expect((await getAsset(team.owner.actor, asset.id)).condition).toBe("alert");
    expect((await recomputeDrift(asset.id)).condition).toBe("watch");
    expect((await getAsset(team.owner.actor, asset.id)).condition).toBe("watch");
  });
});

describe("notification settings", () => {
  it("mute exactly the listed assets, refuse another organisation's asset and are audited", async () => {
    const [a, b] = await Promise.all([createAsset(team.engineer.actor, validAsset()), createAsset(team.engineer.actor, validAsset())]);
    const other = await createAsset(foreign.engineer.actor, validAsset());
    await updateNotificationPrefs(team.owner.actor, { muted: [a.id, b.id] });
    await updateNotificationPrefs(team.owner.actor, { muted: [b.id] });
    const prefs = await listNotificationPrefs(team.owner.actor);
    expect(prefs.find((p) => p.assetId === a.id)?.muted).toBe(false);
    expect(prefs.find((p) => p.assetId === b.id)?.muted).toBe(true);
    expect(prefs.map((p) => p.assetId)).not.toContain(other.id);
    await expect(updateNotificationPrefs(team.owner.actor, { muted: [other.id] })).rejects.toMatchObject({ code: "unprocessable" });
    const audits = await db()("audit_log").where({ subject_id: team.owner.userId, action: "account.notifications" }).count<{ c: string }[]>({ c: "*" });
    expect(audits).toEqual([{ c: "2" }]);
  });
});
