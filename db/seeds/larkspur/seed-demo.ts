/**
 * Upsert the Larkspur demo organisation. Idempotent: stable ids and `onConflict().merge()`
 * of the descriptive columns only, so a second run changes no row (passwords are set on
 * first insert, asset conditions are left to the pipeline once it runs).
 */
import { createHash } from "node:crypto";
import type { Knex } from "knex";
import { env } from "../../../lib/config/env";
import { hashPassword } from "../../../lib/auth/passwords";
import { GATEWAY_KEY_PREFIX, hashSecret } from "../../../lib/auth/tokens";
import { DEMO_ORGANISATION, DEMO_SIGN_INS } from "../demo-users";
import { DEMO_ASSETS, DEMO_USER_IDS } from "./data";
import { seedDemoBaselines } from "./demo-baselines";
import { seedDemoDesign } from "./demo-design";
import { seedDemoHistory } from "./demo-history";

/**
 * Deterministic demo gateway keys (so the gateway simulator can upload to the demo
 * assets). Demo databases only: the seed refuses to run in production without demo mode.
 */
export function demoGatewayKey(slug: string): string {
  return GATEWAY_KEY_PREFIX + createHash("sha256").update(`larkspur-demo-gateway:${slug}`).digest("base64url");
}

/** Demo gateway keys by asset id. */
export function demoGatewayKeys(): Record<string, string> {
  return Object.fromEntries(DEMO_ASSETS.map((a) => [a.id, demoGatewayKey(a.gateway.slug)]));
}

export function assertSeedAllowed(): void {
  const e = env();
  if (e.NODE_ENV === "production" && !e.MODEWARDEN_DEMO) {
    throw new Error("Refusing to seed demo data in production (set MODEWARDEN_DEMO=1 for a demo deployment).");
  }
}

export async function seedLarkspurDemo(knex: Knex): Promise<void> {
  assertSeedAllowed();
  const hashes = await Promise.all(DEMO_SIGN_INS.map((u) => hashPassword(u.password)));
  await knex.transaction(async (trx) => {
    await trx("organisations")
      .insert({ id: DEMO_ORGANISATION.id, name: DEMO_ORGANISATION.name, time_zone: DEMO_ORGANISATION.timeZone })
      .onConflict("id")
      .merge(["name", "time_zone"]);

    for (const [i, u] of DEMO_SIGN_INS.entries()) {
      const userId = DEMO_USER_IDS[u.role];
      await trx("users")
        .insert({ id: userId, email: u.email, password_hash: hashes[i], display_name: u.displayName })
        .onConflict("id")
        .merge(["email", "display_name"]);
      await trx("memberships")
        .insert({ user_id: userId, organisation_id: DEMO_ORGANISATION.id, role: u.role })
        .onConflict(["user_id", "organisation_id"])
        .merge(["role"]);
    }

    for (const a of DEMO_ASSETS) {
      await trx("assets")
        .insert({
          id: a.id, organisation_id: DEMO_ORGANISATION.id, name: a.name, kind: a.kind, latitude: a.latitude,
          longitude: a.longitude, material: a.material, main_dimension_m: a.mainDimensionM,
          expected_interval_min: a.expectedIntervalMin, condition: a.condition,
        })
        .onConflict("id")
        .merge(["name", "kind", "latitude", "longitude", "material", "main_dimension_m", "expected_interval_min"]);
      for (const c of a.channels) {
        await trx("sensor_channels")
          .insert({
            id: c.id, asset_id: a.id, code: c.code, position_x_m: c.positionM.x, position_y_m: c.positionM.y,
            position_z_m: c.positionM.z, direction: c.direction, quantity: "acceleration", units: "m/s2",
            sensitivity: 0.102, active: true,
          })
          .onConflict("id")
          .merge(["code", "position_x_m", "position_y_m", "position_z_m", "direction", "quantity", "units", "sensitivity"]);
      }
      const key = demoGatewayKey(a.gateway.slug);
      await trx("gateways")
        .insert({
          id: a.gateway.id, asset_id: a.id, name: a.gateway.name, key_hash: hashSecret(key),
          key_prefix: key.slice(0, GATEWAY_KEY_PREFIX.length + 6),
        })
        .onConflict("id")
        .merge(["name", "key_hash", "key_prefix"]);
    }
  });
  // About a year of analysed history per asset (skips what is already there).
  await seedDemoHistory(knex);
  // Design modes and serviceability inputs (after the tracked modes exist).
  await seedDemoDesign(knex);
  // Baselines on the first nine months, then the drift replay that sets each condition.
  await seedDemoBaselines(knex);
}
