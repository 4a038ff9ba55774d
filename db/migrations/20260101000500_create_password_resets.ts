import type { Knex } from "knex";

/** Password reset requests; only the SHA-256 of the token is stored, single use. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("password_resets", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("user_id").notNullable().references("id").inTable("users").onDelete("CASCADE");
    t.text("token_hash").notNullable().unique("password_resets_token_hash_unique");
    t.timestamp("expires_at", { useTz: true }).notNullable();
    t.timestamp("used_at", { useTz: true }).nullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(["user_id"], "password_resets_user_idx");
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("password_resets");
}
