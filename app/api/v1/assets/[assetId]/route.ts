import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { toAssetJson } from "@/lib/domain/types";
import { getAsset, updateAsset } from "@/lib/services/assets/asset.service";
import { UpdateAssetInput } from "@/lib/services/assets/schemas";

const Params = z.object({ assetId: z.uuid() });

/** `GET /api/v1/assets/:assetId` → `{ asset }`. */
export const GET = defineRoute({ auth: "user", params: Params }, async ({ actor, params }) => {
  return json({ asset: toAssetJson(await getAsset(actor, params.assetId)) });
});

/** `PATCH /api/v1/assets/:assetId` (engineer, admin): any subset of the asset's fields → `{ asset }`. */
export const PATCH = defineRoute({ auth: "user", params: Params, body: UpdateAssetInput }, async ({ actor, params, body }) => {
  return json({ asset: toAssetJson(await updateAsset(actor, params.assetId, body)) });
});
