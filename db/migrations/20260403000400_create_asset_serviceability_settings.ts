import type { Knex } from "knex";

/**
 * Per-asset inputs of the serviceability checks (issue 6 §5), set by engineers: the
 * cross-wind section width b for vortex shedding (towers, masts, chimneys) and the damping
 * guidance row (Table F.2 type or footbridge deck material) when the guess from the
 * asset's material words is wrong.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("asset_serviceability_settings", (t) => {
    t.uuid("asset_id").primary().references("id").inTable("assets").onDelete("CASCADE");
    t.double("section_width_m").nullable();
    t.text("damping_guidance_key").nullable();
    t.uuid("updated_by").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`alter table asset_serviceability_settings
    add constraint asset_serviceability_width_positive check (section_width_m is null or section_width_m > 0)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("asset_serviceability_settings");
}
