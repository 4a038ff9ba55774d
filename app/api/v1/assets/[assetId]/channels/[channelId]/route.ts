import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { deactivateChannel, updateChannel } from "@/lib/services/assets/asset.service";
import { UpdateChannelInput } from "@/lib/services/assets/schemas";

const Params = z.object({ assetId: z.uuid(), channelId: z.uuid() });

/** `PATCH /api/v1/assets/:assetId/channels/:channelId` (engineer, admin) → `{ channel }`. */
export const PATCH = defineRoute({ auth: "user", params: Params, body: UpdateChannelInput }, async ({ actor, params, body }) => {
  return json({ channel: await updateChannel(actor, params.assetId, params.channelId, body) });
});

/** `DELETE …/channels/:channelId` deactivates the channel (records keep referring to it) → `{ channel }`. */
export const DELETE = defineRoute({ auth: "user", params: Params }, async ({ actor, params }) => {
  return json({ channel: await deactivateChannel(actor, params.assetId, params.channelId) });
});
