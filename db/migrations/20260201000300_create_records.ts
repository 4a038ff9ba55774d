import type { Knex } from "knex";

const RECORD_STATUSES = ["received", "queued", "analysing", "analysed", "rejected", "failed"] as const;

/**
 * Uploaded ambient records: metadata, the raw samples' blob (content-addressed by SHA-256)
 * and the analysis status. One record per (gateway, gateway's own record id).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("records", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("organisation_id").notNullable().references("id").inTable("organisations").onDelete("CASCADE");
    t.uuid("asset_id").notNullable().references("id").inTable("assets").onDelete("CASCADE");
    t.uuid("gateway_id").notNullable().references("id").inTable("gateways").onDelete("CASCADE");
    t.text("gateway_record_id").notNullable();
    t.timestamp("started_at", { useTz: true }).notNullable();
    t.double("sample_rate_hz").notNullable();
    t.specificType("channels", "text[]").notNullable();
    t.text("units").notNullable();
    t.double("temperature_c").nullable();
    t.jsonb("environment").notNullable().defaultTo("{}");
    t.text("content_hash").notNullable();
    t.text("blob_key").notNullable();
    t.text("data_format").notNullable();
    t.bigInteger("byte_size").notNullable();
    t.integer("sample_count").notNullable();
    t.double("duration_s").notNullable();
    t.text("status").notNullable().defaultTo("received");
    t.double("progress").notNullable().defaultTo(0);
    t.text("failure_reason").nullable();
    t.integer("analysed_settings_version").nullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["gateway_id", "gateway_record_id"], { indexName: "records_gateway_record_unique" });
    t.index(["asset_id", "started_at"], "records_asset_started_idx");
    t.index(["status", "updated_at"], "records_status_idx");
    t.index(["content_hash"], "records_content_hash_idx");
  });
  await knex.raw(`alter table records
    add constraint records_status_check check (status in (${RECORD_STATUSES.map((s) => `'${s}'`).join(", ")})),
    add constraint records_units_check check (units in ('m/s2', 'g', 'mg')),
    add constraint records_data_format_check check (data_format in ('csv', 'f32le')),
    add constraint records_progress_range check (progress >= 0 and progress <= 1),
    add constraint records_sample_rate_positive check (sample_rate_hz > 0),
    add constraint records_content_hash_format check (content_hash ~ '^[0-9a-f]{64}$'),
    add constraint records_channels_nonempty check (cardinality(channels) >= 1),
    add constraint records_sizes_positive check (byte_size > 0 and sample_count > 0 and duration_s > 0)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("records");
}
