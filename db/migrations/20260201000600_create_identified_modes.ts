import type { Knex } from "knex";

/** Modes identified in one analysis result, ascending in frequency; shapes by channel code. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("identified_modes", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("result_id").notNullable().references("id").inTable("analysis_results").onDelete("CASCADE");
    t.integer("mode_index").notNullable();
    t.double("frequency_hz").notNullable();
    t.double("damping_ratio").nullable();
    t.text("damping_method").nullable();
    t.boolean("damping_reliable").notNullable();
    t.double("mpc").notNullable();
    t.jsonb("shape").notNullable();
    t.jsonb("shape_complex").notNullable();
    t.jsonb("estimates").notNullable();
    t.boolean("possibly_coupled").notNullable().defaultTo(false);
    t.unique(["result_id", "mode_index"], { indexName: "identified_modes_result_index_unique" });
  });
  await knex.raw(`alter table identified_modes
    add constraint identified_modes_frequency_positive check (frequency_hz > 0),
    add constraint identified_modes_damping_method_check check (damping_method is null or damping_method in ('efdd', 'half-power', 'ssi-cov')),
    add constraint identified_modes_mpc_range check (mpc >= 0 and mpc <= 1.000001)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("identified_modes");
}
