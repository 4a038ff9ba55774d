import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { assignAlert } from "@/lib/services/alerts/alert.service";
import { AssignAlertInput } from "@/lib/services/alerts/schemas";

export const dynamic = "force-dynamic";

/** `POST …/assign` `{ userId }` (an inspector of the organisation) → `{ alert }`. */
export const POST = defineRoute({ auth: "user", params: z.object({ alertId: z.uuid() }), body: AssignAlertInput }, async ({ actor, params, body }) =>
  json({ alert: await assignAlert(actor, params.alertId, body) }));
