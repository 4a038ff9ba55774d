import type { Knex } from "knex";

/**
 * Tracked modes are deactivated rather than deleted (their assignments stay as history), and
 * remember the record and mode they were taken from ("track this mode"), if any.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("tracked_modes", (t) => {
    t.boolean("active").notNullable().defaultTo(true);
    t.uuid("source_record_id").nullable().references("id").inTable("records").onDelete("SET NULL");
    t.integer("source_mode_index").nullable();
  });
  await knex.raw("alter table tracked_modes add constraint tracked_modes_source_mode_index_nonnegative check (source_mode_index is null or source_mode_index >= 0)");
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw("alter table tracked_modes drop constraint if exists tracked_modes_source_mode_index_nonnegative");
  await knex.schema.alterTable("tracked_modes", (t) => {
    t.dropColumn("source_mode_index");
    t.dropColumn("source_record_id");
    t.dropColumn("active");
  });
}
