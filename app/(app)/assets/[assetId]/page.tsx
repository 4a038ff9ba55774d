import type { Metadata } from "next";
import { connection } from "next/server";
import { can } from "@/lib/auth/permissions";
import { env } from "@/lib/config/env";
import { toAssetSummary } from "@/lib/domain/types";
import { getAsset, listChannels } from "@/lib/services/assets/asset.service";
import { listGateways } from "@/lib/services/assets/gateway.service";
import { getOrganisation } from "@/lib/services/accounts/profile.service";
import { ButtonLink } from "@/components/ui/button";
import { formatCoord, formatDateTime, KIND_LABELS } from "@/components/ui/format";
import { Panel } from "@/components/ui/panel";
import { CONDITION_STYLES } from "@/components/condition/conditions";
import { orNotFound } from "../../_lib/or-not-found";
import { AssetLocationMap } from "./_components/asset-location-map";
import { pageActor } from "../../_lib/page-actor";

export const metadata: Metadata = { title: "Asset" };

function Row({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="grid grid-cols-[10rem_1fr] gap-3 border-b border-line/70 py-2 text-sm last:border-0">
      <dt className="text-muted">{label}</dt>
      <dd className="min-w-0">{children}</dd>
    </div>
  );
}

/** Asset › Overview: what the asset is, where it is, how it is instrumented. */
export default async function AssetOverviewPage({ params }: { params: Promise<{ assetId: string }> }) {
  await connection();
  const { assetId } = await params;
  const actor = await pageActor();
  const [asset, channels, gateways, organisation] = await Promise.all([
    orNotFound(getAsset(actor, assetId)),
    orNotFound(listChannels(actor, assetId)),
    orNotFound(listGateways(actor, assetId)),
    getOrganisation(actor),
  ]);
  const tz = organisation.timeZone;
  const active = channels.filter((c) => c.active).length;
  const liveGateways = gateways.filter((g) => !g.revokedAt);
  const lastSeen = liveGateways.map((g) => g.lastSeenAt).filter((d): d is Date => d !== null).sort((a, b) => b.getTime() - a.getTime())[0] ?? null;
  const summary = toAssetSummary({ ...asset, channelCount: active, openAlertCount: 0 });

  return (
    <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
      <Panel
        title="Overview"
        actions={can(actor.role, "asset:write") ? <ButtonLink href={`/assets/${asset.id}/edit`} size="sm">Edit asset</ButtonLink> : null}
      >
        <dl>
          <Row label="Kind">{KIND_LABELS[asset.kind]}</Row>
          <Row label={asset.kind.endsWith("bridge") ? "Main span" : "Height"}>
            {asset.mainDimensionM === null ? "—" : `${asset.mainDimensionM} m`}
          </Row>
          <Row label="Material">{asset.material ?? "—"}</Row>
          <Row label="Location">{formatCoord(asset.latitude, asset.longitude)}</Row>
          <Row label="Condition">
            {CONDITION_STYLES[asset.condition].label}
            <span className="text-muted"> — {CONDITION_STYLES[asset.condition].description}</span>
          </Row>
          <Row label="Expected record interval">{asset.expectedIntervalMin} min</Row>
          <Row label="Sensor channels">
            {active} active{channels.length > active ? `, ${channels.length - active} inactive` : ""}
          </Row>
          <Row label="Gateways">
            {liveGateways.length} in service · last heard {lastSeen ? formatDateTime(lastSeen, tz) : "never"}
          </Row>
          <Row label="Registered">{formatDateTime(asset.createdAt, tz)}</Row>
          <Row label="Last changed">{formatDateTime(asset.updatedAt, tz)}</Row>
        </dl>
        <p className="mt-3 text-xs text-faint">Times in {tz}.</p>
      </Panel>
      <AssetLocationMap asset={summary} styleUrl={env().MAP_STYLE_URL} />
    </div>
  );
}
