import { z } from "zod";
import { defineRoute } from "@/lib/http/define-route";
import { readAttachment } from "@/lib/services/alerts/attachment.service";

export const dynamic = "force-dynamic";

/**
 * `GET /api/v1/alerts/:alertId/attachments/:attachmentId` → the file with its sniffed
 * content type, to members of the alert's organisation only (others 404). Images show
 * inline; PDFs too, with the stored name for saving.
 */
export const GET = defineRoute({ auth: "user", params: z.object({ alertId: z.uuid(), attachmentId: z.uuid() }) }, async ({ actor, params }) => {
  const { attachment, bytes } = await readAttachment(actor, params.alertId, params.attachmentId);
  const ascii = attachment.filename.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return new Response(new Blob([new Uint8Array(bytes)]), {
    status: 200,
    headers: {
      "content-type": attachment.contentType,
      "content-length": String(bytes.length),
      "content-disposition": `inline; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(attachment.filename)}`,
      "cache-control": "private, max-age=300",
      "x-content-type-options": "nosniff",
    },
  });
});
