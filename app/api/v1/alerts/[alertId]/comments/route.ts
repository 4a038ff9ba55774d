import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { commentOnAlert } from "@/lib/services/alerts/alert.service";
import { CommentAlertInput } from "@/lib/services/alerts/schemas";

export const dynamic = "force-dynamic";

/** `POST …/comments` `{ text }` (inspector, engineer, admin) → `201 { event }`. */
export const POST = defineRoute({ auth: "user", params: z.object({ alertId: z.uuid() }), body: CommentAlertInput }, async ({ actor, params, body }) =>
  json({ event: await commentOnAlert(actor, params.alertId, body) }, 201));
