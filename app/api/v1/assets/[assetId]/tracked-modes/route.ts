import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { CreateTrackedModeInput } from "@/lib/services/tracking/schemas";
import { createTrackedMode, listTrackedModes } from "@/lib/services/tracking/tracked-mode.service";

export const dynamic = "force-dynamic";

const Params = z.object({ assetId: z.uuid() });
const Query = z.object({ includeInactive: z.enum(["true", "false"]).optional() });

/** `GET …/tracked-modes[?includeInactive=true]` → `{ trackedModes }` with identification rates. */
export const GET = defineRoute({ auth: "user", params: Params, query: Query }, async ({ actor, params, query }) =>
  json({ trackedModes: await listTrackedModes(actor, params.assetId, { includeInactive: query.includeInactive === "true" }) }));

/** `POST …/tracked-modes` (engineer, admin) → `201 { trackedMode }`; a used label answers 409. */
export const POST = defineRoute({ auth: "user", params: Params, body: CreateTrackedModeInput }, async ({ actor, params, body }) =>
  json({ trackedMode: await createTrackedMode(actor, params.assetId, body) }, 201));
