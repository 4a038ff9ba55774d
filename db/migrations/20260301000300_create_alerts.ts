import type { Knex } from "knex";

const STATES = ["open", "acknowledged", "inspection_scheduled", "closed"];
const OUTCOMES = ["no_defect_found", "environmental_cause", "sensor_fault", "defect_found", "repaired"];
const list = (xs: string[]) => xs.map((x) => `'${x}'`).join(", ");

/**
 * Alerts of an asset (PRODUCT.md lifecycle): raised by the drift replay with an evidence
 * snapshot; one alert per (asset, raise time), so a replay never raises the same one twice.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("alerts", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("asset_id").notNullable().references("id").inTable("assets").onDelete("CASCADE");
    t.text("state").notNullable().defaultTo("open");
    t.text("outcome").nullable();
    t.timestamp("raised_at", { useTz: true }).notNullable();
    t.jsonb("evidence").notNullable();
    t.uuid("assignee_user_id").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.timestamp("inspection_at", { useTz: true }).nullable();
    t.timestamp("closed_at", { useTz: true }).nullable();
    t.text("findings").nullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["asset_id", "raised_at"], { indexName: "alerts_asset_raised_unique" });
    t.index(["state", "raised_at"], "alerts_state_raised_idx");
  });
  await knex.raw(`alter table alerts
    add constraint alerts_state_check check (state in (${list(STATES)})),
    add constraint alerts_outcome_check check (outcome is null or outcome in (${list(OUTCOMES)})),
    add constraint alerts_closed_consistent check ((state = 'closed') = (outcome is not null and closed_at is not null))`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("alerts");
}
