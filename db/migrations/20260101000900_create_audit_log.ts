import type { Knex } from "knex";

/** Append-only audit trail of every change, per organisation; keyset-paged by (at, id). */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("audit_log", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("organisation_id").notNullable().references("id").inTable("organisations").onDelete("CASCADE");
    t.uuid("actor_user_id").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.text("action").notNullable();
    t.text("subject_type").notNullable();
    t.uuid("subject_id").nullable();
    t.jsonb("details").notNullable().defaultTo(knex.raw("'{}'::jsonb"));
    t.timestamp("at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw("create index audit_log_organisation_at_idx on audit_log (organisation_id, at desc, id desc)");
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("audit_log");
}
