import type { Metadata } from "next";
import { connection } from "next/server";
import { can } from "@/lib/auth/permissions";
import { toGatewayJson } from "@/lib/domain/types";
import { listGateways } from "@/lib/services/assets/gateway.service";
import { getOrganisation } from "@/lib/services/accounts/profile.service";
import { Panel } from "@/components/ui/panel";
import { orNotFound } from "../../../_lib/or-not-found";
import { GatewayList } from "./_components/gateway-list";
import { pageActor } from "../../../_lib/page-actor";

export const metadata: Metadata = { title: "Gateways" };

/** Asset › Gateways: devices that upload records for this asset; admins create and revoke keys. */
export default async function GatewaysPage({ params }: { params: Promise<{ assetId: string }> }) {
  await connection();
  const { assetId } = await params;
  const actor = await pageActor();
  const [gateways, organisation] = await Promise.all([orNotFound(listGateways(actor, assetId)), getOrganisation(actor)]);
  return (
    <Panel title="Gateways" bodyClassName="p-0">
      <GatewayList
        assetId={assetId}
        gateways={gateways.map(toGatewayJson)}
        canEdit={can(actor.role, "gateway:write")}
        timeZone={organisation.timeZone}
      />
    </Panel>
  );
}
