import { z } from "zod";
import { defineRoute } from "@/lib/http/define-route";
import { driftViewCsv } from "@/lib/services/drift/drift-view-csv";
import { getDriftView } from "@/lib/services/drift/drift-view.service";
import { TrendsCsvQuery } from "@/lib/services/drift/schemas";

export const dynamic = "force-dynamic";

const Params = z.object({ assetId: z.uuid() });

/**
 * `GET …/trends.csv?chart=frequency|ewma|t2|damping|temperature[&from&to]` → the data of one
 * Trends chart as CSV (header row, ISO 8601 UTC times, every point: not thinned).
 */
export const GET = defineRoute({ auth: "user", params: Params, query: TrendsCsvQuery }, async ({ actor, params, query }) => {
  const view = await getDriftView(actor, params.assetId, { from: query.from, to: query.to }, { maxPointsPerMode: Number.POSITIVE_INFINITY });
  const day = (d: Date | undefined) => (d ? d.toISOString().slice(0, 10) : "all");
  const name = `trends-${query.chart}-${day(query.from)}-${day(query.to)}.csv`;
  return new Response(driftViewCsv(view, query.chart), {
    status: 200,
    headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${name}"`, "cache-control": "no-store" },
  });
});
