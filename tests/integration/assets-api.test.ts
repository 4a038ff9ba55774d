import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/lib/db/knex";
import * as assetsRoute from "@/app/api/v1/assets/route";
import * as assetRoute from "@/app/api/v1/assets/[assetId]/route";
import * as channelsRoute from "@/app/api/v1/assets/[assetId]/channels/route";
import * as channelRoute from "@/app/api/v1/assets/[assetId]/channels/[channelId]/route";
import * as gatewaysRoute from "@/app/api/v1/assets/[assetId]/gateways/route";
import * as gatewayRoute from "@/app/api/v1/assets/[assetId]/gateways/[gatewayId]/route";
import { hashSecret } from "@/lib/auth/tokens";
import { revokeApiToken } from "@/lib/services/accounts/api-token.service";
import { createAsset } from "@/lib/services/assets/asset.service";
import { createGateway } from "@/lib/services/assets/gateway.service";
import type { Asset } from "@/lib/domain/types";
import { call, makeTeam, sessionCookieFor, tokenFor, unique, validAsset, type TestMember } from "./support/factories";

type Team = Awaited<ReturnType<typeof makeTeam>>;
let team: Team;
let foreign: Team;
let tokens: Record<"admin" | "engineer" | "inspector" | "owner", string>;
let foreignToken: string;
let asset: Asset;
let foreignAsset: Asset;

beforeAll(async () => {
  [team, foreign] = await Promise.all([makeTeam(), makeTeam()]);
  tokens = {
    admin: await tokenFor(team.admin), engineer: await tokenFor(team.engineer),
    inspector: await tokenFor(team.inspector), owner: await tokenFor(team.owner),
  };
  foreignToken = await tokenFor(foreign.admin);
  asset = await createAsset(team.engineer.actor, validAsset());
  foreignAsset = await createAsset(foreign.engineer.actor, validAsset());
});
afterAll(closeDb);

const channel = (code: string) => ({ code, positionM: { x: 5, y: 0, z: 0 }, direction: "z" });

describe("GET /api/v1/assets", () => {
  it("answers 401 without a session or token", async () => {
    const r = await call(assetsRoute.GET);
    expect(r.status).toBe(401);
    expect(r.body).toMatchObject({ error: { code: "unauthorized" } });
  });

  it("answers 401 to an unknown, a revoked or a gateway key in place of a personal token", async () => {
    expect((await call(assetsRoute.GET, { token: "mw_pat_notatoken" })).status).toBe(401);
    const { key } = await createGateway(team.admin.actor, asset.id, { name: unique("gw") });
    expect((await call(assetsRoute.GET, { token: key })).status).toBe(401);
    const t = await tokenFor(team.owner);
    const list = await call(assetsRoute.GET, { token: t });
    expect(list.status).toBe(200);
    const { listApiTokens } = await import("@/lib/services/accounts/api-token.service");
    const mine = (await listApiTokens(team.owner.actor)).find((x) => t.startsWith(x.prefix));
    await revokeApiToken(team.owner.actor, { id: mine!.id });
    expect((await call(assetsRoute.GET, { token: t })).status).toBe(401);
  });

  it("lists only the organisation's own assets, as AssetSummary JSON, to every role", async () => {
    for (const role of ["admin", "engineer", "inspector", "owner"] as const) {
      const r = await call(assetsRoute.GET, { token: tokens[role] });
      expect(r.status).toBe(200);
      const list = r.body.assets as { id: string; updatedAt: string; channelCount: number; openAlertCount: number }[];
      expect(list.map((a) => a.id)).toContain(asset.id);
      expect(list.map((a) => a.id)).not.toContain(foreignAsset.id);
      const mine = list.find((a) => a.id === asset.id)!;
      expect(new Date(mine.updatedAt).toISOString()).toBe(mine.updatedAt);
      expect(mine).toMatchObject({ channelCount: 0, openAlertCount: 0, condition: "commissioning" });
    }
  });

  it("accepts the next-auth session cookie as well as a token", async () => {
    const r = await call(assetsRoute.GET, { cookie: await sessionCookieFor(team.inspector) });
    expect(r.status).toBe(200);
    expect((r.body.assets as { id: string }[]).map((a) => a.id)).toContain(asset.id);
    expect((await call(assetsRoute.GET, { cookie: "next-auth.session-token=forged" })).status).toBe(401);
  });
});

