import { defineRoute, json } from "@/lib/http/define-route";
import { toRecordJson } from "@/lib/domain/records";
import { ingestRecord } from "@/lib/services/ingest/ingest.service";
import { RateLimitedError } from "@/lib/services/ingest/rate-limit";

export const dynamic = "force-dynamic";

/**
 * `POST /api/v1/records` with a gateway key, multipart parts `meta` and `data` (the upload
 * contract in the README): `202 { record }` queued, `200 { record }` the same record again;
 * errors as `{ error: { code, message, details } }`, `429` with Retry-After.
 */
export const POST = defineRoute({ auth: "device" }, async ({ req, device }) => {
  const length = req.headers.get("content-length");
  try {
    const { outcome, record } = await ingestRecord(device, {
      body: req.body, contentType: req.headers.get("content-type"), contentLength: length === null ? null : Number(length),
    });
    return json({ record: toRecordJson(record) }, outcome === "queued" ? 202 : 200, { location: `/api/v1/records/${record.id}` });
  } catch (e) {
    if (e instanceof RateLimitedError) {
      return json({ error: { code: e.code, message: e.message, details: e.details ?? {} } }, 429, { "retry-after": String(e.retryAfterS) });
    }
    throw e;
  }
});
