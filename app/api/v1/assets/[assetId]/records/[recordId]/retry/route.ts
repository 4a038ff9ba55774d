import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { retryFailedRecord } from "@/lib/services/analysis/reprocess.service";

const Params = z.object({ assetId: z.uuid(), recordId: z.uuid() });

/** `POST …/records/:recordId/retry` (engineer, admin) → `202`; 409 unless the record is `failed`. */
export const POST = defineRoute({ auth: "user", params: Params }, async ({ actor, params }) =>
  json(await retryFailedRecord(actor, params.assetId, params.recordId), 202));
