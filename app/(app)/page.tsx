import type { Metadata } from "next";
import { connection } from "next/server";
import { can } from "@/lib/auth/permissions";
import { env } from "@/lib/config/env";
import { getOrganisation } from "@/lib/services/accounts/profile.service";
import { getNeedsAttention } from "@/lib/services/overview/overview.service";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/panel";
import { PortfolioView } from "./_components/portfolio/portfolio-view";
import { pageActor } from "./_lib/page-actor";

export const metadata: Metadata = { title: "Portfolio" };

/**
 * Portfolio: counts by condition, filters, map, asset table and the "needs attention" list.
 * The asset list is fetched by the client from /api/v1/assets (refreshed every minute); the
 * needs-attention list is read here through the overview service.
 */
export default async function PortfolioPage() {
  await connection();
  const actor = await pageActor();
  const [attention, organisation] = await Promise.all([getNeedsAttention(actor), getOrganisation(actor)]);
  return (
    <>
      <PageHeader
        title="Portfolio"
        actions={can(actor.role, "asset:write") ? <ButtonLink href="/assets/new" variant="primary">New asset</ButtonLink> : null}
      >
        Every monitored asset and its current condition.
      </PageHeader>
      <PortfolioView styleUrl={env().MAP_STYLE_URL} attention={attention} timeZone={organisation.timeZone} />
    </>
  );
}
