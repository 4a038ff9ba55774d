import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { toGatewayJson } from "@/lib/domain/types";
import { createGateway, listGateways } from "@/lib/services/assets/gateway.service";
import { CreateGatewayInput } from "@/lib/services/assets/schemas";

const Params = z.object({ assetId: z.uuid() });

/** `GET /api/v1/assets/:assetId/gateways` → `{ gateways }` (never the keys). */
export const GET = defineRoute({ auth: "user", params: Params }, async ({ actor, params }) => {
  return json({ gateways: (await listGateways(actor, params.assetId)).map(toGatewayJson) });
});

/** `POST …/gateways` (admin) → `201 { gateway, key }`: the device key is shown this once. */
export const POST = defineRoute({ auth: "user", params: Params, body: CreateGatewayInput }, async ({ actor, params, body }) => {
  const { gateway, key } = await createGateway(actor, params.assetId, body);
  return json({ gateway: toGatewayJson(gateway), key }, 201);
});
