import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { UpdateTrackedModeInput } from "@/lib/services/tracking/schemas";
import { deleteTrackedMode, updateTrackedMode } from "@/lib/services/tracking/tracked-mode.service";

const Params = z.object({ assetId: z.uuid(), trackedModeId: z.uuid() });

/** `PATCH …/tracked-modes/:id` (engineer, admin) → `{ trackedMode }`. */
export const PATCH = defineRoute({ auth: "user", params: Params, body: UpdateTrackedModeInput }, async ({ actor, params, body }) =>
  json({ trackedMode: await updateTrackedMode(actor, params.assetId, params.trackedModeId, body) }));

/** `DELETE …/tracked-modes/:id` (engineer, admin) → `{ trackedMode }` deactivated; its history stays. */
export const DELETE = defineRoute({ auth: "user", params: Params }, async ({ actor, params }) =>
  json({ trackedMode: await deleteTrackedMode(actor, params.assetId, params.trackedModeId) }));
