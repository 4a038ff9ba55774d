import Link from "next/link";
import { connection } from "next/server";
import type { ReactNode } from "react";
import { getAsset } from "@/lib/services/assets/asset.service";
import { ConditionBadge } from "@/components/condition/condition-badge";
import { KIND_LABELS } from "@/components/ui/format";
import { orNotFound } from "../../_lib/or-not-found";
import { AssetTabs } from "./_components/asset-tabs";
import { pageActor } from "../../_lib/page-actor";

/** Asset header and section links; each section page loads its own data through services. */
export default async function AssetLayout({ children, params }: { children: ReactNode; params: Promise<{ assetId: string }> }) {
  await connection();
  const { assetId } = await params;
  const actor = await pageActor();
  const asset = await orNotFound(getAsset(actor, assetId));
  return (
    <div>
      <div className="mb-1 text-xs text-muted">
        <Link href="/" className="hover:text-accent hover:underline">
          Portfolio
        </Link>{" "}
        / Asset
      </div>
      <div className="mb-4 flex flex-wrap items-center gap-x-4 gap-y-1">
        <h1 className="text-xl font-semibold tracking-tight" data-testid="asset-name">
          {asset.name}
        </h1>
        <ConditionBadge condition={asset.condition} />
        <span className="text-sm text-muted">
          {KIND_LABELS[asset.kind]}
          {asset.mainDimensionM !== null ? ` · ${asset.mainDimensionM} m` : ""}
        </span>
      </div>
      <AssetTabs assetId={asset.id} />
      {children}
    </div>
  );
}
