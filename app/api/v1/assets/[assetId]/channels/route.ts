import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { addChannel, listChannels } from "@/lib/services/assets/asset.service";
import { ChannelInput } from "@/lib/services/assets/schemas";

const Params = z.object({ assetId: z.uuid() });

/** `GET /api/v1/assets/:assetId/channels` → `{ channels }` (active first, by code). */
export const GET = defineRoute({ auth: "user", params: Params }, async ({ actor, params }) => {
  return json({ channels: await listChannels(actor, params.assetId) });
});

/** `POST /api/v1/assets/:assetId/channels` (engineer, admin) → `201 { channel }`; a used code answers 409. */
export const POST = defineRoute({ auth: "user", params: Params, body: ChannelInput }, async ({ actor, params, body }) => {
  return json({ channel: await addChannel(actor, params.assetId, body) }, 201);
});
