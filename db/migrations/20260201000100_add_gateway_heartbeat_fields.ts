import type { Knex } from "knex";

/** Heartbeats: the gateway's firmware, its clock offset against the server and when it last reported. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("gateways", (t) => {
    t.text("firmware_version").nullable();
    t.double("clock_offset_ms").nullable();
    t.timestamp("last_heartbeat_at", { useTz: true }).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("gateways", (t) => {
    t.dropColumn("firmware_version");
    t.dropColumn("clock_offset_ms");
    t.dropColumn("last_heartbeat_at");
  });
}
