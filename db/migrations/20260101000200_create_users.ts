import type { Knex } from "knex";

/** People who sign in. E-mail is stored lower-cased and unique; passwords as argon2id hashes. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("users", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.text("email").notNullable().unique("users_email_unique");
    t.text("password_hash").notNullable();
    t.text("display_name").notNullable();
    t.boolean("disabled").notNullable().defaultTo(false);
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw("alter table users add constraint users_email_lower check (email = lower(email) and position('@' in email) > 1)");
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("users");
}
