import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Worker } from "bullmq";
import { closeDb, db } from "@/lib/db/knex";
import { closeQueues } from "@/lib/jobs/queues";
import { createRedisConnection } from "@/lib/jobs/connection";
import { createMailWorker } from "@/workers/mail.worker";
import { closeMailTransport } from "@/lib/email/transport";
import { verifyCredentials } from "@/lib/services/accounts/account.service";
import { listAudit } from "@/lib/services/audit/audit.service";
import {
  acceptInvitation, changeMemberRole, findInvitationByToken, inviteMember, listInvitations, listMembers, removeMember,
} from "@/lib/services/team/team.service";
import { checkPasswordResetToken, requestPasswordReset, resetPassword } from "@/lib/services/team/password-reset.service";
import { makeMember, makeTeam, PASSWORD, unique } from "./support/factories";
import { linksIn, waitForMail as waitForCaught } from "@/tests/helpers/mail";
import { env } from "@/lib/config/env";

/** The first message to `to` whose subject matches (through the queue, the worker and SMTP). */
function waitForMail(to: string, subject: RegExp) {
  return waitForCaught((m) => m.to.includes(to.toLowerCase()) && subject.test(m.subject));
}

/** The token of the `${APP_URL}${path}/<token>` link of a message. */
function linkIn(mail: Awaited<ReturnType<typeof waitForMail>>, path: string): { token: string } {
  const base = `${env().APP_URL.replace(/\/$/, "")}${path}/`;
  const link = linksIn(mail).find((l) => l.startsWith(base));
  if (!link) throw new Error(`no ${path} link in the message`);
  return { token: link.slice(base.length) };
}

type Team = Awaited<ReturnType<typeof makeTeam>>;
let team: Team;
let foreign: Team;
let worker: Worker;
let workerConnection: ReturnType<typeof createRedisConnection>;

beforeAll(async () => {
  [team, foreign] = await Promise.all([makeTeam(), makeTeam()]);
  workerConnection = createRedisConnection();
  worker = createMailWorker(workerConnection);
});
afterAll(async () => {
  await worker.close();
  await workerConnection.quit();
  await closeQueues();
  closeMailTransport();
  await closeDb();
});

const ip = () => `192.0.2.${Math.floor(Math.random() * 250) + 1}-${unique("t")}`;

describe("invitations", () => {
  it("refuses to let an inspector, an engineer or an owner invite (403)", async () => {
    for (const role of ["inspector", "engineer", "owner"] as const) {
      await expect(inviteMember(team[role].actor, { email: `${unique("x")}@test.example`, role: "owner" })).rejects.toMatchObject({ code: "forbidden" });
    }
  });

  it("sends the invitation e-mail to the catcher; the link sets a password and the new inspector signs in", async () => {
    const email = `${unique("new-inspector")}@test.example`;
    const { invitation } = await inviteMember(team.admin.actor, { email, role: "inspector" });
    expect(invitation).toMatchObject({ email, role: "inspector", acceptedAt: null });
    const mail = await waitForMail(email, /Invitation/);
    const { token } = linkIn(mail, "/invite");
    expect(await findInvitationByToken(token)).toMatchObject({ email, role: "inspector", organisationName: team.org.name, existingAccount: false });

    const accepted = await acceptInvitation({ token, displayName: "New Inspector", password: "a-strong-new-password" });
    expect(accepted).toMatchObject({ email, organisationId: team.org.id });
    const v = await verifyCredentials({ email, password: "a-strong-new-password", ip: ip() });
    expect(v.memberships).toEqual([{ organisationId: team.org.id, organisationName: team.org.name, role: "inspector" }]);

    await expect(acceptInvitation({ token, displayName: "Again", password: "a-strong-new-password" })).rejects.toMatchObject({ code: "not_found" });
    expect(await findInvitationByToken(token)).toBeNull();
    const actions = (await listAudit(team.admin.actor, { limit: 20 })).map((a) => a.action);
    expect(actions).toEqual(expect.arrayContaining(["invitation.create", "invitation.accept"]));
  });

  it("answers conflict when inviting an existing member and replaces a pending invitation to the same address", async () => {
    await expect(inviteMember(team.admin.actor, { email: team.owner.email, role: "owner" })).rejects.toMatchObject({ code: "conflict" });
    const email = `${unique("twice")}@test.example`;
    await inviteMember(team.admin.actor, { email, role: "owner" });
    await inviteMember(team.admin.actor, { email, role: "engineer" });
    const pending = (await listInvitations(team.admin.actor)).filter((i) => i.email === email);
    expect(pending.map((i) => i.role)).toEqual(["engineer"]);
  });

  it("adds an existing account of another organisation only with that account's password", async () => {
    const email = foreign.inspector.email;
    await inviteMember(team.admin.actor, { email, role: "owner" });
    const { token } = linkIn(await waitForMail(email, /Invitation/), "/invite");
    expect(await findInvitationByToken(token)).toMatchObject({ existingAccount: true });
    await expect(acceptInvitation({ token, displayName: "x", password: "not-their-password" }))
      .rejects.toMatchObject({ code: "unprocessable", fieldErrors: { password: [expect.any(String)] } });
    await acceptInvitation({ token, displayName: "x", password: PASSWORD });
    const v = await verifyCredentials({ email, password: PASSWORD, ip: ip() });
    expect(v.memberships.map((m) => m.role).sort()).toEqual(["inspector", "owner"]);
  });
});

