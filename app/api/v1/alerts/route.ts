import { defineRoute, json } from "@/lib/http/define-route";
import { listAlerts } from "@/lib/services/alerts/alert.service";
import { ListAlertsQuery } from "@/lib/services/alerts/schemas";

export const dynamic = "force-dynamic";

/** `GET /api/v1/alerts[?assetId&state&assigneeUserId&limit]` → `{ alerts }`, not closed first, newest first. */
export const GET = defineRoute({ auth: "user", query: ListAlertsQuery }, async ({ actor, query }) =>
  json({ alerts: await listAlerts(actor, query) }));
