import type { Knex } from "knex";

/**
 * For each analysis result, each tracked mode of the asset: the identified mode assigned to
 * it, or none (not identified). An identified mode is assigned at most once.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("mode_assignments", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("result_id").notNullable().references("id").inTable("analysis_results").onDelete("CASCADE");
    t.uuid("tracked_mode_id").notNullable().references("id").inTable("tracked_modes").onDelete("CASCADE");
    t.uuid("identified_mode_id").nullable().references("id").inTable("identified_modes").onDelete("CASCADE");
    t.double("mac").nullable();
    t.double("frequency_deviation").nullable();
    t.double("cost").nullable();
    t.unique(["result_id", "tracked_mode_id"], { indexName: "mode_assignments_result_tracked_unique" });
    t.unique(["identified_mode_id"], { indexName: "mode_assignments_identified_unique" });
    t.index(["tracked_mode_id"], "mode_assignments_tracked_idx");
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("mode_assignments");
}
