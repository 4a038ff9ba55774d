import type { Knex } from "knex";

/**
 * Modes an engineer follows on an asset: label, nominal frequency, search band and a
 * reference shape by channel code ({ "A1": 0.52, "A2": 1 }).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("tracked_modes", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("asset_id").notNullable().references("id").inTable("assets").onDelete("CASCADE");
    t.text("label").notNullable();
    t.double("nominal_frequency_hz").notNullable();
    t.double("band_low_hz").notNullable();
    t.double("band_high_hz").notNullable();
    t.jsonb("reference_shape").nullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["asset_id", "label"], { indexName: "tracked_modes_asset_label_unique" });
  });
  await knex.raw(`alter table tracked_modes
    add constraint tracked_modes_band_order check (band_low_hz > 0 and band_low_hz <= nominal_frequency_hz and nominal_frequency_hz <= band_high_hz and band_low_hz < band_high_hz),
    add constraint tracked_modes_label_length check (char_length(label) between 1 and 80)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("tracked_modes");
}
