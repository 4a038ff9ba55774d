import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { getAlert } from "@/lib/services/alerts/alert.service";

export const dynamic = "force-dynamic";

/** `GET /api/v1/alerts/:alertId` → `{ alert, events }` (events oldest first). */
export const GET = defineRoute({ auth: "user", params: z.object({ alertId: z.uuid() }) }, async ({ actor, params }) =>
  json(await getAlert(actor, params.alertId)));
