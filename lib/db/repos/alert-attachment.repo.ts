import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";

/** A finding attached to an alert; the bytes are in the blob store under `blobKey`. */
export interface AlertAttachment {
  id: string;
  alertId: string;
  blobKey: string;
  filename: string;
  contentType: string;
  sizeBytes: number;
  uploadedByUserId: string | null;
  createdAt: Date;
}

const COLS = ["id", "alert_id", "blob_key", "filename", "content_type", "size_bytes", "uploaded_by", "created_at"] as const;

interface AttachmentRow {
  id: string; alert_id: string; blob_key: string; filename: string; content_type: string;
  size_bytes: string | number; uploaded_by: string | null; created_at: Date;
}

const toAttachment = (r: AttachmentRow): AlertAttachment => ({
  id: r.id, alertId: r.alert_id, blobKey: r.blob_key, filename: r.filename, contentType: r.content_type,
  sizeBytes: Number(r.size_bytes), uploadedByUserId: r.uploaded_by, createdAt: r.created_at,
});

export async function insertAlertAttachment(
  db: Db, a: { id: string; alertId: string; blobKey: string; filename: string; contentType: string; sizeBytes: number; uploadedByUserId: string },
): Promise<AlertAttachment> {
  const [row] = await withDbErrors(() =>
    db("alert_attachments").insert({
      id: a.id, alert_id: a.alertId, blob_key: a.blobKey, filename: a.filename, content_type: a.contentType,
      size_bytes: a.sizeBytes, uploaded_by: a.uploadedByUserId,
    }).returning(COLS),
  );
  return toAttachment(row as AttachmentRow);
}

/** Attachments of one alert, oldest first. */
export async function listAlertAttachments(db: Db, alertId: string): Promise<AlertAttachment[]> {
  const rows = await withDbErrors(() =>
    db("alert_attachments").select(...COLS).where({ alert_id: alertId }).orderBy([{ column: "created_at" }, { column: "id" }]),
  );
  return (rows as AttachmentRow[]).map(toAttachment);
}

/** One attachment of one alert (null when the id belongs to another alert). */
export async function findAlertAttachment(db: Db, alertId: string, id: string): Promise<AlertAttachment | null> {
  const row = await withDbErrors(() => db("alert_attachments").select(...COLS).where({ alert_id: alertId, id }).first());
  return row ? toAttachment(row as AttachmentRow) : null;
}
