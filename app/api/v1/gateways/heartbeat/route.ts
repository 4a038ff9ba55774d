import { defineRoute, json } from "@/lib/http/define-route";
import { recordHeartbeat } from "@/lib/services/ingest/heartbeat.service";
import { GatewayHeartbeatInput } from "@/lib/services/ingest/schemas";

export const dynamic = "force-dynamic";

/**
 * `POST /api/v1/gateways/heartbeat` with a gateway key, JSON `{ sentAt?, firmwareVersion? }`
 * → `{ heartbeat: { gatewayId, serverTime, clockOffsetMs, firmwareVersion } }`.
 */
export const POST = defineRoute({ auth: "device", body: GatewayHeartbeatInput }, async ({ device, body }) =>
  json({ heartbeat: await recordHeartbeat(device, body) }));