describe("POST /api/v1/assets", () => {
  it("creates an asset for an engineer (201) and audits it", async () => {
    const r = await call(assetsRoute.POST, { method: "POST", token: tokens.engineer, body: validAsset() });
    expect(r.status).toBe(201);
    const created = r.body.asset as { id: string; organisationId: string };
    expect(created.organisationId).toBe(team.org.id);
    const audit = await db()("audit_log").select("action", "actor_user_id").where({ subject_id: created.id });
    expect(audit).toEqual([{ action: "asset.create", actor_user_id: team.engineer.userId }]);
  });

  it("answers 403 to an owner and an inspector (PRODUCT.md: they change nothing / field work only)", async () => {
    for (const role of ["owner", "inspector"] as const) {
      const r = await call(assetsRoute.POST, { method: "POST", token: tokens[role], body: validAsset() });
      expect(r.status).toBe(403);
    }
  });

  it("answers 422 with a field error under every bad field", async () => {
    const r = await call(assetsRoute.POST, {
      method: "POST", token: tokens.engineer, body: { name: "", kind: "bridge", latitude: 123, longitude: "x" },
    });
    expect(r.status).toBe(422);
    const fe = (r.body.error as { details: { fieldErrors: Record<string, string[]> } }).details.fieldErrors;
    expect(Object.keys(fe).sort()).toEqual(["kind", "latitude", "longitude", "name"]);
  });

  it("answers 409 with a field error for a name already used in the organisation", async () => {
    const r = await call(assetsRoute.POST, { method: "POST", token: tokens.engineer, body: validAsset(asset.name) });
    expect(r.status).toBe(409);
    expect(r.body).toMatchObject({ error: { code: "conflict", details: { fieldErrors: { name: [expect.any(String)] } } } });
  });

  it("answers 400 to a body that is not JSON and 415 to another media type", async () => {
    expect((await call(assetsRoute.POST, { method: "POST", token: tokens.engineer, rawBody: "{oops" })).status).toBe(400);
    expect((await call(assetsRoute.POST, { method: "POST", token: tokens.engineer, rawBody: "name=x", contentType: "text/plain" })).status).toBe(415);
  });
});

describe("GET and PATCH /api/v1/assets/:assetId", () => {
  it("answers 404 for another organisation's asset and for an id that is not a uuid", async () => {
    expect((await call(assetRoute.GET, { token: tokens.admin, params: { assetId: foreignAsset.id } })).status).toBe(404);
    expect((await call(assetRoute.GET, { token: tokens.admin, params: { assetId: "42" } })).status).toBe(404);
    const patch = await call(assetRoute.PATCH, { method: "PATCH", token: tokens.admin, params: { assetId: foreignAsset.id }, body: { name: "Mine now" } });
    expect(patch.status).toBe(404);
    expect((await call(assetRoute.GET, { token: foreignToken, params: { assetId: foreignAsset.id } })).status).toBe(200);
  });

  it("lets an engineer edit and refuses the owner (403)", async () => {
    const ok = await call(assetRoute.PATCH, { method: "PATCH", token: tokens.engineer, params: { assetId: asset.id }, body: { material: "Weathering steel", mainDimensionM: 31.5 } });
    expect(ok.status).toBe(200);
    expect(ok.body.asset).toMatchObject({ material: "Weathering steel", mainDimensionM: 31.5, name: asset.name });
    const no = await call(assetRoute.PATCH, { method: "PATCH", token: tokens.owner, params: { assetId: asset.id }, body: { material: "Paper" } });
    expect(no.status).toBe(403);
    const after = await call(assetRoute.GET, { token: tokens.owner, params: { assetId: asset.id } });
    expect((after.body.asset as { material: string }).material).toBe("Weathering steel");
  });

  it("answers 422 to an out-of-range latitude", async () => {
    const r = await call(assetRoute.PATCH, { method: "PATCH", token: tokens.engineer, params: { assetId: asset.id }, body: { latitude: -91 } });
    expect(r.status).toBe(422);
    expect(r.body).toMatchObject({ error: { details: { fieldErrors: { latitude: [expect.any(String)] } } } });
  });
});

