import type { Knex } from "knex";

/** A user's role in one organisation; a user may belong to several organisations. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("memberships", (t) => {
    t.uuid("user_id").notNullable().references("id").inTable("users").onDelete("CASCADE");
    t.uuid("organisation_id").notNullable().references("id").inTable("organisations").onDelete("CASCADE");
    t.text("role").notNullable().checkIn(["admin", "engineer", "inspector", "owner"], "memberships_role_check");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(["user_id", "organisation_id"]);
    t.index(["organisation_id"], "memberships_organisation_idx");
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("memberships");
}
