import type { Knex } from "knex";

/**
 * Modal estimates imported from an earlier monitoring system or a consultant (issue 5 §1):
 * one row per (tracked mode, time), marked with its source (`import:<sha256 of the file>`),
 * so re-importing the same file changes nothing.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("modal_estimates", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("asset_id").notNullable().references("id").inTable("assets").onDelete("CASCADE");
    t.uuid("tracked_mode_id").notNullable().references("id").inTable("tracked_modes").onDelete("CASCADE");
    t.timestamp("at", { useTz: true }).notNullable();
    t.double("frequency_hz").notNullable();
    t.double("damping_ratio").nullable();
    t.double("temperature_c").nullable();
    t.text("source").notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["asset_id", "tracked_mode_id", "at", "source"], { indexName: "modal_estimates_natural_unique" });
    t.index(["asset_id", "at"], "modal_estimates_asset_at_idx");
  });
  await knex.raw(`alter table modal_estimates
    add constraint modal_estimates_frequency_positive check (frequency_hz > 0),
    add constraint modal_estimates_damping_range check (damping_ratio is null or (damping_ratio >= 0 and damping_ratio < 1)),
    add constraint modal_estimates_source_length check (char_length(source) between 1 and 200)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("modal_estimates");
}
