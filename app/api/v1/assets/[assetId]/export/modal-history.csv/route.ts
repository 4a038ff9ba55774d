import { z } from "zod";
import { defineRoute } from "@/lib/http/define-route";
import { exportModalHistory } from "@/lib/services/reports/export.service";
import { ExportRangeQuery } from "@/lib/services/reports/schemas";

export const dynamic = "force-dynamic";

const Params = z.object({ assetId: z.uuid() });

/**
 * `GET /api/v1/assets/:assetId/export/modal-history.csv[?from&to]` → every identified
 * frequency of the range (all history without a range) as CSV; the columns are described by
 * `…/export/data-dictionary`.
 */
export const GET = defineRoute({ auth: "user", params: Params, query: ExportRangeQuery }, async ({ actor, params, query }) => {
  const out = await exportModalHistory(actor, params.assetId, { from: query.from, to: query.to });
  return new Response(out.csv, {
    status: 200,
    headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${out.filename}"`, "cache-control": "no-store" },
  });
});
