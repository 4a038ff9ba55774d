import type { Metadata } from "next";
import Link from "next/link";
import { connection } from "next/server";
import { can } from "@/lib/auth/permissions";
import { DEFAULT_MATCH_BAND_FRACTION } from "@/lib/serviceability/design-compare";
import { listChannels } from "@/lib/services/assets/asset.service";
import { getDesignComparison } from "@/lib/services/design/design.service";
import { Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { orNotFound } from "../../../_lib/or-not-found";
import { pageActor } from "../../../_lib/page-actor";
import { DesignModeForm } from "./_components/design-mode-form";
import { DesignModeList } from "./_components/design-mode-list";
import { toDesignModeJson } from "./_components/types";

export const metadata: Metadata = { title: "Design comparison" };

const FLAG_TEXT = {
  no_measured_mode: "no tracked mode matches", no_design_mode: "no design mode", not_identified_in_period: "not identified in the period",
} as const;

const hz = (v: number | null) => (v === null ? "—" : `${v.toFixed(3)} Hz`);

/** Asset › Design: design/FE frequencies (and shapes) against the measured tracked modes. */
export default async function DesignPage({ params }: { params: Promise<{ assetId: string }> }) {
  await connection();
  const { assetId } = await params;
  const actor = await pageActor();
  const [cmp, channels] = await orNotFound(Promise.all([getDesignComparison(actor, assetId), listChannels(actor, assetId)]));
  const canEdit = can(actor.role, "mode:write");
  const channelCodes = channels.filter((c) => c.active && c.quantity === "acceleration").map((c) => c.code);
  const trackedOptions = cmp.trackedModes.map((t) => ({ value: t.id, label: `${t.label} (${t.nominalFrequencyHz.toFixed(2)} Hz)` }));
  return (
    <div className="space-y-4" data-testid="design-page">
      <Panel title={`Design against measured — last ${cmp.periodDays} days`} bodyClassName="p-0"
        actions={<Link href={`/assets/${assetId}/serviceability`} className="text-sm text-accent hover:underline">Serviceability →</Link>}>
        <p className="px-3 pt-3 text-xs text-muted">
          Measured: median (and latest) identified frequency of the matched tracked mode over the period. A design mode is matched to the tracked mode
          it is linked to, else to the unlinked tracked mode of nearest nominal frequency within ±{Math.round(DEFAULT_MATCH_BAND_FRACTION * 100)} %.
          MAC over the channels both shapes give (median measured shape).
        </p>
        {cmp.rows.length === 0 ? <p className="p-3 text-sm text-muted">No design or tracked modes yet.</p> : (
          <Table>
            <thead><tr><Th>Design mode</Th><Th>Design</Th><Th>Tracked mode</Th><Th>Measured median</Th><Th>Latest</Th><Th>Measured / design</Th><Th>MAC</Th><Th>Note</Th></tr></thead>
            <tbody>
              {cmp.rows.map((r) => (
                <tr key={`${r.design?.id ?? "-"}:${r.tracked?.id ?? "-"}`} data-testid="comparison-row" data-flag={r.flag ?? ""}>
                  <Td>{r.design?.label ?? <span className="text-faint">—</span>}</Td>
                  <Td>{hz(r.design?.frequencyHz ?? null)}</Td>
                  <Td>{r.tracked ? <>{r.tracked.label}{r.matchedBy ? <span className="text-xs text-faint"> ({r.matchedBy === "link" ? "linked" : "nearest"})</span> : null}</> : <span className="text-faint">—</span>}</Td>
                  <Td>{hz(r.measuredMedianHz)}{r.identifications ? <span className="text-xs text-faint"> · n = {r.identifications}</span> : null}</Td>
                  <Td>{hz(r.measuredLatestHz)}</Td>
                  <Td data-testid="comparison-ratio" className="font-medium">{r.ratio === null ? "—" : r.ratio.toFixed(3)}</Td>
                  <Td>{r.mac === null ? "—" : r.mac.toFixed(3)}</Td>
                  <Td>{r.flag ? <span className="rounded bg-sunken px-1.5 py-0.5 text-xs text-muted">{FLAG_TEXT[r.flag]}</span> : null}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
        )}
      </Panel>
      <Panel title="Design modes" bodyClassName="p-0">
        <DesignModeList assetId={assetId} modes={cmp.designModes.map(toDesignModeJson)} channels={channelCodes} trackedOptions={trackedOptions} canEdit={canEdit} />
        {canEdit ? (
          <div className="border-t border-line p-4">
            <DesignModeForm assetId={assetId} channels={channelCodes} trackedOptions={trackedOptions} />
          </div>
        ) : <p className="px-3 pb-3 text-xs text-muted">Engineers and admins enter design modes.</p>}
      </Panel>
    </div>
  );
}
