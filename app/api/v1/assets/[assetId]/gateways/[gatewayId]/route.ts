import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { toGatewayJson } from "@/lib/domain/types";
import { revokeGateway } from "@/lib/services/assets/gateway.service";

const Params = z.object({ assetId: z.uuid(), gatewayId: z.uuid() });

/** `DELETE …/gateways/:gatewayId` (admin) revokes the gateway's key → `{ gateway }`. */
export const DELETE = defineRoute({ auth: "user", params: Params }, async ({ actor, params }) => {
  return json({ gateway: toGatewayJson(await revokeGateway(actor, params.assetId, params.gatewayId)) });
});
