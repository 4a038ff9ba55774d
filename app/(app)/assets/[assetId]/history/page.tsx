import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { connection } from "next/server";
import { Panel } from "@/components/ui/panel";
import { can } from "@/lib/auth/permissions";
import { getAsset } from "@/lib/services/assets/asset.service";
import { orNotFound } from "../../../_lib/or-not-found";
import { pageActor } from "../../../_lib/page-actor";
import { HistoryImport } from "./_components/history-import";

export const metadata: Metadata = { title: "History import" };

/**
 * Asset › History import (issue 5 §1, engineers and admins): a CSV of modal estimates from an
 * earlier monitoring system or a consultant, previewed before it is imported; all or nothing.
 */
export default async function HistoryPage({ params }: { params: Promise<{ assetId: string }> }) {
  await connection();
  const { assetId } = await params;
  const actor = await pageActor();
  const asset = await orNotFound(getAsset(actor, assetId));
  if (!can(actor.role, "baseline:write")) redirect(`/assets/${asset.id}/trends`);
  return (
    <div className="space-y-4">
      <Panel title="Import a modal history">
        <div className="mb-4 space-y-1 text-sm text-muted">
          <p>
            One row per mode estimate, with the header <code className="rounded bg-sunken px-1">timestamp,mode,frequencyHz,dampingRatio,temperatureC</code>:
            times in ISO 8601 UTC (e.g. 2025-01-01T06:00:00Z), frequency in Hz, damping as a fraction (0.012, not 1.2 %), temperature in °C;
            damping and temperature may be empty (rows without a temperature are not used by the drift statistics).
          </p>
          <p>
            A mode label unknown on this asset creates a tracked mode. Nothing is imported from a file with any bad row, and the
            same file imported again changes nothing.
          </p>
        </div>
        <HistoryImport assetId={asset.id} />
      </Panel>
    </div>
  );
}
