import type { Knex } from "knex";

/**
 * Response levels of a record (issue 6 §2): per channel axis the peak |a|, the largest 1-s RMS
 * and the whole-record RMS in m/s² (lib/signal/response-levels), as JSON. One row per record,
 * in its own table rather than on analysis_results: the levels come from the raw samples and
 * do not change with the analysis settings version; a reanalysis overwrites the row.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("record_response_levels", (t) => {
    t.uuid("record_id").primary().references("id").inTable("records").onDelete("CASCADE");
    t.jsonb("levels").notNullable();
    t.timestamp("computed_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw("alter table record_response_levels add constraint record_response_levels_array check (jsonb_typeof(levels) = 'array')");
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("record_response_levels");
}
