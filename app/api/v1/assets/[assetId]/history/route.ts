import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { AppError } from "@/lib/http/errors";
import { importModalHistory } from "@/lib/services/drift/history-import.service";

export const dynamic = "force-dynamic";

const Params = z.object({ assetId: z.uuid() });
const Query = z.object({ preview: z.enum(["1", "true", "0", "false"]).optional() });
/** Largest history file accepted, bytes. */
const MAX_BYTES = 16 * 1024 * 1024;

async function csvOf(req: Request): Promise<string> {
  const length = Number(req.headers.get("content-length") ?? "0");
  if (length > MAX_BYTES) throw new AppError("payload_too_large", `The file is larger than ${MAX_BYTES} bytes.`);
  const type = (req.headers.get("content-type") ?? "").toLowerCase();
  let text: string;
  if (type.startsWith("multipart/form-data")) {
    const form = await req.formData().catch(() => { throw new AppError("bad_request", "The multipart body does not parse."); });
    const file = form.get("file");
    if (file === null) throw new AppError("unprocessable", "Attach the CSV as the part 'file'.", { fieldErrors: { file: ["Choose a CSV file."] } });
    text = typeof file === "string" ? file : await file.text();
  } else if (type.startsWith("text/csv") || type.startsWith("text/plain")) {
    text = await req.text();
  } else {
    throw new AppError("unsupported_media_type", "Send the history as text/csv or multipart/form-data with a part 'file'.");
  }
  if (text.length > MAX_BYTES) throw new AppError("payload_too_large", `The file is larger than ${MAX_BYTES} bytes.`);
  return text;
}

/**
 * `POST …/history[?preview=1]` (engineer, admin): a CSV of modal estimates
 * (`timestamp,mode,frequencyHz,dampingRatio,temperatureC`) as text/csv or multipart part
 * `file`. → `201 { import }` (`200` for a preview or a file imported before);
 * `422 { details.rows: [{ line, reason }] }` when any row is bad (nothing imported).
 */
export const POST = defineRoute({ auth: "user", params: Params, query: Query }, async ({ req, actor, params, query }) => {
  const preview = query.preview === "1" || query.preview === "true";
  const summary = await importModalHistory(actor, params.assetId, await csvOf(req), { preview });
  return json({ import: summary }, !preview && summary.imported > 0 ? 201 : 200);
});
