/**
 * Operator tools and the gateway's view of itself: `cli gateway create` issues a working
 * device key once, `cli token create` a personal token with the membership's role, and
 * GET /api/v1/gateways/me tells a gateway its channels and tracked modes and nothing else.
 */
import { afterAll, describe, expect, it } from "vitest";
import * as meRoute from "@/app/api/v1/gateways/me/route";
import * as assetsRoute from "@/app/api/v1/assets/route";
import { closeDb, db } from "@/lib/db/knex";
import { hashSecret } from "@/lib/auth/tokens";
import { AppError } from "@/lib/http/errors";
import { createApiTokenAsOperator, createGatewayAsOperator } from "@/lib/services/ingest/operator.service";
import { insertMembership } from "@/lib/db/repos/membership.repo";
import { call, makeOrg } from "./support/factories";
import { CHANNELS, addTrackedMode, makeGatewayAsset } from "./support/uploads";

afterAll(async () => {
  await closeDb();
});

describe("operator tools", () => {
  it("creates a gateway whose key (stored only as its SHA-256) authenticates as a device", async () => {
    const g = await makeGatewayAsset();
    await addTrackedMode(g.asset.id, "first sway", 2.7, 0.1, [0.3, 0.6, 0.85, 1]);
    const { gateway, key } = await createGatewayAsOperator({ assetId: g.asset.id, name: "roof gateway" });
    expect(key.startsWith("mw_gw_")).toBe(true);
    const row = await db()("gateways").where({ id: gateway.id }).first("key_hash");
    expect(row.key_hash).toBe(hashSecret(key));
    const audit = await db()("audit_log").where({ subject_id: gateway.id }).first("action", "actor_user_id");
    expect(audit).toEqual({ action: "gateway.create", actor_user_id: null });
    const me = await call(meRoute.GET, { token: key });
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ gateway: { id: gateway.id, name: "roof gateway" }, asset: { id: g.asset.id } });
    expect((me.body.channels as { code: string }[]).map((c) => c.code)).toEqual(CHANNELS);
    expect(me.body.trackedModes).toEqual([expect.objectContaining({ label: "first sway", nominalFrequencyHz: 2.7 })]);
    await expect(createGatewayAsOperator({ assetId: "not-a-uuid", name: "x" })).rejects.toThrow(AppError);
  });

  it("answers 401 to GET /gateways/me without a device key or with a personal token", async () => {
    expect((await call(meRoute.GET, {})).status).toBe(401);
    const g = await makeGatewayAsset();
    const { token } = await createApiTokenAsOperator({ email: g.team.engineer.email });
    expect((await call(meRoute.GET, { token })).status).toBe(401);
  });

  it("issues a personal token with the membership's role, and asks for --org when the user has several", async () => {
    const g = await makeGatewayAsset();
    const out = await createApiTokenAsOperator({ email: g.team.owner.email.toUpperCase() });
    expect(out).toMatchObject({ organisationId: g.team.org.id, role: "owner" });
    const assets = await call(assetsRoute.GET, { token: out.token });
    expect(assets.status).toBe(200);
    expect((assets.body.assets as { id: string }[]).map((a) => a.id)).toContain(g.asset.id);
    const second = await makeOrg();
    await insertMembership(db(), { userId: g.team.owner.userId, organisationId: second.id, role: "engineer" });
    await expect(createApiTokenAsOperator({ email: g.team.owner.email })).rejects.toThrow(/--org/);
    const chosen = await createApiTokenAsOperator({ email: g.team.owner.email, organisationId: second.id });
    expect(chosen).toMatchObject({ organisationId: second.id, role: "engineer" });
    await expect(createApiTokenAsOperator({ email: "nobody@test.example" })).rejects.toThrow(AppError);
  });
});
