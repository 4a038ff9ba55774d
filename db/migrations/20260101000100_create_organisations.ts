import type { Knex } from "knex";

/** Organisations own every other row; the time zone is the one times are shown in. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("organisations", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.text("name").notNullable();
    t.text("time_zone").notNullable().defaultTo("UTC");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(
    "alter table organisations add constraint organisations_name_not_blank check (length(btrim(name)) > 0)",
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("organisations");
}
