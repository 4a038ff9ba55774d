import type { Knex } from "knex";

/**
 * Findings attached to an alert (photos and PDFs, PRODUCT.md lifecycle step 6): the bytes
 * live in the blob store under `blob_key`; the row keeps the name, the sniffed content type,
 * the size and who uploaded it. The alert event kind `attachment` records each upload.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("alert_attachments", (t) => {
    t.uuid("id").primary().defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("alert_id").notNullable().references("id").inTable("alerts").onDelete("CASCADE");
    t.text("blob_key").notNullable();
    t.text("filename").notNullable();
    t.text("content_type").notNullable();
    t.bigInteger("size_bytes").notNullable();
    t.uuid("uploaded_by").nullable().references("id").inTable("users").onDelete("SET NULL");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["blob_key"], { indexName: "alert_attachments_blob_key_unique" });
    t.index(["alert_id", "created_at"], "alert_attachments_alert_created_idx");
  });
  await knex.raw(`alter table alert_attachments
    add constraint alert_attachments_content_type_check check (content_type in ('image/jpeg', 'image/png', 'image/webp', 'application/pdf')),
    add constraint alert_attachments_size_positive check (size_bytes > 0),
    add constraint alert_attachments_filename_length check (char_length(filename) between 1 and 200)`);
  // The alert history gains the kind `attachment`.
  await knex.raw("alter table alert_events drop constraint alert_events_kind_check");
  await knex.raw(`alter table alert_events add constraint alert_events_kind_check
    check (kind in ('raised', 'acknowledged', 'inspection_scheduled', 'assigned', 'comment', 'closed', 'attachment'))`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw("delete from alert_events where kind = 'attachment'");
  await knex.raw("alter table alert_events drop constraint alert_events_kind_check");
  await knex.raw(`alter table alert_events add constraint alert_events_kind_check
    check (kind in ('raised', 'acknowledged', 'inspection_scheduled', 'assigned', 'comment', 'closed'))`);
  await knex.schema.dropTable("alert_attachments");
}
