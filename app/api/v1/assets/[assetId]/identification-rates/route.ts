import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { DEFAULT_RATE_PERIOD_DAYS, getIdentificationRates } from "@/lib/services/tracking/identification-rate.service";
import { IdentificationRatesQuery } from "@/lib/services/tracking/schemas";

export const dynamic = "force-dynamic";

const Params = z.object({ assetId: z.uuid() });
const DAY_MS = 86_400_000;

/**
 * `GET …/identification-rates[?from&to]` (everyone in the organisation) → the identification
 * rate of each tracked mode over records that started in [from, to), the count of identified
 * modes assigned to no tracked mode, and the period itself. Without `to` the period ends now;
 * without `from` it spans DEFAULT_RATE_PERIOD_DAYS (30) days before its end.
 */
export const GET = defineRoute({ auth: "user", params: Params, query: IdentificationRatesQuery }, async ({ actor, params, query }) => {
  const to = query.to ?? new Date();
  const from = query.from ?? new Date(to.getTime() - DEFAULT_RATE_PERIOD_DAYS * DAY_MS);
  const rates = await getIdentificationRates(actor, params.assetId, { from, to });
  return json({ identificationRates: rates });
});
