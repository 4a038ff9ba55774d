import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { reprocessRecord } from "@/lib/services/analysis/reprocess.service";

const Params = z.object({ assetId: z.uuid(), recordId: z.uuid() });

/** `POST …/records/:recordId/reprocess` (engineer, admin) → `202 { recordId, settingsVersion, jobId, added }`. */
export const POST = defineRoute({ auth: "user", params: Params }, async ({ actor, params }) =>
  json(await reprocessRecord(actor, params.assetId, params.recordId), 202));
