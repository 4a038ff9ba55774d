import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { reprocessRange } from "@/lib/services/analysis/reprocess.service";
import { ReprocessRangeInput } from "@/lib/services/analysis/schemas";

const Params = z.object({ assetId: z.uuid() });

/** `POST …/records/reprocess` `{ from, to }` (engineer, admin) → `202 { settingsVersion, queued, skipped }`. */
export const POST = defineRoute({ auth: "user", params: Params, body: ReprocessRangeInput }, async ({ actor, params, body }) =>
  json(await reprocessRange(actor, params.assetId, body), 202));
