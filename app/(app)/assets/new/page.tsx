import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { connection } from "next/server";
import { can } from "@/lib/auth/permissions";
import { env } from "@/lib/config/env";
import { PageHeader, Panel } from "@/components/ui/panel";
import { AssetForm } from "../_components/asset-form";
import { createAssetAction } from "../actions";
import { pageActor } from "../../_lib/page-actor";

export const metadata: Metadata = { title: "New asset" };

export default async function NewAssetPage() {
  await connection();
  const actor = await pageActor();
  // The service refuses anyway; this only spares other roles a form they cannot submit.
  if (!can(actor.role, "asset:write")) redirect("/");
  return (
    <>
      <PageHeader title="New asset" eyebrow="Portfolio" />
      <Panel>
        <AssetForm action={createAssetAction} styleUrl={env().MAP_STYLE_URL} />
      </Panel>
    </>
  );
}
