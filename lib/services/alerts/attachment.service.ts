/**
 * Findings attached to an alert (PRODUCT.md lifecycle: "attach findings"): photos (JPEG, PNG,
 * WebP) and PDF reports. Those who work alerts (`alert:work`) attach; everyone of the
 * organisation reads. The type is decided from the file's first bytes (its magic number), not
 * from the name or the declared type; a file that is refused leaves nothing behind. Each
 * upload writes the alert event `attachment` and an audit entry in one transaction with the row.
 */
import { randomUUID } from "node:crypto";
import { db } from "@/lib/db/knex";
import { findAlertById } from "@/lib/db/repos/alert.repo";
import { insertAlertEvent } from "@/lib/db/repos/alert.repo";
import {
  findAlertAttachment, insertAlertAttachment, listAlertAttachments, type AlertAttachment,
} from "@/lib/db/repos/alert-attachment.repo";
import type { Actor } from "@/lib/domain/types";
import { AppError } from "@/lib/http/errors";
import { blobStore } from "@/lib/storage";
import { recordAudit } from "@/lib/services/audit/audit.service";
import { assertCan, assertSameOrg, isUuid } from "@/lib/services/authz";

export type { AlertAttachment };

/** Largest accepted attachment: 10 MiB (a phone photo or an inspection report). */
export const ATTACHMENT_MAX_BYTES = 10 * 1024 * 1024;

export const ATTACHMENT_TYPES = ["image/jpeg", "image/png", "image/webp", "application/pdf"] as const;
export type AttachmentType = (typeof ATTACHMENT_TYPES)[number];

const TYPE_NAMES: Record<AttachmentType, string> = {
  "image/jpeg": "JPEG image", "image/png": "PNG image", "image/webp": "WebP image", "application/pdf": "PDF document",
};

const startsWith = (b: Uint8Array, sig: number[], at = 0) => b.length >= at + sig.length && sig.every((v, i) => b[at + i] === v);
const ascii = (s: string) => [...s].map((c) => c.charCodeAt(0));

/**
 * The type of `bytes` from its signature, or null. Signatures: JPEG FF D8 FF (ISO/IEC 10918-1
 * SOI marker), PNG 89 50 4E 47 0D 0A 1A 0A (RFC 2083 §3.1), WebP "RIFF" size "WEBP" (RFC 9649
 * §2), PDF "%PDF-" (ISO 32000-1 §7.5.2).
 */
export function sniffAttachmentType(bytes: Uint8Array): AttachmentType | null {
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return "image/jpeg";
  if (startsWith(bytes, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return "image/png";
  if (startsWith(bytes, ascii("RIFF")) && startsWith(bytes, ascii("WEBP"), 8)) return "image/webp";
  if (startsWith(bytes, ascii("%PDF-"))) return "application/pdf";
  return null;
}

/** A file name safe to store and to send back: no folders, no control characters, ≤ 200 characters. */
function cleanFilename(name: string, type: AttachmentType): string {
  const base = (name.split(/[\\/]/).pop() ?? "").replace(/[\u0000-\u001f\u007f"]/g, "").trim().slice(-200);
  return base || `attachment.${type === "application/pdf" ? "pdf" : type.slice(6)}`;
}

const refuse = (code: "payload_too_large" | "unsupported_media_type" | "bad_request", message: string) =>
  new AppError(code, message, { fieldErrors: { file: [message] } });

async function loadOwnAlert(actor: Actor, alertId: string) {
  const alert = isUuid(alertId) ? await findAlertById(db(), alertId) : null;
  assertSameOrg(actor, alert, "alert");
  return alert;
}

/** Check a file against the rules; answers the sniffed type (throws AppError naming the rule). */
export function checkAttachment(file: { declaredType: string | null; bytes: Uint8Array }): AttachmentType {
  if (file.bytes.length === 0) throw refuse("bad_request", "The file is empty.");
  if (file.bytes.length > ATTACHMENT_MAX_BYTES) {
    throw refuse("payload_too_large", `The file is larger than the 10 MiB limit (${(file.bytes.length / 1048576).toFixed(1)} MiB).`);
  }
  const type = sniffAttachmentType(file.bytes);
  if (!type) throw refuse("unsupported_media_type", "Only JPEG, PNG or WebP photos and PDF documents can be attached (checked from the file's content).");
  const declared = (file.declaredType ?? "").split(";")[0].trim().toLowerCase();
  if (declared && declared !== "application/octet-stream" && declared !== type) {
    throw refuse("unsupported_media_type", `The file is declared as ${declared} but its content is a ${TYPE_NAMES[type]}.`);
  }
  return type;
}

/** Attach a file to an alert of the actor's organisation (closed alerts too: findings may come later). */
export async function addAlertAttachment(
  actor: Actor, alertId: string, file: { filename: string; declaredType: string | null; bytes: Uint8Array },
): Promise<AlertAttachment> {
  assertCan(actor, "alert:work");
  const alert = await loadOwnAlert(actor, alertId);
  const type = checkAttachment(file);
  const id = randomUUID();
  const blobKey = `alert-attachments/${alert.id}/${id}`;
  const store = blobStore();
  await store.put(blobKey, file.bytes);
  try {
    return await db().transaction(async (trx) => {
      const row = await insertAlertAttachment(trx, {
        id, alertId: alert.id, blobKey, filename: cleanFilename(file.filename, type), contentType: type,
        sizeBytes: file.bytes.length, uploadedByUserId: actor.userId,
      });
      const details = { attachmentId: row.id, filename: row.filename, contentType: row.contentType, sizeBytes: row.sizeBytes };
      await insertAlertEvent(trx, { alertId: alert.id, actorUserId: actor.userId, kind: "attachment", details });
      await recordAudit(trx, actor, { action: "alert.attachment", subjectType: "alert", subjectId: alert.id, details: { assetId: alert.assetId, ...details } });
      return row;
    });
  } catch (e) {
    await store.delete(blobKey).catch(() => undefined);
    throw e;
  }
}

export async function listAttachments(actor: Actor, alertId: string): Promise<AlertAttachment[]> {
  assertCan(actor, "portfolio:read");
  const alert = await loadOwnAlert(actor, alertId);
  return listAlertAttachments(db(), alert.id);
}

/** The attachment and its bytes, for members of the alert's organisation only. */
export async function readAttachment(actor: Actor, alertId: string, attachmentId: string): Promise<{ attachment: AlertAttachment; bytes: Uint8Array }> {
  assertCan(actor, "portfolio:read");
  const alert = await loadOwnAlert(actor, alertId);
  const attachment = isUuid(attachmentId) ? await findAlertAttachment(db(), alert.id, attachmentId) : null;
  if (!attachment) throw new AppError("not_found", "No such attachment.");
  const bytes = await blobStore().get(attachment.blobKey);
  if (!bytes) throw new AppError("not_found", "The attachment's file is missing.");
  return { attachment, bytes };
}
