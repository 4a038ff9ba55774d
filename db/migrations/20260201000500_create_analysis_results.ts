import type { Knex } from "knex";

/**
 * One analysis of a record with one settings version; a retry or a reprocess with the same
 * version replaces it (upsert on the unique key), a new version adds a row.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("analysis_results", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("record_id").notNullable().references("id").inTable("records").onDelete("CASCADE");
    t.integer("settings_version").notNullable();
    t.text("verdict").notNullable();
    t.jsonb("quality").notNullable();
    t.specificType("channels_used", "text[]").notNullable();
    t.jsonb("spectral").notNullable();
    t.jsonb("singular_values").notNullable();
    t.jsonb("warnings").notNullable().defaultTo("[]");
    t.jsonb("timings_ms").notNullable().defaultTo("{}");
    t.text("engine_version").notNullable();
    t.timestamp("analysed_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["record_id", "settings_version"], { indexName: "analysis_results_record_version_unique" });
  });
  await knex.raw(
    "alter table analysis_results add constraint analysis_results_verdict_check check (verdict in ('accept', 'accept_without', 'reject'))",
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("analysis_results");
}
