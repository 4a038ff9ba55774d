import type { Knex } from "knex";

/**
 * Per-user, per-asset e-mail opt-out: a muted asset sends that user no alert e-mails (raise,
 * assignment, closure). No row means not muted.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("notification_preferences", (t) => {
    t.uuid("user_id").notNullable().references("id").inTable("users").onDelete("CASCADE");
    t.uuid("asset_id").notNullable().references("id").inTable("assets").onDelete("CASCADE");
    t.boolean("muted").notNullable().defaultTo(false);
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(["user_id", "asset_id"], { constraintName: "notification_preferences_pkey" });
    t.index(["asset_id"], "notification_preferences_asset_idx");
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("notification_preferences");
}
