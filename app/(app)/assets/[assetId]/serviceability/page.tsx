import type { Metadata } from "next";
import Link from "next/link";
import { connection } from "next/server";
import { can } from "@/lib/auth/permissions";
import { FOOTBRIDGE_DAMPING_MATERIALS, TOWER_DAMPING_TYPES } from "@/lib/serviceability/damping-guidance";
import { getServiceabilityView } from "@/lib/services/serviceability/serviceability.service";
import { PERIOD_DAYS } from "@/lib/services/serviceability/schemas";
import { ServiceabilityPanel } from "@/components/serviceability/serviceability-panel";
import { mps } from "@/components/serviceability/format";
import { Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { cx } from "@/components/ui/cx";
import { formatDateTime } from "@/components/ui/format";
import { orNotFound } from "../../../_lib/or-not-found";
import { pageActor } from "../../../_lib/page-actor";
import { AssetInputsForm } from "./_components/asset-inputs-form";
import { OverrideTable } from "./_components/override-table";

export const metadata: Metadata = { title: "Serviceability" };

const CLASS_TEXT = {
  lock_in_candidate: "possible lock-in", in_band_unknown_response: "in band, no response levels", in_band_broadband: "in band, broad-band response", outside_band: "outside band",
} as const;

/** Asset › Serviceability: measured modes, damping and accelerations against code and guidance values. */
export default async function ServiceabilityPage({ params, searchParams }: {
  params: Promise<{ assetId: string }>; searchParams: Promise<{ days?: string }>;
}) {
  await connection();
  const { assetId } = await params;
  const { days: daysParam } = await searchParams;
  const days = PERIOD_DAYS.find((d) => String(d) === daysParam) ?? 30;
  const actor = await pageActor();
  const view = await orNotFound(getServiceabilityView(actor, assetId, { days }));
  const canEdit = can(actor.role, "settings:write");
  const guidanceOptions = view.family === "tower"
    ? TOWER_DAMPING_TYPES.map((t) => ({ value: t.key, label: `${t.label} (δs ${t.logDecrement})` }))
    : FOOTBRIDGE_DAMPING_MATERIALS.map((m) => ({ value: m.key, label: m.label }));
  return (
    <div data-testid="serviceability-page">
      <div className="mb-3 flex flex-wrap items-center gap-2 text-sm">
        <span className="text-muted">Period:</span>
        {PERIOD_DAYS.map((d) => (
          <Link key={d} href={`?days=${d}`} className={cx("rounded px-2 py-0.5", d === days ? "bg-accent text-white" : "text-accent hover:bg-accent-soft")}>
            {d} days
          </Link>
        ))}
        <span className="ml-auto"><Link href={`/assets/${assetId}/design`} className="text-accent hover:underline">Design comparison →</Link></span>
      </div>
      <ServiceabilityPanel view={view} periodLabel={`last ${days} days`} />
      {view.vortex && view.vortex.episodes.length ? (
        <Panel title="Records with wind near v_crit" className="mb-4" bodyClassName="p-0">
          <Table>
            <thead><tr><Th>Record start</Th><Th>Wind</Th><Th>Mode (v_crit)</Th><Th>Crest factor</Th><Th>Reading</Th></tr></thead>
            <tbody>
              {view.vortex.episodes.map((e) => (
                <tr key={`${e.recordId}-${e.modeLabel}`} data-testid="lock-in-episode" data-class={e.classification}>
                  <Td><Link className="text-accent hover:underline" href={`/assets/${assetId}/records/${e.recordId}`}>{formatDateTime(new Date(e.atMs))}</Link></Td>
                  <Td>{mps(e.windSpeedMps)}</Td><Td>{e.modeLabel} ({mps(e.vCritMps)})</Td><Td>{e.crestFactor?.toFixed(2) ?? "—"}</Td><Td>{CLASS_TEXT[e.classification]}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
        </Panel>
      ) : null}
      {view.family !== "other" ? (
        <Panel title="Inputs of this asset" className="mb-4">
          {canEdit ? (
            <AssetInputsForm assetId={assetId} isTower={view.family === "tower"} sectionWidthM={view.settings.sectionWidthM}
              guidanceKey={view.settings.dampingGuidanceKey} guidanceOptions={guidanceOptions} />
          ) : (
            <p className="text-sm text-muted">
              {view.family === "tower" ? `Section width: ${view.settings.sectionWidthM ?? "not set"} m. ` : ""}
              Damping guidance: {view.dampingGuidance?.label}. Engineers and admins change these.
            </p>
          )}
          <p className="mt-2 text-xs text-muted">Mode directions come from a linked design mode, else the label&apos;s words, else the reference shape; set one on the design page to correct it.</p>
        </Panel>
      ) : null}
      <Panel title="Values in force for the organisation" bodyClassName="p-0">
        <p className="px-3 pt-3 text-xs text-muted">Recommended values with their sources; a national annex or the owner&apos;s procedure may set others for the whole organisation.</p>
        <OverrideTable assetId={assetId} table={view.values.table} canEdit={canEdit} />
      </Panel>
    </div>
  );
}
