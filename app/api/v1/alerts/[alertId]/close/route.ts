import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { closeAlert } from "@/lib/services/alerts/alert.service";
import { CloseAlertInput } from "@/lib/services/alerts/schemas";

export const dynamic = "force-dynamic";

/** `POST …/close` `{ outcome, findings }` (inspector, engineer, admin) → `{ alert }`; 409 when already closed. */
export const POST = defineRoute({ auth: "user", params: z.object({ alertId: z.uuid() }), body: CloseAlertInput }, async ({ actor, params, body }) =>
  json({ alert: await closeAlert(actor, params.alertId, body) }));
