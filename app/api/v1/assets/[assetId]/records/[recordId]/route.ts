import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { getRecordDetail } from "@/lib/services/analysis/records.service";

export const dynamic = "force-dynamic";

const Params = z.object({ assetId: z.uuid(), recordId: z.uuid() });
const Query = z.object({
  version: z.preprocess((v) => (v === undefined || v === "" ? undefined : Number(v)),
    z.number({ error: "version must be a number." }).int().positive("version must be ≥ 1.").optional()),
});

/** `GET /api/v1/assets/:assetId/records/:recordId[?version=n]` → the record with its newest (or version n) result. */
export const GET = defineRoute({ auth: "user", params: Params, query: Query }, async ({ actor, params, query }) =>
  json(await getRecordDetail(actor, params.assetId, params.recordId, { settingsVersion: query.version })));
