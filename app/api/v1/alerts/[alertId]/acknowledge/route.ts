import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { acknowledgeAlert } from "@/lib/services/alerts/alert.service";

export const dynamic = "force-dynamic";

/** `POST …/acknowledge` (inspector, engineer, admin) → `{ alert }`; 409 unless the alert is open. */
export const POST = defineRoute({ auth: "user", params: z.object({ alertId: z.uuid() }) }, async ({ actor, params }) =>
  json({ alert: await acknowledgeAlert(actor, params.alertId) }));
