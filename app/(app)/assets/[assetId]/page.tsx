import type { Metadata } from "next";
import { connection } from "next/server";
import { can } from "@/lib/auth/permissions";
import { env } from "@/lib/config/env";
import { toAssetSummary } from "@/lib/domain/types";
import { logUnknownError } from "@/lib/http/log";
import { getDriftView } from "@/lib/services/drift/drift-view.service";
import { OVERVIEW_CAUTION } from "@/lib/services/overview/caution";
import { describeCondition } from "@/lib/services/overview/condition-reason";
import { AVAILABILITY_DAYS, getAssetChanges, getAssetOverview } from "@/lib/services/overview/overview.service";
import { describeChannelIssues, localDay, startOfLocalDay } from "@/lib/services/overview/timeline";
import { getServiceabilityView } from "@/lib/services/serviceability/serviceability.service";
import { ServiceabilityPanel } from "@/components/serviceability/serviceability-panel";
import { Notice } from "@/components/ui/notice";
import { orNotFound } from "../../_lib/or-not-found";
import { pageActor } from "../../_lib/page-actor";
import { AssetLocationMap } from "./_components/asset-location-map";
import { AvailabilityPanel } from "./_components/overview/availability-panel";
import { ChangesPanel } from "./_components/overview/changes-panel";
import { ConditionPanel } from "./_components/overview/condition-panel";
import { FactsPanel } from "./_components/overview/facts-panel";
import { GatewaysPanel, OpenAlertsPanel } from "./_components/overview/gateways-alerts";
import { ModeTable, type ModeRow } from "./_components/overview/mode-table";

export const metadata: Metadata = { title: "Asset" };

const DAY_MS = 86_400_000;
/** Default start of "what changed", days before today. */
const CHANGES_DEFAULT_DAYS = 30;

const isDay = (s: unknown): s is string => typeof s === "string" && /^\d{4}-\d{2}-\d{2}$/.test(s) && !Number.isNaN(Date.parse(s));

/**
 * Asset › Overview (every role): the condition and why, the caution, each tracked mode
 * against its baseline, data availability, gateways, open alerts and what changed since a
 * date; the facts and the location map. Drift statistics come from getDriftView.
 */
export default async function AssetOverviewPage({
  params, searchParams,
}: { params: Promise<{ assetId: string }>; searchParams: Promise<{ since?: string | string[] }> }) {
  await connection();
  const [{ assetId }, sp] = await Promise.all([params, searchParams]);
  const actor = await pageActor();
  const now = new Date();
  const overview = await orNotFound(getAssetOverview(actor, assetId, { now }));
  const { asset, timeZone: tz, availability } = overview;
  const since = isDay(sp.since) ? sp.since : localDay(new Date(now.getTime() - CHANGES_DEFAULT_DAYS * DAY_MS), tz);
  const [view, changes, serviceability] = await Promise.all([
    orNotFound(getDriftView(actor, asset.id, {}, { maxPointsPerMode: 10, nowMs: now.getTime() })),
    orNotFound(getAssetChanges(actor, asset.id, startOfLocalDay(since, tz))),
    // The serviceability indication is secondary here: a failure shows a notice, not an error page.
    getServiceabilityView(actor, asset.id, { days: AVAILABILITY_DAYS, now }).catch((e: unknown) => ({ failed: logUnknownError(e, { assetId: asset.id, section: "overview-serviceability" }) })),
  ]);

  const reason = describeCondition(view, {
    condition: asset.condition, openAlerts: overview.openAlerts, lastAcceptedAt: overview.lastAcceptedAt,
    expectedIntervalMin: asset.expectedIntervalMin, now,
  });
  const rates = new Map(availability.identification.map((r) => [r.trackedModeId, r]));
  const shown = new Set(view.modes.map((m) => m.trackedModeId));
  const modeRows: ModeRow[] = [
    ...view.modes.map((m, j) => ({
      number: j + 1, label: m.label, nominalHz: m.nominalHz, latest: m.latest,
      beyond: m.daily.length > 0 && m.daily[m.daily.length - 1].beyond,
      identified: rates.get(m.trackedModeId)?.identified ?? 0, analysed: rates.get(m.trackedModeId)?.analysed ?? 0,
    })),
    // Active tracked modes outside the baseline (added since the fit): identification only.
    ...availability.identification.filter((r) => r.active && !shown.has(r.trackedModeId)).map((r, k) => ({
      number: view.modes.length + k + 1, label: `${r.label}, not in the baseline`, nominalHz: r.nominalFrequencyHz, latest: null,
      beyond: false, identified: r.identified, analysed: r.analysed,
    })),
  ];
  const lastT2 = view.t2.length > 0 ? view.t2[view.t2.length - 1] : null;
  const active = overview.channels.filter((c) => c.active).length;
  const summary = toAssetSummary({ ...asset, channelCount: active, openAlertCount: overview.openAlerts.length });

  const channelIssues = describeChannelIssues(availability.channels);

  return (
    <div className="space-y-5" data-testid="asset-overview">
      <div className="grid gap-5 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <ConditionPanel
          condition={asset.condition}
          sentences={reason.sentences}
          caution={OVERVIEW_CAUTION}
          dataIssues={channelIssues}
          note={view.baseline ? `Baseline version ${view.baseline.version}, trained on ${view.baseline.trainingFrom.toISOString().slice(0, 10)} to ${view.baseline.trainingTo.toISOString().slice(0, 10)}.` : null}
        />
        <FactsPanel asset={asset} canEdit={can(actor.role, "asset:write")} activeChannels={active} inactiveChannels={overview.channels.length - active} timeZone={tz} />
      </div>

      <ModeTable rows={modeRows} t2={lastT2} timeZone={tz} windowDays={AVAILABILITY_DAYS} hasBaseline={view.baseline !== null} />

      {/* ── Serviceability (issue 6 §2): H5's ServiceabilityPanel, compact, over the availability window. ── */}
      <div data-testid="serviceability-slot">
        {"failed" in serviceability
          ? <Notice tone="error">The serviceability indication could not be computed (ref {serviceability.failed}).</Notice>
          : <ServiceabilityPanel view={serviceability} periodLabel={`last ${AVAILABILITY_DAYS} days`} compact />}
      </div>

      <div className="grid gap-5 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <AvailabilityPanel
          days={availability.days}
          counts={availability.recordsPerDay}
          expectedPerDay={availability.expectedPerDay}
          channels={availability.channels}
          issues={channelIssues}
        />
        <div className="min-w-0 space-y-5">
          <OpenAlertsPanel alerts={overview.openAlerts} timeZone={tz} />
          <GatewaysPanel gateways={overview.gateways} timeZone={tz} expectedIntervalMin={asset.expectedIntervalMin} now={now} />
          <AssetLocationMap asset={summary} styleUrl={env().MAP_STYLE_URL} />
        </div>
      </div>

      <ChangesPanel items={changes} since={since} timeZone={tz} action={`/assets/${asset.id}`} />
      <p className="text-xs text-faint">Times in {tz}.</p>
    </div>
  );
}
