import { defineRoute, json } from "@/lib/http/define-route";
import { toAssetJson, toAssetSummary } from "@/lib/domain/types";
import { createAsset, listAssets } from "@/lib/services/assets/asset.service";
import { CreateAssetInput } from "@/lib/services/assets/schemas";

/** `GET /api/v1/assets` → `{ assets: AssetSummary[] }` (the Portfolio's data). */
export const GET = defineRoute({ auth: "user" }, async ({ actor }) => {
  const assets = await listAssets(actor);
  return json({ assets: assets.map(toAssetSummary) });
});

/** `POST /api/v1/assets` (engineer, admin) → `201 { asset }`. */
export const POST = defineRoute({ auth: "user", body: CreateAssetInput }, async ({ actor, body }) => {
  const asset = await createAsset(actor, body);
  return json({ asset: toAssetJson(asset) }, 201);
});
