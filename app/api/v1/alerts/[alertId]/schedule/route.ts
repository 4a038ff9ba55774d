import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { scheduleInspection } from "@/lib/services/alerts/alert.service";
import { ScheduleInspectionInput } from "@/lib/services/alerts/schemas";

export const dynamic = "force-dynamic";

/** `POST …/schedule` `{ at, note? }` (inspector, engineer, admin) → `{ alert }` in inspection_scheduled. */
export const POST = defineRoute({ auth: "user", params: z.object({ alertId: z.uuid() }), body: ScheduleInspectionInput }, async ({ actor, params, body }) =>
  json({ alert: await scheduleInspection(actor, params.alertId, body) }));
