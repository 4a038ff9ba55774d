import type { Asset } from "@/lib/domain/types";
import { ButtonLink } from "@/components/ui/button";
import { formatCoord, formatDateTime, KIND_LABELS } from "@/components/ui/format";
import { Panel } from "@/components/ui/panel";

function Row({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="grid grid-cols-[9.5rem_1fr] gap-3 border-b border-line/70 py-1.5 text-sm last:border-0">
      <dt className="text-muted">{label}</dt>
      <dd className="min-w-0">{children}</dd>
    </div>
  );
}

/** What the asset is and how it is instrumented (the Overview's facts), with the edit button for writers. */
export function FactsPanel({
  asset, canEdit, activeChannels, inactiveChannels, timeZone,
}: { asset: Asset; canEdit: boolean; activeChannels: number; inactiveChannels: number; timeZone: string }) {
  return (
    <Panel title="Asset" actions={canEdit ? <ButtonLink href={`/assets/${asset.id}/edit`} size="sm">Edit asset</ButtonLink> : null}>
      <dl data-testid="asset-facts">
        <Row label="Kind">{KIND_LABELS[asset.kind]}</Row>
        <Row label={asset.kind.endsWith("bridge") ? "Main span" : "Height"}>
          {asset.mainDimensionM === null ? "—" : `${asset.mainDimensionM} m`}
        </Row>
        <Row label="Material">{asset.material ?? "—"}</Row>
        <Row label="Location">{formatCoord(asset.latitude, asset.longitude)}</Row>
        <Row label="Expected interval">{asset.expectedIntervalMin} min between records</Row>
        <Row label="Sensor channels">
          {activeChannels} active{inactiveChannels > 0 ? `, ${inactiveChannels} out of service` : ""}
        </Row>
        <Row label="Registered">{formatDateTime(asset.createdAt, timeZone)}</Row>
        <Row label="Last changed">{formatDateTime(asset.updatedAt, timeZone)}</Row>
      </dl>
    </Panel>
  );
}
