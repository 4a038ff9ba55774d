import { defineRoute, json } from "@/lib/http/define-route";
import { describeGatewaySelf } from "@/lib/services/ingest/gateway-info.service";

export const dynamic = "force-dynamic";

/** `GET /api/v1/gateways/me` with a gateway key → its asset, active channels and tracked modes. */
export const GET = defineRoute({ auth: "device" }, async ({ device }) => json(await describeGatewaySelf(device)));
