import type { Knex } from "knex";

/** Monitored structures. Coordinates in WGS84 degrees, dimensions in metres. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("assets", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("organisation_id").notNullable().references("id").inTable("organisations").onDelete("CASCADE");
    t.text("name").notNullable();
    t.text("kind")
      .notNullable()
      .checkIn(["footbridge", "pedestrian_bridge", "tower", "mast", "chimney", "other"], "assets_kind_check");
    t.double("latitude").notNullable();
    t.double("longitude").notNullable();
    t.text("material").nullable();
    t.double("main_dimension_m").nullable();
    t.integer("expected_interval_min").notNullable().defaultTo(60);
    t.text("condition")
      .notNullable()
      .defaultTo("commissioning")
      .checkIn(["commissioning", "steady", "watch", "alert", "silent"], "assets_condition_check");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["organisation_id", "name"], { indexName: "assets_organisation_name_unique" });
  });
  await knex.raw(`alter table assets
    add constraint assets_latitude_range check (latitude between -90 and 90),
    add constraint assets_longitude_range check (longitude between -180 and 180),
    add constraint assets_main_dimension_positive check (main_dimension_m is null or main_dimension_m > 0),
    add constraint assets_expected_interval_positive check (expected_interval_min > 0),
    add constraint assets_name_not_blank check (length(btrim(name)) > 0)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("assets");
}
