import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { getDriftView } from "@/lib/services/drift/drift-view.service";
import { TrendsRangeQuery } from "@/lib/services/drift/schemas";

export const dynamic = "force-dynamic";

const Params = z.object({ assetId: z.uuid() });

/**
 * `GET …/trends[?from&to]` (everyone in the organisation) → the drift view of the asset
 * (lib/services/drift/drift-view.service.ts documents its shape): per tracked mode the
 * frequencies with the baseline prediction band, daily EWMA with limits, damping with
 * advisory limits, the smallest detectable shift; T² with its UCL; alerts. Pure read.
 */
export const GET = defineRoute({ auth: "user", params: Params, query: TrendsRangeQuery }, async ({ actor, params, query }) =>
  json(await getDriftView(actor, params.assetId, { from: query.from, to: query.to })));