describe("/api/v1/assets/:assetId/channels", () => {
  it("adds, lists, edits and deactivates channels for an engineer; codes stay unique (409)", async () => {
    const add = await call(channelsRoute.POST, { method: "POST", token: tokens.engineer, params: { assetId: asset.id }, body: channel("C1") });
    expect(add.status).toBe(201);
    const ch = add.body.channel as { id: string; units: string; active: boolean };
    expect(ch).toMatchObject({ units: "m/s2", active: true });
    const dup = await call(channelsRoute.POST, { method: "POST", token: tokens.engineer, params: { assetId: asset.id }, body: channel("C1") });
    expect(dup.status).toBe(409);
    const edit = await call(channelRoute.PATCH, { method: "PATCH", token: tokens.engineer, params: { assetId: asset.id, channelId: ch.id }, body: { direction: "-y" } });
    expect(edit.body.channel).toMatchObject({ direction: "-y", code: "C1" });
    const off = await call(channelRoute.DELETE, { method: "DELETE", token: tokens.engineer, params: { assetId: asset.id, channelId: ch.id } });
    expect(off.body.channel).toMatchObject({ active: false });
    const list = await call(channelsRoute.GET, { token: tokens.owner, params: { assetId: asset.id } });
    expect((list.body.channels as { id: string }[]).map((c) => c.id)).toContain(ch.id);
  });

  it("answers 401, 403, 404 and 422 at the role and organisation boundaries", async () => {
    expect((await call(channelsRoute.GET, { params: { assetId: asset.id } })).status).toBe(401);
    expect((await call(channelsRoute.POST, { method: "POST", token: tokens.inspector, params: { assetId: asset.id }, body: channel("C9") })).status).toBe(403);
    expect((await call(channelsRoute.GET, { token: tokens.owner, params: { assetId: foreignAsset.id } })).status).toBe(404);
    expect((await call(channelsRoute.POST, { method: "POST", token: tokens.engineer, params: { assetId: foreignAsset.id }, body: channel("C9") })).status).toBe(404);
    const bad = await call(channelsRoute.POST, { method: "POST", token: tokens.engineer, params: { assetId: asset.id }, body: { code: "no spaces", positionM: { x: "a", y: 0, z: 0 }, direction: "up" } });
    expect(bad.status).toBe(422);
    const fe = (bad.body.error as { details: { fieldErrors: Record<string, string[]> } }).details.fieldErrors;
    expect(Object.keys(fe).sort()).toEqual(["code", "direction", "positionM.x"]);
  });

  it("answers 404 for a channel of another asset addressed through this asset", async () => {
    const other = await createAsset(team.engineer.actor, validAsset());
    const add = await call(channelsRoute.POST, { method: "POST", token: tokens.engineer, params: { assetId: other.id }, body: channel("X1") });
    const id = (add.body.channel as { id: string }).id;
    const r = await call(channelRoute.PATCH, { method: "PATCH", token: tokens.engineer, params: { assetId: asset.id, channelId: id }, body: { units: "g" } });
    expect(r.status).toBe(404);
  });
});

describe("/api/v1/assets/:assetId/gateways", () => {
  it("creates a gateway for an admin with the key shown once and stored only as its SHA-256", async () => {
    const r = await call(gatewaysRoute.POST, { method: "POST", token: tokens.admin, params: { assetId: asset.id }, body: { name: "North gateway" } });
    expect(r.status).toBe(201);
    const key = r.body.key as string;
    const gw = r.body.gateway as { id: string; keyPrefix: string };
    expect(key.startsWith("mw_gw_")).toBe(true);
    expect(key.startsWith(gw.keyPrefix)).toBe(true);
    const row = await db()("gateways").select("key_hash").where({ id: gw.id }).first();
    expect(row.key_hash).toBe(hashSecret(key));
    const list = await call(gatewaysRoute.GET, { token: tokens.owner, params: { assetId: asset.id } });
    expect(JSON.stringify(list.body)).not.toContain(key);
    const revoked = await call(gatewayRoute.DELETE, { method: "DELETE", token: tokens.admin, params: { assetId: asset.id, gatewayId: gw.id } });
    expect((revoked.body.gateway as { revokedAt: string | null }).revokedAt).not.toBeNull();
  });

  it("refuses gateway keys to engineers (403: PRODUCT.md gives gateways and their keys to admins)", async () => {
    const r = await call(gatewaysRoute.POST, { method: "POST", token: tokens.engineer, params: { assetId: asset.id }, body: { name: "x" } });
    expect(r.status).toBe(403);
  });

  it("answers 404 for another organisation's asset or gateway and 422 for a missing name", async () => {
    expect((await call(gatewaysRoute.GET, { token: tokens.admin, params: { assetId: foreignAsset.id } })).status).toBe(404);
    const { gateway } = await createGateway(foreign.admin.actor, foreignAsset.id, { name: "theirs" });
    expect((await call(gatewayRoute.DELETE, { method: "DELETE", token: tokens.admin, params: { assetId: asset.id, gatewayId: gateway.id } })).status).toBe(404);
    expect((await call(gatewaysRoute.POST, { method: "POST", token: tokens.admin, params: { assetId: asset.id }, body: {} })).status).toBe(422);
  });
});

describe("role changes take effect at once", () => {
  it("uses the member's current role, not the one the token or cookie was issued with", async () => {
    const m: TestMember = team.engineer;
    const cookie = await sessionCookieFor(m);
    await db()("memberships").where({ user_id: m.userId, organisation_id: team.org.id }).update({ role: "owner" });
    try {
      const r = await call(assetsRoute.POST, { method: "POST", cookie, body: validAsset() });
      expect(r.status).toBe(403);
    } finally {
      await db()("memberships").where({ user_id: m.userId, organisation_id: team.org.id }).update({ role: "engineer" });
    }
  });
});
