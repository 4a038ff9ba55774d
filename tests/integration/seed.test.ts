import { afterAll, afterEach, describe, expect, it } from "vitest";
import { closeDb, db } from "@/lib/db/knex";
import { resetEnvForTests } from "@/lib/config/env";
import { DEMO_ORGANISATION, DEMO_SIGN_INS, seed } from "@/db/seeds/demo-users";
import { DEMO_ASSETS } from "@/db/seeds/larkspur/data";
import { verifyCredentials } from "@/lib/services/accounts/account.service";

/** Every demo row, ordered, as plain JSON (timestamps included: a re-run must not touch them). */
async function snapshot() {
  const k = db();
  const assetIds = DEMO_ASSETS.map((a) => a.id);
  return JSON.parse(JSON.stringify({
    org: await k("organisations").select("id", "name", "time_zone", "created_at", "updated_at").where({ id: DEMO_ORGANISATION.id }),
    users: await k("users").select("id", "email", "password_hash", "display_name", "disabled", "created_at", "updated_at")
      .whereIn("email", DEMO_SIGN_INS.map((u) => u.email)).orderBy("id"),
    memberships: await k("memberships").select("user_id", "organisation_id", "role", "created_at").where({ organisation_id: DEMO_ORGANISATION.id }).orderBy("user_id"),
    assets: await k("assets").select("id", "name", "kind", "latitude", "longitude", "material", "main_dimension_m", "expected_interval_min", "condition", "created_at", "updated_at")
      .where({ organisation_id: DEMO_ORGANISATION.id }).orderBy("id"),
    channels: await k("sensor_channels").select("id", "asset_id", "code", "position_x_m", "position_y_m", "position_z_m", "direction", "quantity", "units", "sensitivity", "active", "created_at", "updated_at")
      .whereIn("asset_id", assetIds).orderBy("id"),
    gateways: await k("gateways").select("id", "asset_id", "name", "key_hash", "key_prefix", "last_seen_at", "revoked_at", "created_at")
      .whereIn("asset_id", assetIds).orderBy("id"),
  }));
}

const saved = { NODE_ENV: process.env.NODE_ENV, MODEWARDEN_DEMO: process.env.MODEWARDEN_DEMO, NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET };
afterEach(() => {
  for (const [k, v] of Object.entries(saved)) {
    if (v === undefined) delete process.env[k];
    else process.env[k] = v;
  }
  resetEnvForTests();
});
afterAll(closeDb);

describe("the demo seed", () => {
  it("gives the same rows when run twice", async () => {
    await seed(db());
    const first = await snapshot();
    await seed(db());
    expect(await snapshot()).toEqual(first);
  });

  it("creates the PRODUCT.md demo portfolio: five assets, 4–8 channels and one gateway each, one user per role", async () => {
    await seed(db());
    const s = await snapshot();
    expect(s.assets.map((a: { name: string }) => a.name).sort()).toEqual([
      "Carrow Hill Telecom Mast", "Fernbrook Timber Footbridge", "Heron Reach Cable-Stayed Footbridge",
      "Millrace Footbridge", "Quarry Lane Lighting Tower",
    ]);
    for (const a of s.assets as { id: string }[]) {
      const n = s.channels.filter((c: { asset_id: string }) => c.asset_id === a.id).length;
      expect(n).toBeGreaterThanOrEqual(4);
      expect(n).toBeLessThanOrEqual(8);
      expect(s.gateways.filter((g: { asset_id: string }) => g.asset_id === a.id)).toHaveLength(1);
    }
    expect(s.memberships.map((m: { role: string }) => m.role).sort()).toEqual(["admin", "engineer", "inspector", "owner"]);
  });

  it("lets every demo user sign in with the password it exports", async () => {
    await seed(db());
    for (const u of DEMO_SIGN_INS) {
      const v = await verifyCredentials({ email: u.email, password: u.password, ip: "198.51.100.7" });
      expect(v.memberships).toEqual([{ organisationId: DEMO_ORGANISATION.id, organisationName: DEMO_ORGANISATION.name, role: u.role }]);
    }
  });

  it("refuses to run with NODE_ENV=production unless MODEWARDEN_DEMO=1", async () => {
    Object.assign(process.env, { NODE_ENV: "production", MODEWARDEN_DEMO: "0", NEXTAUTH_SECRET: "a-production-secret-for-this-test" });
    resetEnvForTests();
    await expect(seed(db())).rejects.toThrow(/production/);
    process.env.MODEWARDEN_DEMO = "1";
    resetEnvForTests();
    await expect(seed(db())).resolves.toBeUndefined();
  });
});
