import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { renderAssetReport } from "@/lib/services/reports/report-pdf.service";
import { defaultPeriod, getAssetReport } from "@/lib/services/reports/report.service";
import { ReportQuery } from "@/lib/services/reports/schemas";

export const dynamic = "force-dynamic";

const Params = z.object({ assetId: z.uuid() });

/**
 * `GET /api/v1/assets/:assetId/report[?from&to&format=pdf|json]` → the asset report of the
 * period (`to` exclusive; default the last 30 days) as a PDF download, or its data as JSON.
 */
export const GET = defineRoute({ auth: "user", params: Params, query: ReportQuery }, async ({ actor, params, query }) => {
  const to = query.to ?? new Date();
  const from = query.from ?? defaultPeriod(to.getTime()).from;
  if (query.format === "json") return json({ report: await getAssetReport(actor, params.assetId, { from, to }) });
  const r = await renderAssetReport(actor, params.assetId, { from, to });
  return new Response(new Uint8Array(r.pdf), {
    status: 200,
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `attachment; filename="${r.filename}"`,
      "cache-control": "no-store",
    },
  });
});
