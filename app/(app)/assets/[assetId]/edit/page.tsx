import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { connection } from "next/server";
import { can } from "@/lib/auth/permissions";
import { env } from "@/lib/config/env";
import { toAssetJson } from "@/lib/domain/types";
import { getAsset } from "@/lib/services/assets/asset.service";
import { Panel } from "@/components/ui/panel";
import { orNotFound } from "../../../_lib/or-not-found";
import { AssetForm } from "../../_components/asset-form";
import { updateAssetAction } from "../../actions";
import { pageActor } from "../../../_lib/page-actor";

export const metadata: Metadata = { title: "Edit asset" };

export default async function EditAssetPage({ params }: { params: Promise<{ assetId: string }> }) {
  await connection();
  const { assetId } = await params;
  const actor = await pageActor();
  const asset = await orNotFound(getAsset(actor, assetId));
  if (!can(actor.role, "asset:write")) redirect(`/assets/${asset.id}`);
  return (
    <Panel title="Edit asset">
      <AssetForm action={updateAssetAction} asset={toAssetJson(asset)} styleUrl={env().MAP_STYLE_URL} />
    </Panel>
  );
}
