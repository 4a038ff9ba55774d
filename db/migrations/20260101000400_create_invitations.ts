import type { Knex } from "knex";

/**
 * Invitations by e-mail. Only the SHA-256 of the token is stored; at most one pending
 * (not accepted, not revoked) invitation per organisation and e-mail.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("invitations", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("organisation_id").notNullable().references("id").inTable("organisations").onDelete("CASCADE");
    t.text("email").notNullable();
    t.text("role").notNullable().checkIn(["admin", "engineer", "inspector", "owner"], "invitations_role_check");
    t.text("token_hash").notNullable().unique("invitations_token_hash_unique");
    t.uuid("invited_by_user_id").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.timestamp("expires_at", { useTz: true }).notNullable();
    t.timestamp("accepted_at", { useTz: true }).nullable();
    t.timestamp("revoked_at", { useTz: true }).nullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw("alter table invitations add constraint invitations_email_lower check (email = lower(email))");
  await knex.raw(
    "create unique index invitations_pending_unique on invitations (organisation_id, email) where accepted_at is null and revoked_at is null",
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("invitations");
}