describe("roles and removal", () => {
  it("lets an admin change a role and refuses to demote or remove the last admin (conflict)", async () => {
    const t = await makeTeam();
    const m = await changeMemberRole(t.admin.actor, { userId: t.owner.userId, role: "engineer" });
    expect(m.role).toBe("engineer");
    await expect(changeMemberRole(t.admin.actor, { userId: t.admin.userId, role: "owner" })).rejects.toMatchObject({ code: "conflict" });
    await expect(removeMember(t.admin.actor, { userId: t.admin.userId })).rejects.toMatchObject({ code: "conflict" });
    await changeMemberRole(t.admin.actor, { userId: t.engineer.userId, role: "admin" });
    await removeMember(t.admin.actor, { userId: t.admin.userId });
    expect((await listMembers(t.engineer.actor)).map((x) => x.userId)).not.toContain(t.admin.userId);
    const actions = (await listAudit(t.engineer.actor, {})).map((a) => a.action);
    expect(actions.filter((a) => a === "member.role_change")).toHaveLength(2);
    expect(actions).toContain("member.remove");
  });

  it("answers not_found for a member of another organisation and forbidden to non-admins", async () => {
    await expect(changeMemberRole(team.admin.actor, { userId: foreign.owner.userId, role: "admin" })).rejects.toMatchObject({ code: "not_found" });
    await expect(removeMember(team.admin.actor, { userId: foreign.owner.userId })).rejects.toMatchObject({ code: "not_found" });
    await expect(changeMemberRole(team.engineer.actor, { userId: team.owner.userId, role: "admin" })).rejects.toMatchObject({ code: "forbidden" });
    const role = await db()("memberships").select("role").where({ user_id: foreign.owner.userId }).first();
    expect(role.role).toBe("owner");
  });

  it("keeps the audit log to admins and engineers", async () => {
    await expect(listAudit(team.inspector.actor)).rejects.toMatchObject({ code: "forbidden" });
    await expect(listAudit(team.owner.actor)).rejects.toMatchObject({ code: "forbidden" });
  });
});

describe("password reset", () => {
  it("mails a single-use link that sets a new password", async () => {
    const m = await makeMember(team.org, "inspector");
    expect(await requestPasswordReset({ email: m.email })).toEqual({ ok: true });
    const { token } = linkIn(await waitForMail(m.email, /Reset/), "/reset");
    expect(await checkPasswordResetToken(token)).toEqual({ valid: true });
    await resetPassword({ token, password: "my-reset-password-1" });
    await expect(verifyCredentials({ email: m.email, password: PASSWORD, ip: ip() })).rejects.toMatchObject({ code: "unauthorized" });
    await expect(verifyCredentials({ email: m.email, password: "my-reset-password-1", ip: ip() })).resolves.toMatchObject({ userId: m.userId });
    await expect(resetPassword({ token, password: "another-password-2" })).rejects.toMatchObject({ code: "not_found" });
    expect(await checkPasswordResetToken(token)).toEqual({ valid: false });
  });

  it("answers the same for an unknown e-mail and stores nothing", async () => {
    const before = await db()("password_resets").count<{ n: string }[]>({ n: "*" });
    expect(await requestPasswordReset({ email: `${unique("nobody")}@test.example` })).toEqual({ ok: true });
    const after = await db()("password_resets").count<{ n: string }[]>({ n: "*" });
    expect(after[0].n).toBe(before[0].n);
  });
});
