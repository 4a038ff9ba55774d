import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { AppError } from "@/lib/http/errors";
import { ATTACHMENT_MAX_BYTES, addAlertAttachment, listAttachments } from "@/lib/services/alerts/attachment.service";

export const dynamic = "force-dynamic";

const Params = z.object({ alertId: z.uuid() });
/** Room for the multipart envelope around the largest accepted file. */
const ENVELOPE_BYTES = 64 * 1024;

/** `GET /api/v1/alerts/:alertId/attachments` → `{ attachments }` oldest first. */
export const GET = defineRoute({ auth: "user", params: Params }, async ({ actor, params }) =>
  json({ attachments: await listAttachments(actor, params.alertId) }));

/**
 * `POST /api/v1/alerts/:alertId/attachments`, `multipart/form-data` with part `file` (a JPEG,
 * PNG or WebP photo or a PDF, ≤ 10 MiB) → `201 { attachment }`; 413 too large, 415 another
 * type (decided from the content), 422 no file part.
 */
export const POST = defineRoute({ auth: "user", params: Params }, async ({ req, actor, params }) => {
  const length = Number(req.headers.get("content-length") ?? "0");
  if (length > ATTACHMENT_MAX_BYTES + ENVELOPE_BYTES) throw new AppError("payload_too_large", "The file is larger than the 10 MiB limit.");
  if (!/^multipart\/form-data\b/i.test(req.headers.get("content-type") ?? "")) {
    throw new AppError("unsupported_media_type", "Send the file as multipart/form-data with a part named file.");
  }
  let form: FormData;
  try {
    form = await req.formData();
  } catch {
    throw new AppError("bad_request", "The multipart body could not be read.");
  }
  const file = form.get("file");
  if (!(file instanceof Blob)) {
    throw new AppError("unprocessable", "Choose a file to attach.", { fieldErrors: { file: ["Choose a file to attach."] } });
  }
  const attachment = await addAlertAttachment(actor, params.alertId, {
    filename: file instanceof File ? file.name : "attachment", declaredType: file.type || null, bytes: new Uint8Array(await file.arrayBuffer()),
  });
  return json({ attachment: { ...attachment, blobKey: undefined } }, 201, { location: `/api/v1/alerts/${params.alertId}/attachments/${attachment.id}` });
});
