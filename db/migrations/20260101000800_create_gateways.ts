import type { Knex } from "knex";

/** Gateways upload records for one asset with a device key stored only as its SHA-256. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("gateways", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("asset_id").notNullable().references("id").inTable("assets").onDelete("CASCADE");
    t.text("name").notNullable();
    t.text("key_hash").notNullable().unique("gateways_key_hash_unique");
    t.text("key_prefix").notNullable();
    t.timestamp("last_seen_at", { useTz: true }).nullable();
    t.timestamp("revoked_at", { useTz: true }).nullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(["asset_id"], "gateways_asset_idx");
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("gateways");
}
