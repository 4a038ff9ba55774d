import type { Knex } from "knex";

/** Analysis settings of an asset, versioned: a change adds a version, results keep the one they used. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("analysis_settings", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("asset_id").notNullable().references("id").inTable("assets").onDelete("CASCADE");
    t.integer("version").notNullable();
    t.jsonb("settings").notNullable();
    t.uuid("created_by_user_id").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["asset_id", "version"], { indexName: "analysis_settings_asset_version_unique" });
  });
  await knex.raw("alter table analysis_settings add constraint analysis_settings_version_positive check (version >= 1)");
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("analysis_settings");
}
