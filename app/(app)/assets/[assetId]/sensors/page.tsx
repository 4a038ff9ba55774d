import type { Metadata } from "next";
import { connection } from "next/server";
import { can } from "@/lib/auth/permissions";
import { listChannels } from "@/lib/services/assets/asset.service";
import { Panel } from "@/components/ui/panel";
import { orNotFound } from "../../../_lib/or-not-found";
import { ChannelTable } from "./_components/channel-table";
import { pageActor } from "../../../_lib/page-actor";

export const metadata: Metadata = { title: "Sensors" };

/** Asset › Sensors: the channel layout, editable in place by engineers and admins. */
export default async function SensorsPage({ params }: { params: Promise<{ assetId: string }> }) {
  await connection();
  const { assetId } = await params;
  const actor = await pageActor();
  const channels = await orNotFound(listChannels(actor, assetId));
  return (
    <Panel title="Sensor channels" bodyClassName="p-0">
      <p className="px-3 pt-3 text-xs text-muted">
        Positions in metres in the asset&apos;s own frame. Codes are the column names gateways use in uploads and must be unique on the asset.
      </p>
      <ChannelTable assetId={assetId} channels={channels} canEdit={can(actor.role, "channel:write")} />
    </Panel>
  );
}
