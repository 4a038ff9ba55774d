import type { Knex } from "knex";

/** Sensor channels of an asset; position in metres in the asset's frame; code unique per asset. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("sensor_channels", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("asset_id").notNullable().references("id").inTable("assets").onDelete("CASCADE");
    t.text("code").notNullable();
    t.double("position_x_m").notNullable().defaultTo(0);
    t.double("position_y_m").notNullable().defaultTo(0);
    t.double("position_z_m").notNullable().defaultTo(0);
    t.text("direction").notNullable().checkIn(["x", "y", "z", "-x", "-y", "-z"], "sensor_channels_direction_check");
    t.text("quantity").notNullable().defaultTo("acceleration").checkIn(["acceleration", "force"], "sensor_channels_quantity_check");
    t.text("units").notNullable().defaultTo("m/s2");
    t.double("sensitivity").nullable();
    t.boolean("active").notNullable().defaultTo(true);
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["asset_id", "code"], { indexName: "sensor_channels_asset_code_unique" });
  });
  await knex.raw(`alter table sensor_channels
    add constraint sensor_channels_code_format check (code ~ '^[A-Za-z0-9][A-Za-z0-9_.-]{0,31}$'),
    add constraint sensor_channels_sensitivity_positive check (sensitivity is null or sensitivity > 0)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("sensor_channels");
}
