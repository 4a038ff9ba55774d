import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/lib/db/knex";
import { AppError } from "@/lib/http/errors";
import { insertAsset } from "@/lib/db/repos/asset.repo";
import { insertChannel } from "@/lib/db/repos/sensor-channel.repo";
import { insertInvitation } from "@/lib/db/repos/invitation.repo";
import { insertUser } from "@/lib/db/repos/user.repo";
import { insertMembership } from "@/lib/db/repos/membership.repo";
import { insertGateway } from "@/lib/db/repos/gateway.repo";
import type { Organisation } from "@/lib/domain/types";
import { makeMember, makeOrg, unique, type TestMember } from "./support/factories";

let org: Organisation;
let other: Organisation;
let admin: TestMember;

const asset = (name: string) => ({
  name, kind: "tower" as const, latitude: 39, longitude: -104, material: null, mainDimensionM: 35, expectedIntervalMin: 30,
});
const channel = (code: string) => ({
  code, positionM: { x: 0, y: 0, z: 10 }, direction: "x" as const, quantity: "acceleration" as const, units: "m/s2",
  sensitivity: null, active: true,
});

beforeAll(async () => {
  org = await makeOrg();
  other = await makeOrg();
  admin = await makeMember(org, "admin");
});
afterAll(closeDb);

describe("repositories on PostgreSQL", () => {
  it("translate a duplicate e-mail (users_email_unique, 23505) into conflict on the email field", async () => {
    const p = insertUser(db(), { email: admin.email.toUpperCase(), passwordHash: "x", displayName: "Dup" });
    await expect(p).rejects.toThrow(AppError);
    await expect(p).rejects.toMatchObject({ code: "conflict", fieldErrors: { email: [expect.any(String)] } });
  });

  it("translate a duplicate asset name in one organisation into conflict, and allow it in another", async () => {
    const name = unique("Twin Tower");
    await insertAsset(db(), org.id, asset(name));
    await expect(insertAsset(db(), org.id, asset(name))).rejects.toMatchObject({ code: "conflict", fieldErrors: { name: [expect.any(String)] } });
    await expect(insertAsset(db(), other.id, asset(name))).resolves.toMatchObject({ name, organisationId: other.id });
  });

  it("translate a duplicate channel code on one asset into conflict", async () => {
    const a = await insertAsset(db(), org.id, asset(unique("Mast")));
    await insertChannel(db(), a.id, channel("A1"));
    await expect(insertChannel(db(), a.id, channel("A1"))).rejects.toMatchObject({ code: "conflict", fieldErrors: { code: [expect.any(String)] } });
  });

  it("translate a second membership of the same user (primary key) into conflict", async () => {
    await expect(insertMembership(db(), { userId: admin.userId, organisationId: org.id, role: "owner" })).rejects.toMatchObject({ code: "conflict" });
  });

  it("translate a second pending invitation to one e-mail into conflict", async () => {
    const email = `${unique("inv")}@test.example`;
    const base = { organisationId: org.id, email, role: "inspector" as const, invitedByUserId: admin.userId, expiresAt: new Date(Date.now() + 86_400_000) };
    await insertInvitation(db(), { ...base, tokenHash: unique("h1") });
    await expect(insertInvitation(db(), { ...base, tokenHash: unique("h2") })).rejects.toMatchObject({ code: "conflict" });
  });

  it("translate a reference to a missing asset (23503) into not_found", async () => {
    await expect(
      insertGateway(db(), { assetId: "00000000-0000-4000-8000-000000000000", name: "g", keyHash: unique("k"), keyPrefix: "mw_gw_x" }),
    ).rejects.toMatchObject({ code: "not_found" });
  });

  it("enforce the enum CHECK constraints in the schema itself", async () => {
    const bad = db()("assets").insert({ organisation_id: org.id, name: unique("Bad"), kind: "bridge", latitude: 0, longitude: 0 });
    await expect(bad).rejects.toMatchObject({ code: "23514" });
    const badRole = db()("memberships").insert({ user_id: admin.userId, organisation_id: other.id, role: "gateway" });
    await expect(badRole).rejects.toMatchObject({ code: "23514" });
  });
});
