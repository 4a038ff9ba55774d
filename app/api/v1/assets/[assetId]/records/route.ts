import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { listRecords } from "@/lib/services/analysis/records.service";
import { ListRecordsQuery } from "@/lib/services/analysis/schemas";
import { toRecordPageView } from "@/app/(app)/assets/[assetId]/records/_lib/views";

export const dynamic = "force-dynamic";

const Params = z.object({ assetId: z.uuid() });

/**
 * `GET /api/v1/assets/:assetId/records?status&from&to&cursor&limit` → `{ records, nextCursor }`:
 * one page of the asset's records, newest first (keyset cursor), each with its status,
 * progress and the latest analysis summary (quality verdict, modes found). Polled by the
 * Records screen; any member of the organisation.
 */
export const GET = defineRoute({ auth: "user", params: Params, query: ListRecordsQuery }, async ({ actor, params, query }) => {
  return json(toRecordPageView(await listRecords(actor, params.assetId, query)));
});
