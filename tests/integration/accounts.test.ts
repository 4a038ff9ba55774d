import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/lib/db/knex";
import { AppError } from "@/lib/http/errors";
import {
  SIGN_IN_LIMITS, listMemberships, resolveActor, switchOrganisation, verifyCredentials,
} from "@/lib/services/accounts/account.service";
import { actorFromApiToken, createApiToken, listApiTokens, revokeApiToken } from "@/lib/services/accounts/api-token.service";
import { changePassword } from "@/lib/services/accounts/profile.service";
import { insertMembership } from "@/lib/db/repos/membership.repo";
import { makeMember, makeOrg, makeTeam, PASSWORD, unique } from "./support/factories";

type Team = Awaited<ReturnType<typeof makeTeam>>;
let team: Team;
beforeAll(async () => {
  team = await makeTeam();
});
afterAll(closeDb);

const ip = () => `203.0.113.${Math.floor(Math.random() * 250) + 1}-${unique("t")}`;

describe("verifyCredentials", () => {
  it("answers the user and memberships for the right password, case-insensitively on the e-mail", async () => {
    const v = await verifyCredentials({ email: team.inspector.email.toUpperCase(), password: PASSWORD, ip: ip() });
    expect(v.userId).toBe(team.inspector.userId);
    expect(v.memberships).toEqual([{ organisationId: team.org.id, organisationName: team.org.name, role: "inspector" }]);
  });

  it("refuses a wrong password and an unknown e-mail with the same unauthorized error", async () => {
    const a = verifyCredentials({ email: team.owner.email, password: "wrong-password-123", ip: ip() });
    await expect(a).rejects.toThrow(AppError);
    await expect(a).rejects.toMatchObject({ code: "unauthorized", message: "E-mail or password is incorrect." });
    await expect(verifyCredentials({ email: "nobody@test.example", password: PASSWORD, ip: ip() }))
      .rejects.toMatchObject({ code: "unauthorized", message: "E-mail or password is incorrect." });
  });

  it("refuses a disabled account", async () => {
    const m = await makeMember(team.org, "owner");
    await db()("users").where({ id: m.userId }).update({ disabled: true });
    await expect(verifyCredentials({ email: m.email, password: PASSWORD, ip: ip() })).rejects.toMatchObject({ code: "unauthorized" });
  });

  it(`says too_many_requests after ${SIGN_IN_LIMITS.perEmail} failures for one e-mail, even with the right password`, async () => {
    const m = await makeMember(team.org, "owner");
    for (let i = 0; i < SIGN_IN_LIMITS.perEmail; i++) {
      await expect(verifyCredentials({ email: m.email, password: "wrong-password-123", ip: ip() })).rejects.toMatchObject({ code: "unauthorized" });
    }
    await expect(verifyCredentials({ email: m.email, password: PASSWORD, ip: ip() })).rejects.toMatchObject({ code: "too_many_requests" });
    // another account is not affected
    await expect(verifyCredentials({ email: team.admin.email, password: PASSWORD, ip: ip() })).resolves.toMatchObject({ userId: team.admin.userId });
  });

  it(`says too_many_requests after ${SIGN_IN_LIMITS.perAddress} failures from one address, whatever the e-mail`, async () => {
    const addr = ip();
    for (let i = 0; i < SIGN_IN_LIMITS.perAddress; i++) {
      await expect(verifyCredentials({ email: `${unique("guess")}@test.example`, password: "x-wrong-password", ip: addr })).rejects.toMatchObject({ code: "unauthorized" });
    }
    await expect(verifyCredentials({ email: team.engineer.email, password: PASSWORD, ip: addr })).rejects.toMatchObject({ code: "too_many_requests" });
  });

  it("counts failures only after the last success of the e-mail", async () => {
    const m = await makeMember(team.org, "owner");
    for (let i = 0; i < SIGN_IN_LIMITS.perEmail - 1; i++) {
      await expect(verifyCredentials({ email: m.email, password: "wrong-password-123", ip: ip() })).rejects.toThrow(AppError);
    }
    await verifyCredentials({ email: m.email, password: PASSWORD, ip: ip() });
    await expect(verifyCredentials({ email: m.email, password: "wrong-password-123", ip: ip() })).rejects.toMatchObject({ code: "unauthorized" });
    await expect(verifyCredentials({ email: m.email, password: PASSWORD, ip: ip() })).resolves.toMatchObject({ userId: m.userId });
  });
});

describe("memberships in several organisations", () => {
  it("lists both and switches only into an organisation the user belongs to", async () => {
    const second = await makeOrg();
    await insertMembership(db(), { userId: team.engineer.userId, organisationId: second.id, role: "owner" });
    const list = await listMemberships(team.engineer.userId);
    expect(list.map((m) => m.organisationId).sort()).toEqual([team.org.id, second.id].sort());
    expect(await switchOrganisation(team.engineer.userId, second.id)).toMatchObject({ role: "owner" });
    const stranger = await makeOrg();
    await expect(switchOrganisation(team.engineer.userId, stranger.id)).rejects.toMatchObject({ code: "not_found" });
    expect(await resolveActor(team.engineer.userId, second.id, "session")).toMatchObject({ role: "owner" });
    expect(await resolveActor(team.engineer.userId, stranger.id, "session")).toBeNull();
  });
});

describe("personal API tokens", () => {
  it("act as their owner with the owner's role, and stop after revocation", async () => {
    const { token, apiToken } = await createApiToken(team.inspector.actor, { name: "script" });
    expect(token.startsWith(apiToken.prefix)).toBe(true);
    expect(await actorFromApiToken(token)).toEqual({ ...team.inspector.actor, via: "token" });
    const stored = await db()("api_tokens").select("token_hash").where({ id: apiToken.id }).first();
    expect(stored.token_hash).not.toContain(token.slice(7));
    await revokeApiToken(team.inspector.actor, { id: apiToken.id });
    expect(await actorFromApiToken(token)).toBeNull();
  });

  it("cannot be listed or revoked by another user (404)", async () => {
    const { apiToken } = await createApiToken(team.owner.actor, { name: "mine" });
    expect((await listApiTokens(team.admin.actor)).map((t) => t.id)).not.toContain(apiToken.id);
    await expect(revokeApiToken(team.admin.actor, { id: apiToken.id })).rejects.toMatchObject({ code: "not_found" });
  });

  it("stop working when the owner leaves the organisation", async () => {
    const m = await makeMember(team.org, "engineer");
    const { token } = await createApiToken(m.actor, { name: "leaver" });
    await db()("memberships").where({ user_id: m.userId }).del();
    expect(await actorFromApiToken(token)).toBeNull();
  });
});

describe("changePassword", () => {
  it("needs the current password (field error) and then accepts only the new one", async () => {
    const m = await makeMember(team.org, "owner");
    await expect(changePassword(m.actor, { currentPassword: "not-the-password", newPassword: "a-brand-new-password" }))
      .rejects.toMatchObject({ code: "unprocessable", fieldErrors: { currentPassword: [expect.any(String)] } });
    await changePassword(m.actor, { currentPassword: PASSWORD, newPassword: "a-brand-new-password" });
    await expect(verifyCredentials({ email: m.email, password: "a-brand-new-password", ip: ip() })).resolves.toMatchObject({ userId: m.userId });
    const audit = await db()("audit_log").where({ subject_id: m.userId, action: "user.password_change" }).count<{ n: string }[]>({ n: "*" });
    expect(Number(audit[0].n)).toBe(1);
  });
});
