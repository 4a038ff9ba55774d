import { z } from "zod";
import { GATEWAY_KEY_PREFIX, bearerFrom } from "@/lib/auth/tokens";
import { defineRoute, json, type NextRouteContext } from "@/lib/http/define-route";
import { getRecordForActor, getRecordForDevice } from "@/lib/services/ingest/record.service";

export const dynamic = "force-dynamic";

const Params = z.object({ recordId: z.string().min(1) });

const forDevice = defineRoute({ auth: "device", params: Params }, async ({ device, params }) =>
  json(await getRecordForDevice(device, params.recordId)));

const forMember = defineRoute({ auth: "user", params: Params }, async ({ actor, params }) =>
  json(await getRecordForActor(actor, params.recordId)));

/**
 * `GET /api/v1/records/:recordId` → `{ record, analysis }`: to the gateway that sent it
 * (gateway key) or to a member of its organisation (session or personal token).
 */
export async function GET(req: Request, ctx?: NextRouteContext): Promise<Response> {
  const bearer = bearerFrom(req.headers.get("authorization"));
  return bearer?.startsWith(GATEWAY_KEY_PREFIX) ? forDevice(req, ctx) : forMember(req, ctx);
}
