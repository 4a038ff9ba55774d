import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { UpdateAnalysisSettingsInput } from "@/lib/services/analysis/schemas";
import { getAnalysisSettings, updateAnalysisSettings } from "@/lib/services/analysis/settings.service";

export const dynamic = "force-dynamic";

const Params = z.object({ assetId: z.uuid() });

/** `GET …/settings` → `{ settings }` (current version, values and flat form fields). */
export const GET = defineRoute({ auth: "user", params: Params }, async ({ actor, params }) =>
  json({ settings: await getAnalysisSettings(actor, params.assetId) }));

/** `PUT …/settings` (engineer, admin) → `{ settings }`, the new version. */
export const PUT = defineRoute({ auth: "user", params: Params, body: UpdateAnalysisSettingsInput }, async ({ actor, params, body }) =>
  json({ settings: await updateAnalysisSettings(actor, params.assetId, body) }));
