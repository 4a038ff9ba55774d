import type { Knex } from "knex";

/**
 * An organisation's own serviceability values (issue 6 §3): a national annex or the owner's
 * procedure may replace a recommended value. One row per (organisation, key); keys are those
 * of lib/serviceability/values.ts, checked by the service.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("serviceability_overrides", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("organisation_id").notNullable().references("id").inTable("organisations").onDelete("CASCADE");
    t.text("key").notNullable();
    t.double("value").notNullable();
    t.text("note").nullable();
    t.uuid("updated_by").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["organisation_id", "key"], { indexName: "serviceability_overrides_org_key_unique" });
  });
  await knex.raw(`alter table serviceability_overrides
    add constraint serviceability_overrides_key_format check (key ~ '^[a-z0-9_.]{1,80}$'),
    add constraint serviceability_overrides_note_length check (note is null or char_length(note) <= 300)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("serviceability_overrides");
}
