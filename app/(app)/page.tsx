import type { Metadata } from "next";
import { connection } from "next/server";
import { can } from "@/lib/auth/permissions";
import { env } from "@/lib/config/env";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/panel";
import { PortfolioView } from "./_components/portfolio/portfolio-view";
import { pageActor } from "./_lib/page-actor";

export const metadata: Metadata = { title: "Portfolio" };

/** Portfolio: map and asset table. The asset list itself is fetched by the client from /api/v1/assets. */
export default async function PortfolioPage() {
  await connection();
  const actor = await pageActor();
  return (
    <>
      <PageHeader
        title="Portfolio"
        actions={can(actor.role, "asset:write") ? <ButtonLink href="/assets/new" variant="primary">New asset</ButtonLink> : null}
      >
        Every monitored asset and its current condition.
      </PageHeader>
      <PortfolioView styleUrl={env().MAP_STYLE_URL} />
    </>
  );
}
