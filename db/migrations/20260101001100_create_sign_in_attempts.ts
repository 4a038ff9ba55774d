import type { Knex } from "knex";

/** Sign-in attempts, for rate limiting failed sign-ins per e-mail and per client address. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("sign_in_attempts", (t) => {
    t.bigIncrements("id").primary();
    t.text("email").notNullable();
    t.text("ip").notNullable();
    t.boolean("succeeded").notNullable();
    t.timestamp("at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw("create index sign_in_attempts_email_at_idx on sign_in_attempts (email, at desc)");
  await knex.raw("create index sign_in_attempts_ip_at_idx on sign_in_attempts (ip, at desc)");
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("sign_in_attempts");
}
