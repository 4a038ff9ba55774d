import type { Knex } from "knex";

/**
 * Personal API tokens: act as their owner in one organisation with the owner's current role
 * there (looked up on each use). Only the SHA-256 of the token is stored.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("api_tokens", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("user_id").notNullable().references("id").inTable("users").onDelete("CASCADE");
    t.uuid("organisation_id").notNullable().references("id").inTable("organisations").onDelete("CASCADE");
    t.text("name").notNullable();
    t.text("token_hash").notNullable().unique("api_tokens_token_hash_unique");
    t.text("prefix").notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("last_used_at", { useTz: true }).nullable();
    t.timestamp("revoked_at", { useTz: true }).nullable();
    t.index(["user_id", "organisation_id"], "api_tokens_user_org_idx");
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("api_tokens");
}
