import type { Knex } from "knex";

/**
 * Design or finite-element modes of an asset (issue 6 §4), to compare with the measured
 * tracked modes: label, frequency, optional direction, optional shape at the sensor channels
 * (by channel code), an optional explicit link to a tracked mode and a note on the source.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("design_modes", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("asset_id").notNullable().references("id").inTable("assets").onDelete("CASCADE");
    t.text("label").notNullable();
    t.double("frequency_hz").notNullable();
    t.text("direction").nullable();
    t.jsonb("shape").nullable();
    t.uuid("tracked_mode_id").nullable().references("id").inTable("tracked_modes").onDelete("SET NULL");
    t.text("source_note").nullable();
    t.uuid("created_by").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["asset_id", "label"], { indexName: "design_modes_asset_label_unique" });
  });
  await knex.raw(`alter table design_modes
    add constraint design_modes_frequency_positive check (frequency_hz > 0),
    add constraint design_modes_direction_check check (direction is null or direction in ('vertical', 'lateral', 'torsional')),
    add constraint design_modes_label_length check (char_length(label) between 1 and 80),
    add constraint design_modes_note_length check (source_note is null or char_length(source_note) <= 300)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("design_modes");
}
