import type { Knex } from "knex";

/** The history of an alert: raise, acknowledge, schedule, assign, comment, close (who, when, what). */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("alert_events", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("alert_id").notNullable().references("id").inTable("alerts").onDelete("CASCADE");
    t.uuid("actor_user_id").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.text("kind").notNullable();
    t.jsonb("details").notNullable().defaultTo("{}");
    t.timestamp("at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(["alert_id", "at"], "alert_events_alert_at_idx");
  });
  await knex.raw(`alter table alert_events add constraint alert_events_kind_check
    check (kind in ('raised', 'acknowledged', 'inspection_scheduled', 'assigned', 'comment', 'closed'))`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("alert_events");
}
