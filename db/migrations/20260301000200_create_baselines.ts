import type { Knex } from "knex";

/**
 * Versioned baselines of an asset (issue 5 §2): a training window, per tracked mode the
 * fitted model (lib/stats BaselineModel as JSON), a status, and which version is active.
 * Earlier versions stay for comparison; at most one version per asset is active.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("baselines", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("asset_id").notNullable().references("id").inTable("assets").onDelete("CASCADE");
    t.integer("version").notNullable();
    t.timestamp("training_from", { useTz: true }).notNullable();
    t.timestamp("training_to", { useTz: true }).notNullable();
    t.text("status").notNullable();
    t.text("requested_model").notNullable().defaultTo("auto");
    t.jsonb("models").notNullable();
    t.uuid("created_by").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.boolean("active").notNullable().defaultTo(false);
    t.unique(["asset_id", "version"], { indexName: "baselines_asset_version_unique" });
  });
  await knex.raw(`alter table baselines
    add constraint baselines_status_check check (status in ('provisional', 'complete', 'superseded')),
    add constraint baselines_requested_model_check check (requested_model in ('auto', 'linear', 'bilinear')),
    add constraint baselines_version_positive check (version >= 1),
    add constraint baselines_window_order check (training_from < training_to)`);
  await knex.raw("create unique index baselines_one_active on baselines (asset_id) where active");
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("baselines");
}
