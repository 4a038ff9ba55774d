import { z } from "zod";
import { defineRoute } from "@/lib/http/define-route";
import { dataDictionary } from "@/lib/reports/modal-history-csv";
import { getAsset } from "@/lib/services/assets/asset.service";
import { DictionaryQuery } from "@/lib/services/reports/schemas";

export const dynamic = "force-dynamic";

const Params = z.object({ assetId: z.uuid() });

/**
 * `GET /api/v1/assets/:assetId/export/data-dictionary[?format=md|csv]` → the meaning, unit
 * and source of each column of modal-history.csv (Markdown by default). Same access as the
 * export (the asset must be readable).
 */
export const GET = defineRoute({ auth: "user", params: Params, query: DictionaryQuery }, async ({ actor, params, query }) => {
  await getAsset(actor, params.assetId);
  const csv = query.format === "csv";
  return new Response(dataDictionary(query.format), {
    status: 200,
    headers: {
      "content-type": csv ? "text/csv; charset=utf-8" : "text/markdown; charset=utf-8",
      "content-disposition": `inline; filename="modal-history-dictionary.${csv ? "csv" : "md"}"`,
      "cache-control": "no-store",
    },
  });
});
